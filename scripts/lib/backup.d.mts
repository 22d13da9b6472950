// Types for backup.mjs, so the TypeScript tests can import it.
export interface Connection { host: string; port: number; user: string; password: string; database: string }
export interface Bucket { endpoint: string; region: string; bucket: string; accessKeyId: string; secretAccessKey: string }
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
export function bucketFromEnv(env: Record<string, string | undefined>): Bucket;
export function serverAnswers(conn: Connection): boolean;
export function timestampName(date?: Date): string;
export function backup(options: { conn: Connection; bucket: Bucket; target: string; now?: Date }): Promise<Manifest>;
export function verifyBackup(dir: string): Manifest;
export function restore(options: { conn: Connection; bucket: Bucket; source: string; overwrite?: boolean }): Promise<Manifest>;
export function openAppDatabase(root: string): Promise<{ conn: Connection; bucket: Bucket; startedHere: boolean; close(): Promise<void> }>;
