// The app for tests/bench/drafts-load.ts, in a process of its own so autocannon does not share its
// event loop. Prints `listening <port>` once it answers; exits on SIGTERM. With
// SHEDWRIGHT_BENCH_WORKERS=n (n > 1) it runs n copies under node:cluster sharing one port, to see
// what one process per core would give.
import cluster from 'node:cluster';
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { createContext } from '../../server/context';
import { migrate } from '../../server/db/migrate';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { testConfig } from '../helpers/test-db';

const workers = Number(process.env.SHEDWRIGHT_BENCH_WORKERS ?? 1);
// Port 0 in a cluster worker is one shared port for every server that asks for it, so only the
// primary runs the mail catcher; workers send to its port.
const smtp = cluster.isPrimary ? await startFakeSmtp(0) : { port: Number(process.env.BENCH_SMTP_PORT), mails: () => [] };

if (cluster.isPrimary && workers > 1) {
  const ctx = createContext(testConfig(), smtp);
  // Migrated once, before any worker starts, so workers never race on the migration table.
  await migrate(ctx.sequelize);
  await ctx.close();
  const ports = await Promise.all(Array.from({ length: workers }, () => new Promise<number>((resolve) => {
    cluster.fork({ BENCH_SMTP_PORT: String(smtp.port) }).once('listening', (address) => resolve(address.port));
  })));
  console.log(`listening ${ports[0]}`);
} else {
  const ctx = createContext(testConfig(), smtp);
  if (cluster.isPrimary) await migrate(ctx.sequelize);
  const server = createApp(ctx).listen(0, '127.0.0.1', () => {
    if (cluster.isPrimary) console.log(`listening ${(server.address() as AddressInfo).port}`);
  });
}
// Handlers still running when the load stops would only fail noisily on a closing pool: just exit.
process.on('SIGTERM', () => process.exit(0));
