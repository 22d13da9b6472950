// Backups of one Shedwright database and the objects (photos) in its S3 bucket, and restoring them.
// Used by `npm run backup`, `npm run restore` and tests/server/backup.test.ts.
import { spawn, spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { createReadStream, createWriteStream, existsSync, mkdirSync, readdirSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { dirname, join, relative, sep } from 'node:path';
import { createInterface } from 'node:readline';
import { pipeline } from 'node:stream/promises';
import {
  DeleteObjectsCommand, GetObjectCommand, ListObjectsV2Command, PutObjectCommand, S3Client,
} from '@aws-sdk/client-s3';
import { databases } from './databases.mjs';
import { startMariaDB } from './mariadb.mjs';
import { isFree } from './ports.mjs';
import { startS3Fake } from './s3-fake.mjs';

/**
 * @typedef {{ host: string, port: number, user: string, password: string, database: string }} Connection
 * @typedef {{ path: string, bytes: number, sha256: string }} ManifestFile
 * @typedef {{
 *   format: 1,
 *   createdAt: string,
 *   database: string,
 *   migrations: string[],
 *   counts: { drafts: number, versions: number, attachments: number },
 *   files: ManifestFile[],
 * }} Manifest
 * @typedef {{ endpoint: string, region: string, bucket: string, accessKeyId: string, secretAccessKey: string }} Bucket
 */

export const MANIFEST = 'manifest.json';
const DUMP = 'database.sql';
/** Tables whose rows the manifest counts, by the manifest's name for them. */
const COUNTED = { drafts: 'drafts', draft_versions: 'versions', attachments: 'attachments' };
const ATTACHMENTS = 'attachments';

/** The connection the SHEDWRIGHT_DB_* variables describe (as startMariaDB's `env` or the server reads them). */
export function connectionFromEnv(env) {
  return {
    host: env.SHEDWRIGHT_DB_HOST || '127.0.0.1',
    port: Number(env.SHEDWRIGHT_DB_PORT),
    user: env.SHEDWRIGHT_DB_USER,
    password: env.SHEDWRIGHT_DB_PASSWORD ?? '',
    database: env.SHEDWRIGHT_DB_NAME,
  };
}

/** The bucket the SHEDWRIGHT_S3_* variables describe (as the server reads them). */
export function bucketFromEnv(env) {
  return {
    endpoint: env.SHEDWRIGHT_S3_ENDPOINT || `http://127.0.0.1:${env.SHEDWRIGHT_S3_PORT || 4783}`,
    region: env.SHEDWRIGHT_S3_REGION || 'us-east-1',
    bucket: env.SHEDWRIGHT_S3_BUCKET || 'shedwright',
    accessKeyId: env.SHEDWRIGHT_S3_ACCESS_KEY_ID || 'S3RVER',
    secretAccessKey: env.SHEDWRIGHT_S3_SECRET_ACCESS_KEY || 'S3RVER',
  };
}

/** An S3 client for the bucket, set up as the server's (server/storage/s3.ts). */
function s3Client(bucket) {
  return new S3Client({
    endpoint: bucket.endpoint, region: bucket.region, forcePathStyle: true,
    credentials: { accessKeyId: bucket.accessKeyId, secretAccessKey: bucket.secretAccessKey },
    requestChecksumCalculation: 'WHEN_REQUIRED', responseChecksumValidation: 'WHEN_REQUIRED',
  });
}

/** Every object key in the bucket, sorted. */
async function keysIn(client, bucket) {
  const keys = [];
  let token;
  do {
    const page = await client.send(new ListObjectsV2Command({ Bucket: bucket.bucket, ContinuationToken: token }));
    for (const o of page.Contents ?? []) keys.push(o.Key);
    token = page.IsTruncated ? page.NextContinuationToken : undefined;
  } while (token);
  return keys.sort();
}

/** True when a MariaDB server answers on the connection's host and port (credentials not needed). */
export function serverAnswers(conn) {
  // mariadb-admin ping exits 0 whenever the server is up, even when the login is refused.
  const r = spawnSync('mariadb-admin', ['--no-defaults', `--host=${conn.host}`, `--port=${conn.port}`, '--connect-timeout=2', 'ping'], { stdio: 'ignore' });
  return r.status === 0;
}

// The password travels in MYSQL_PWD, not on the command line where `ps` shows it to everyone.
const clientArgs = (conn) => ['--no-defaults', `--host=${conn.host}`, `--port=${conn.port}`, `--user=${conn.user}`, '--default-character-set=utf8mb4'];
const clientEnv = (conn) => ({ ...process.env, MYSQL_PWD: conn.password });

/** Runs SQL as the application user; returns the rows as tab-separated lines without headers. */
function query(conn, sql) {
  const r = spawnSync('mariadb', [...clientArgs(conn), '--batch', '--skip-column-names', conn.database],
    { input: sql, encoding: 'utf8', env: clientEnv(conn), maxBuffer: 64 * 1024 * 1024 });
  if (r.status !== 0) throw new Error(`SQL on ${conn.database} failed: ${r.stderr.trim()}`);
  return r.stdout.split('\n').filter((line) => line !== '');
}

function waitForChild(child, what) {
  let stderr = '';
  child.stderr.on('data', (d) => { stderr += d; });
  return new Promise((resolve, reject) => {
    child.on('error', reject);
    child.on('close', (code) => (code === 0 ? resolve() : reject(new Error(`${what} exited with ${code}: ${stderr.trim()}`))));
  });
}

function sha256(path) {
  return createHash('sha256').update(readFileSync(path)).digest('hex');
}

/** Every file under dir, as paths relative to it with forward slashes, sorted. */
function filesUnder(dir) {
  if (!existsSync(dir)) return [];
  const out = [];
  const walk = (d) => {
    for (const entry of readdirSync(d, { withFileTypes: true })) {
      const path = join(d, entry.name);
      if (entry.isDirectory()) walk(path);
      else if (entry.isFile()) out.push(relative(dir, path).split(sep).join('/'));
    }
  };
  walk(dir);
  return out.sort();
}

/**
 * Reads the migrations and row counts from the dump itself, so the manifest describes exactly the
 * snapshot that was dumped even while the app keeps writing. Needs --skip-extended-insert: one row per
 * INSERT line (mariadb-dump escapes newlines inside values as \n).
 */
async function describeDump(path) {
  const counts = { drafts: 0, versions: 0, attachments: 0 };
  const migrations = [];
  for await (const line of createInterface({ input: createReadStream(path, 'utf8'), crlfDelay: Infinity })) {
    const insert = /^INSERT INTO `([^`]+)` VALUES \(/.exec(line);
    if (!insert) continue;
    const table = insert[1];
    if (table in COUNTED) counts[COUNTED[table]] += 1;
    if (table === 'schema_migrations') {
      const name = /^INSERT INTO `schema_migrations` VALUES \('((?:[^'\\]|\\.)*)'\);$/.exec(line);
      if (!name) throw new Error(`Unexpected schema_migrations row in the dump: ${line.slice(0, 200)}`);
      migrations.push(name[1]);
    }
  }
  return { counts, migrations };
}

/** A folder name that sorts by time and is valid on every file system: 2025-03-01T14-05-09Z. */
export function timestampName(date = new Date()) {
  return date.toISOString().replace(/\.\d+Z$/, 'Z').replaceAll(':', '-');
}

/**
 * Dumps the database (one consistent snapshot: --single-transaction), then copies every object of the
 * bucket into `target`/attachments/<key> (`target` is created; it must not exist yet), then writes
 * manifest.json with the time, the migrations applied, the counts of drafts, versions and attachments,
 * and the sha256 of every file. Objects are copied after the dump, so every photo the dump names is
 * there (one uploaded meanwhile comes along unnamed, which is harmless).
 * @param {{ conn: Connection, bucket: Bucket, target: string, now?: Date }} options
 * @returns {Promise<Manifest>}
 */
export async function backup({ conn, bucket, target, now = new Date() }) {
  if (existsSync(target)) throw new Error(`${target} already exists; a backup is written to a new folder.`);
  mkdirSync(target, { recursive: true });
  try {
    const dumpPath = join(target, DUMP);
    const dump = spawn('mariadb-dump', [...clientArgs(conn), '--single-transaction', '--routines', '--triggers',
      '--skip-extended-insert', '--no-autocommit', '--hex-blob', conn.database], { env: clientEnv(conn), stdio: ['ignore', 'pipe', 'pipe'] });
    await Promise.all([pipeline(dump.stdout, createWriteStream(dumpPath, { mode: 0o600 })), waitForChild(dump, 'mariadb-dump')]);

    const client = s3Client(bucket);
    try {
      for (const key of await keysIn(client, bucket)) {
        const path = join(target, ATTACHMENTS, ...key.split('/'));
        mkdirSync(dirname(path), { recursive: true });
        const object = await client.send(new GetObjectCommand({ Bucket: bucket.bucket, Key: key }));
        writeFileSync(path, await object.Body.transformToByteArray(), { mode: 0o600 });
      }
    } finally {
      client.destroy();
    }
    const { counts, migrations } = await describeDump(dumpPath);
    const files = filesUnder(target).map((path) => ({ path, bytes: statSync(join(target, path)).size, sha256: sha256(join(target, path)) }));
    /** @type {Manifest} */
    const manifest = { format: 1, createdAt: now.toISOString(), database: conn.database, migrations, counts, files };
    writeFileSync(join(target, MANIFEST), `${JSON.stringify(manifest, null, 2)}\n`, { mode: 0o600 });
    return manifest;
  } catch (err) {
    // A half-written folder must never be mistaken for a backup.
    rmSync(target, { recursive: true, force: true });
    throw err;
  }
}

/**
 * Checks a backup folder against its manifest: every listed file present with its size and sha256,
 * and no file that the manifest does not list. Returns the manifest, or throws naming every problem.
 * @param {string} dir
 * @returns {Manifest}
 */
export function verifyBackup(dir) {
  const manifestPath = join(dir, MANIFEST);
  if (!existsSync(manifestPath)) throw new Error(`${dir} has no ${MANIFEST}; it is not a Shedwright backup.`);
  /** @type {Manifest} */
  let manifest;
  try {
    manifest = JSON.parse(readFileSync(manifestPath, 'utf8'));
  } catch (err) {
    throw new Error(`${manifestPath} is not valid JSON: ${err.message}`);
  }
  if (manifest?.format !== 1 || !Array.isArray(manifest.files)) throw new Error(`${manifestPath} is not a format 1 backup manifest.`);
  const problems = [];
  const listed = new Set(manifest.files.map((f) => f.path));
  if (!listed.has(DUMP)) problems.push(`the manifest lists no ${DUMP}`);
  for (const f of manifest.files) {
    const path = join(dir, f.path);
    if (!existsSync(path)) problems.push(`${f.path} is missing`);
    else if (statSync(path).size !== f.bytes) problems.push(`${f.path} has ${statSync(path).size} bytes, the manifest says ${f.bytes}`);
    else if (sha256(path) !== f.sha256) problems.push(`${f.path} does not match its sha256`);
  }
  for (const path of filesUnder(dir)) if (path !== MANIFEST && !listed.has(path)) problems.push(`${path} is not in the manifest`);
  if (problems.length > 0) throw new Error(`The backup in ${dir} does not verify: ${problems.join('; ')}.`);
  return manifest;
}

/** Tables and views in the connection's database. */
function tablesOf(conn) {
  return query(conn, 'SELECT TABLE_NAME, TABLE_TYPE FROM information_schema.TABLES WHERE TABLE_SCHEMA = DATABASE();')
    .map((line) => { const [name, type] = line.split('\t'); return { name, view: type === 'VIEW' }; });
}

const quoteName = (name) => `\`${name.replaceAll('`', '``')}\``;

/** Rows in the counted tables (0 for a table an older schema does not have). */
function countRows(conn) {
  const present = new Set(tablesOf(conn).map((t) => t.name));
  const counts = { drafts: 0, versions: 0, attachments: 0 };
  for (const [table, key] of Object.entries(COUNTED)) {
    if (present.has(table)) counts[key] = Number(query(conn, `SELECT COUNT(*) FROM ${quoteName(table)};`)[0]);
  }
  return counts;
}

/**
 * Restores a verified backup into the connection's database and the bucket. A database with tables,
 * or a bucket with objects, is replaced only when `overwrite` is true (otherwise this throws before
 * changing anything). Afterwards the restored counts are checked against the manifest.
 * @param {{ conn: Connection, bucket: Bucket, source: string, overwrite?: boolean }} options
 * @returns {Promise<Manifest>}
 */
export async function restore({ conn, bucket, source, overwrite = false }) {
  const manifest = verifyBackup(source);
  const existing = tablesOf(conn);
  const client = s3Client(bucket);
  try {
    const existingKeys = await keysIn(client, bucket);
    if (!overwrite && (existing.length > 0 || existingKeys.length > 0)) {
      throw new Error(`${conn.database} has ${existing.length} tables and the bucket ${bucket.bucket} has ${existingKeys.length} objects; `
        + 'restoring replaces them. Run again with --yes to overwrite.');
    }
    await restoreDatabase(conn, source, existing);
    // The bucket ends up holding exactly the backup's objects.
    for (let i = 0; i < existingKeys.length; i += 1000) {
      const batch = existingKeys.slice(i, i + 1000).map((Key) => ({ Key }));
      await client.send(new DeleteObjectsCommand({ Bucket: bucket.bucket, Delete: { Objects: batch, Quiet: true } }));
    }
    const saved = join(source, ATTACHMENTS);
    for (const key of filesUnder(saved)) {
      await client.send(new PutObjectCommand({ Bucket: bucket.bucket, Key: key, Body: readFileSync(join(saved, ...key.split('/'))) }));
    }
  } finally {
    client.destroy();
  }

  const restored = countRows(conn);
  const { counts } = manifest;
  if (Object.keys(counts).some((k) => restored[k] !== counts[k])) {
    throw new Error(`Restored ${JSON.stringify(restored)} rows; the manifest says ${JSON.stringify(counts)}.`);
  }
  return manifest;
}

/** Replaces the database's tables with the dump's. */
async function restoreDatabase(conn, source, existing) {
  // Dropping everything first keeps tables a newer schema added from surviving next to the old ones.
  const drops = [
    ...existing.filter((t) => t.view).map((t) => `DROP VIEW IF EXISTS ${quoteName(t.name)};`),
    ...existing.filter((t) => !t.view).map((t) => `DROP TABLE IF EXISTS ${quoteName(t.name)};`),
  ];
  const client = spawn('mariadb', [...clientArgs(conn), conn.database], { env: clientEnv(conn), stdio: ['pipe', 'ignore', 'pipe'] });
  const done = waitForChild(client, 'mariadb');
  client.stdin.write(`SET FOREIGN_KEY_CHECKS=0;\n${drops.join('\n')}\nSET FOREIGN_KEY_CHECKS=1;\n`);
  await Promise.all([pipeline(createReadStream(join(source, DUMP)), client.stdin), done]);
}

/**
 * The `npm start` instance (.data/db) and its object store (the fake in .data/s3), for the backup and
 * restore commands. What is not running is started for the command and `close()` stops it again;
 * what is running (the app may be serving) is left alone.
 * @param {string} root the project folder
 * @returns {Promise<{ conn: Connection, bucket: Bucket, startedHere: boolean, close(): Promise<void> }>}
 */
export async function openAppDatabase(root) {
  const { dir, port, database, user } = databases.app;
  const conn = { host: '127.0.0.1', port, user, database, password: '' };
  const stops = [];
  let bucket = bucketFromEnv(process.env);
  const s3Port = Number(process.env.SHEDWRIGHT_S3_PORT || 4783);
  if (!process.env.SHEDWRIGHT_S3_ENDPOINT && (await isFree(s3Port))) {
    const s3 = await startS3Fake({ port: s3Port, dir: join(root, '.data', 's3'), bucket: bucket.bucket });
    bucket = bucketFromEnv({ ...process.env, ...s3.env });
    stops.push(() => s3.stop());
  }
  const close = async () => { for (const stop of stops.reverse()) await stop(); };
  if (serverAnswers(conn)) {
    const passwordFile = join(root, dir, 'app-password');
    if (!existsSync(passwordFile)) throw new Error(`A server answers on port ${port} but ${passwordFile} is missing.`);
    return { conn: { ...conn, password: readFileSync(passwordFile, 'utf8').trim() }, bucket, startedHere: stops.length > 0, close };
  }
  const db = await startMariaDB({ dir: join(root, dir), port, database, user });
  stops.push(() => db.stop());
  return { conn: connectionFromEnv(db.env), bucket, startedHere: true, close };
}
