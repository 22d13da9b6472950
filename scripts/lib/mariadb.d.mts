// Types for mariadb.mjs, so the TypeScript tests can start private instances.
export interface MariaDB {
  socket: string;
  env: {
    SHEDWRIGHT_DB_HOST: string;
    SHEDWRIGHT_DB_PORT: string;
    SHEDWRIGHT_DB_NAME: string;
    SHEDWRIGHT_DB_USER: string;
    SHEDWRIGHT_DB_PASSWORD: string;
  };
  /** Runs SQL as root over the socket. */
  sql(text: string): string;
  stop(): Promise<void>;
}
export function startMariaDB(options: { dir: string; port: number; database: string; user: string }): Promise<MariaDB>;
