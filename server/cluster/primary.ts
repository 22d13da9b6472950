import cluster, { type Worker } from 'node:cluster';
import { ClusterMemoryStorePrimary } from '@express-rate-limit/cluster-memory-store';
import type { Config } from '../config';
import { migrate } from '../db/migrate';
import { createSequelize } from '../db/sequelize';
import { startFakeSmtp } from '../mail/fake-smtp';
import { relayBetweenWorkers } from './relay';

/** How long stopping workers get to finish their requests before they are killed. */
const STOP_TIMEOUT_MS = 10_000;

/**
 * Runs `config.workers` processes of the app behind one port (node:cluster hands each new connection
 * to the next worker). This process serves no request: it migrates the database once, keeps the
 * state the workers must share (the fake SMTP server's mails, the rate-limit counts, the relay that
 * keeps their caches true to each other) and starts a new worker when one dies.
 * Resolves with the port once every worker listens; stops everything on SIGINT and SIGTERM.
 */
export async function runPrimary(config: Config): Promise<{ port: number }> {
  const sequelize = createSequelize(config.db);
  await migrate(sequelize);
  await sequelize.close();
  const smtp = await startFakeSmtp(config.smtpPort);
  new ClusterMemoryStorePrimary().init();
  relayBetweenWorkers(cluster, smtp.mails);

  // Every worker must sign and read session cookies with the same secret, and send to the SMTP port
  // actually taken (config may say "any": 0).
  const env = { SHEDWRIGHT_SESSION_SECRET: config.sessionSecret, SHEDWRIGHT_SMTP_PORT: String(smtp.port) };
  const listened = new Set<Worker>();
  let stopping = false;

  async function stop(code: number) {
    if (stopping) return;
    stopping = true;
    const workers = Object.values(cluster.workers ?? {}).filter((w): w is Worker => !!w);
    const exited = workers.map((w) => new Promise((resolve) => { if (w.isDead()) resolve(null); else w.once('exit', resolve); }));
    for (const w of workers) w.process.kill('SIGTERM');
    const timer = setTimeout(() => { for (const w of workers) if (!w.isDead()) w.process.kill('SIGKILL'); }, STOP_TIMEOUT_MS);
    await Promise.all(exited);
    clearTimeout(timer);
    await smtp.close();
    process.exit(code);
  }
  process.on('SIGINT', () => stop(0));
  process.on('SIGTERM', () => stop(0));

  return new Promise((resolve) => {
    cluster.on('listening', (worker, address) => {
      listened.add(worker);
      if (listened.size === config.workers) resolve({ port: address.port });
    });
    cluster.on('exit', (worker, code, signal) => {
      if (stopping) return;
      // A worker that never listened will not do better on a second try (a port in use, a bad setting).
      if (!listened.has(worker)) {
        console.error(`A worker of the app stopped while starting (${signal ?? `exit code ${code}`}); stopping.`);
        void stop(1);
        return;
      }
      listened.delete(worker);
      console.error(`A worker of the app stopped (${signal ?? `exit code ${code}`}); starting another.`);
      cluster.fork(env);
    });
    for (let i = 0; i < config.workers; i++) cluster.fork(env);
  });
}
