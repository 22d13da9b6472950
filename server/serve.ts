import cluster from 'node:cluster';
import type { Server } from 'node:http';
import { ClusterMemoryStoreWorker } from '@express-rate-limit/cluster-memory-store';
import { createApp } from './app';
import { workerRelay } from './cluster/relay';
import type { Config } from './config';
import { createContext, type SiblingProcesses } from './context';
import { migrate } from './db/migrate';
import { startFakeSmtp, type FakeSmtp } from './mail/fake-smtp';

/**
 * Serves the API (and the built client, when present) from this process. On its own it also runs the
 * migrations and the fake SMTP server; as one worker of several (server/cluster/primary.ts) the
 * primary has done both, and the worker reaches the others through it.
 * Resolves once listening; SIGTERM (and SIGINT, when it runs alone) closes it down.
 */
export async function serveApp(config: Config): Promise<Server> {
  let smtp: FakeSmtp | null = null;
  let siblings: SiblingProcesses | undefined;
  let mailbox: Parameters<typeof createContext>[1];
  if (cluster.isWorker) {
    const link = workerRelay();
    siblings = { relay: link.relay, rateLimitStore: (prefix) => new ClusterMemoryStoreWorker({ prefix }) };
    mailbox = { port: config.smtpPort, mails: link.mails };
  } else {
    smtp = await startFakeSmtp(config.smtpPort);
    mailbox = smtp;
  }
  const ctx = createContext(config, mailbox, siblings);
  if (!cluster.isWorker) await migrate(ctx.sequelize);

  const server = createApp(ctx).listen(config.port, config.host);
  await new Promise<void>((resolve) => {
    server.once('listening', resolve);
    server.once('error', (err) => {
      console.error(`Could not listen on ${config.host}:${config.port}: ${err.message}`);
      process.exit(1);
    });
  });

  async function shutdown() {
    server.close();
    server.closeAllConnections();
    await ctx.close();
    await smtp?.close();
    process.exit(0);
  }
  process.on('SIGTERM', shutdown);
  // Ctrl-C reaches every process of the group; the primary stops its workers itself (with SIGTERM),
  // and must not take a worker that stopped first for one that died.
  process.on('SIGINT', cluster.isWorker ? () => {} : shutdown);
  return server;
}
