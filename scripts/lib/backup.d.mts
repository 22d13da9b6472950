// Types for backup.mjs, so the TypeScript tests can import it.
export interface Connection { host: string; port: number; user: string; password: string; database: string }
export interface ManifestFile { path: string; bytes: number; sha256: string }
export interface Manifest {
  format: 1;
  createdAt: string;
  database: string;
  migrations: string[];
  counts: { drafts: number; versions: number; attachments: number };
  files: ManifestFile[];
}
export const MANIFEST: string;
export function connectionFromEnv(env: Record<string, string | undefined>): Connection;
export function serverAnswers(conn: Connection): boolean;
export function timestampName(date?: Date): string;
export function backup(options: { conn: Connection; attachmentsDir: string; target: string; now?: Date }): Promise<Manifest>;
export function verifyBackup(dir: string): Manifest;
export function restore(options: { conn: Connection; attachmentsDir: string; source: string; overwrite?: boolean }): Promise<Manifest>;
export function openAppDatabase(root: string): Promise<{ conn: Connection; attachmentsDir: string; startedHere: boolean; close(): Promise<void> }>;
