// A private MariaDB instance whose data lives under the project (never the system service).
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readdirSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { randomBytes } from 'node:crypto';
import { join } from 'node:path';
import { userInfo } from 'node:os';

const sleep = (ms) => new Promise((r) => setTimeout(r, ms));

/**
 * Starts (initialising once) a MariaDB server on 127.0.0.1:port with its data in dir.
 * Resolves to the connection settings and a stop() that shuts the server down cleanly.
 * NOTE: --no-defaults must come first on every MariaDB command, or Debian's /etc/mysql config
 * moves the socket and pid file.
 */
export async function startMariaDB({ dir, port, database, user }) {
  mkdirSync(dir, { recursive: true });
  const dataDir = join(dir, 'data');
  // Unix sockets allow ~107 characters: keep it short and out of deep project paths.
  const socket = `/tmp/shedwright-${port}.sock`;
  const pidFile = join(dir, 'mariadb.pid');
  const logFile = join(dir, 'mariadb.err');
  const me = userInfo().username;

  if (!existsSync(join(dataDir, 'mysql'))) {
    const r = spawnSync('mariadb-install-db', ['--no-defaults', `--datadir=${dataDir}`, `--user=${me}`,
      '--auth-root-authentication-method=normal', '--skip-test-db', '--skip-name-resolve'], { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`mariadb-install-db failed:\n${r.stdout}\n${r.stderr}`);
  }

  if (await ping(socket)) {
    throw new Error(`A MariaDB server already answers on ${socket}; stop it first (pid file ${pidFile}).`);
  }
  const child = spawn('mariadbd', ['--no-defaults', `--datadir=${dataDir}`, `--socket=${socket}`,
    `--pid-file=${pidFile}`, `--log-error=${logFile}`, `--port=${port}`, '--bind-address=127.0.0.1',
    '--skip-name-resolve', `--user=${me}`, '--character-set-server=utf8mb4',
    '--collation-server=utf8mb4_unicode_ci', '--innodb-buffer-pool-size=64M', '--max-connections=300'],
  { stdio: 'ignore', detached: true });
  child.unref();
  let exited = null;
  child.on('exit', (code) => { exited = code; });

  const started = Date.now();
  while (!(await ping(socket))) {
    if (exited !== null) throw new Error(`mariadbd exited with ${exited}; see ${logFile}`);
    if (Date.now() - started > 60_000) throw new Error(`mariadbd did not answer within 60 s; see ${logFile}`);
    await sleep(200);
  }

  const passwordFile = join(dir, 'app-password');
  if (!existsSync(passwordFile)) writeFileSync(passwordFile, randomBytes(18).toString('base64url'), { mode: 0o600 });
  const password = readFileSync(passwordFile, 'utf8').trim();
  sql(socket, `CREATE DATABASE IF NOT EXISTS \`${database}\` CHARACTER SET utf8mb4 COLLATE utf8mb4_unicode_ci;
    CREATE USER IF NOT EXISTS '${user}'@'127.0.0.1' IDENTIFIED BY '${password}';
    ALTER USER '${user}'@'127.0.0.1' IDENTIFIED BY '${password}';
    GRANT ALL PRIVILEGES ON \`${database}\`.* TO '${user}'@'127.0.0.1';
    FLUSH PRIVILEGES;`);

  return {
    socket,
    env: {
      SHEDWRIGHT_DB_HOST: '127.0.0.1',
      SHEDWRIGHT_DB_PORT: String(port),
      SHEDWRIGHT_DB_NAME: database,
      SHEDWRIGHT_DB_USER: user,
      SHEDWRIGHT_DB_PASSWORD: password,
    },
    /** Runs SQL as root over the socket (for tests that need a fresh database). */
    sql: (text) => sql(socket, text),
    async stop() {
      spawnSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', 'shutdown'], { stdio: 'ignore' });
      const t = Date.now();
      while (existsSync(pidFile) && Date.now() - t < 30_000) await sleep(100);
    },
  };
}

/**
 * Stops every instance under `parent` in a folder named `prefix…` and removes its data: a test that
 * starts an instance of its own cannot stop it when its worker dies (out of memory, say), and a
 * forgotten mariadbd would go on taking CPU and disk. Resolves to the folders it removed.
 */
export async function removeStrayInstances(parent, prefix) {
  const removed = [];
  for (const name of existsSync(parent) ? readdirSync(parent).filter((n) => n.startsWith(prefix)) : []) {
    const dir = join(parent, name);
    const pidFile = join(dir, 'mariadb.pid');
    if (existsSync(pidFile)) {
      try {
        // mariadbd shuts down cleanly on SIGTERM and removes its pid file.
        process.kill(Number(readFileSync(pidFile, 'utf8').trim()), 'SIGTERM');
        const t = Date.now();
        while (existsSync(pidFile) && Date.now() - t < 30_000) await sleep(100);
      } catch (err) {
        if (err.code !== 'ESRCH') throw err; // already gone, pid file left behind
      }
    }
    rmSync(dir, { recursive: true, force: true });
    removed.push(dir);
  }
  return removed;
}

async function ping(socket) {
  const r = spawnSync('mariadb-admin', ['--no-defaults', `--socket=${socket}`, '-uroot', '--connect-timeout=2', 'ping'], { stdio: 'ignore' });
  return r.status === 0;
}

function sql(socket, text) {
  const r = spawnSync('mariadb', ['--no-defaults', `--socket=${socket}`, '-uroot'], { input: text, encoding: 'utf8' });
  if (r.status !== 0) throw new Error(`SQL failed: ${r.stderr}`);
  return r.stdout;
}
