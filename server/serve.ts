import type { Server } from 'node:http';
import { createApp } from './app';
import type { Config } from './config';
import { createContext } from './context';
import { migrate } from './db/migrate';
import { startFakeSmtp } from './mail/fake-smtp';

/** How long a stop waits for requests in flight before cutting them. */
export const DRAIN_MS = 10_000;

/**
 * Serves the API (and the built client, when present) from this one process, after running the
 * migrations, creating the object store's bucket when missing and starting the fake SMTP server. Resolves once listening.
 * SIGTERM or SIGINT stops it cleanly: no new connections, requests in flight finish (for up to
 * DRAIN_MS, then they are cut), then the database pool and mail close and the process exits, so a
 * save that commits is also answered.
 */
export async function serveApp(config: Config): Promise<Server> {
  const smtp = await startFakeSmtp(config.smtpPort);
  const ctx = createContext(config, smtp);
  await migrate(ctx.sequelize);
  await ctx.storage.ensureBucket();

  const server = createApp(ctx).listen(config.port, config.host);
  await new Promise<void>((resolve) => {
    server.once('listening', resolve);
    server.once('error', (err) => {
      console.error(`Could not listen on ${config.host}:${config.port}: ${err.message}`);
      process.exit(1);
    });
  });

  let stopping = false;
  async function stop() {
    if (stopping) return;
    stopping = true;
    const drained = new Promise<void>((resolve) => server.close(() => resolve()));
    // Kept-alive connections with nothing in flight would hold the close open: end them as they fall idle.
    server.closeIdleConnections();
    const idle = setInterval(() => server.closeIdleConnections(), 100);
    const cut = setTimeout(() => server.closeAllConnections(), DRAIN_MS);
    await drained;
    clearInterval(idle);
    clearTimeout(cut);
    await ctx.close();
    await smtp.close();
    process.exit(0);
  }
  process.on('SIGTERM', () => void stop());
  process.on('SIGINT', () => void stop());
  return server;
}
