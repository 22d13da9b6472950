// `npm start`: installs what is missing, starts the private MariaDB and the fake S3 object store,
// migrates and seeds, builds the client when its sources changed, serves app + API on 127.0.0.1
// (the app runs the fake SMTP server). Ctrl-C, or SIGINT/SIGTERM to this process alone, stops all of it. `npm run dev` serves the client
// from Vite's dev server instead, with the API behind it.
import { existsSync, readFileSync, writeFileSync, mkdirSync, statSync, readdirSync } from 'node:fs';
import { join } from 'node:path';
import { randomBytes } from 'node:crypto';
import { ensureDebianPackages, ensureNodeModules, root, run } from './lib/system.mjs';

const dev = process.argv.includes('--dev');
const started = Date.now();

ensureNodeModules();
ensureDebianPackages({ mariadbd: 'mariadb-server' });

const { startMariaDB } = await import('./lib/mariadb.mjs');
const { databases } = await import('./lib/databases.mjs');
const { startChild, onStop, stopAll, waitForHttp, waitForExit } = await import('./lib/processes.mjs');
const { choosePorts } = await import('./lib/ports.mjs');
const { startS3Fake } = await import('./lib/s3-fake.mjs');

const host = process.env.SHEDWRIGHT_HOST ?? '127.0.0.1';

try {
  // Every port is a setting; a default that is taken moves to the next free one (lib/ports.mjs).
  const ports = await choosePorts([
    { variable: 'SHEDWRIGHT_PORT', fallback: 4780, what: 'the app' },
    { variable: 'SHEDWRIGHT_DB_PORT', fallback: 4781, what: 'MariaDB' },
    { variable: 'SHEDWRIGHT_SMTP_PORT', fallback: 4782, what: 'the fake SMTP server' },
    { variable: 'SHEDWRIGHT_S3_PORT', fallback: 4783, what: 'the fake S3 object store' },
    ...(dev ? [{ variable: 'SHEDWRIGHT_DEV_PORT', fallback: 5173, what: "Vite's dev server" }] : []),
  ], process.env, host);
  const port = ports.SHEDWRIGHT_PORT;
  const devPort = ports.SHEDWRIGHT_DEV_PORT;
  const publicUrl = process.env.SHEDWRIGHT_PUBLIC_URL ?? `http://${host}:${dev ? devPort : port}`;

  const db = await startMariaDB({ ...databases.app, port: ports.SHEDWRIGHT_DB_PORT, dir: join(root, databases.app.dir) });
  onStop(() => db.stop());
  const s3 = await startS3Fake({ port: ports.SHEDWRIGHT_S3_PORT, dir: join(root, '.data', 's3'), bucket: 'shedwright' });
  onStop(() => s3.stop());

  const env = {
    ...process.env,
    ...db.env,
    ...s3.env,
    SHEDWRIGHT_HOST: host,
    SHEDWRIGHT_PORT: String(port),
    SHEDWRIGHT_SMTP_PORT: String(ports.SHEDWRIGHT_SMTP_PORT),
    SHEDWRIGHT_PUBLIC_URL: publicUrl,
    SHEDWRIGHT_SESSION_SECRET: sessionSecret(),
    SHEDWRIGHT_STATIC_DIR: join(root, 'dist'),
    ...(dev ? { SHEDWRIGHT_DEV: '1' } : {}),
  };

  run(process.execPath, ['--import', 'tsx', 'server/db/setup.ts'], { env });
  if (!dev && clientIsStale()) run(join(root, 'node_modules/.bin/vite'), ['build', '--logLevel', 'warn'], { env });

  const server = startChild(process.execPath, ['--import', 'tsx', 'server/index.ts'], { env, cwd: root });
  await waitForHttp(`http://${host}:${port}/api/session`, server);
  let vite = null;
  if (dev) {
    vite = startChild(join(root, 'node_modules/.bin/vite'), ['--port', String(devPort), '--strictPort'], { env, cwd: root });
  }

  console.log('');
  console.log(`Shedwright is running at ${publicUrl}  (ready in ${((Date.now() - started) / 1000).toFixed(1)} s)`);
  if (dev) console.log(`  API server at http://${host}:${port}; captured mails at ${publicUrl}/admin/mails`);
  console.log('Demo sign-ins:');
  run(process.execPath, ['--import', 'tsx', 'server/db/setup.ts', '--print-accounts'], { env });
  console.log('Press Ctrl-C to stop the server, its database, mail and object store.');

  const code = await Promise.race([waitForExit(server), ...(vite ? [waitForExit(vite)] : [])]);
  await stopAll();
  console.log('Shedwright stopped.');
  process.exit(code);
} catch (err) {
  console.error(`\nShedwright could not start: ${err.message}`);
  await stopAll();
  process.exit(1);
}

function sessionSecret() {
  if (process.env.SHEDWRIGHT_SESSION_SECRET) return process.env.SHEDWRIGHT_SESSION_SECRET;
  const file = join(root, '.data', 'session-secret');
  mkdirSync(join(root, '.data'), { recursive: true });
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString('base64url'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

/** True when dist/ is missing or older than anything the client is built from. */
function clientIsStale() {
  const built = join(root, 'dist', 'index.html');
  if (!existsSync(built)) return true;
  const builtAt = statSync(built).mtimeMs;
  const sources = ['index.html', 'vite.config.ts', 'package-lock.json', 'src', 'shared'];
  return sources.some((s) => newestMtime(join(root, s)) > builtAt);
}

function newestMtime(path) {
  const st = statSync(path, { throwIfNoEntry: false });
  if (!st) return 0;
  if (!st.isDirectory()) return st.mtimeMs;
  return Math.max(st.mtimeMs, ...readdirSync(path).map((name) => newestMtime(join(path, name))));
}
