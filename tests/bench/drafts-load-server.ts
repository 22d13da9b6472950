// The server for tests/bench/drafts-load.ts, in processes of its own so autocannon does not share
// their event loop. Prints `listening <port>` once every process listens; exits on SIGTERM.
//   --server=app (default): the real app over the test database, run as server/index.ts runs it;
//   --server=express | node: the floors of save-floors.ts, which answer only the save;
//   --workers=N: that many processes behind one port (node:cluster), as SHEDWRIGHT_WORKERS does;
//     by default as many as the app runs.
import cluster from 'node:cluster';
import { once } from 'node:events';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { runPrimary } from '../../server/cluster/primary';
import { serveApp } from '../../server/serve';
import { testConfig } from '../helpers/test-db';
import { floorServer } from './save-floors';

const option = (name: string) => process.argv.find((a) => a.startsWith(`--${name}=`))?.split('=')[1];
const kind = option('server') ?? 'app';
if (!['app', 'express', 'node'].includes(kind)) throw new Error(`--server must be app, express or node, not ${kind}`);
// By default as many as the app runs (SHEDWRIGHT_WORKERS, or one per CPU).
const workers = Number(option('workers') ?? testConfig().workers);
// A worker's SMTP port is the primary's fake server's (server/cluster/primary.ts).
const config = testConfig({ workers, smtpPort: Number(process.env.SHEDWRIGHT_SMTP_PORT ?? 0) });

// Handlers still running when the load stops would only fail noisily on a closing pool: just exit
// (workers exit by themselves when their primary does).
process.on('SIGTERM', () => process.exit(0));

async function listen(): Promise<Server> {
  if (kind === 'app') return serveApp(config);
  const server = floorServer(kind as 'express' | 'node', config).listen(0, '127.0.0.1');
  await once(server, 'listening');
  return server;
}

if (cluster.isPrimary && workers > 1) {
  let port: number;
  if (kind === 'app') ({ port } = await runPrimary(config));
  else {
    port = await new Promise<number>((resolve) => {
      let listening = 0;
      cluster.on('listening', (_worker, address) => { if (++listening === workers) resolve(address.port); });
      for (let i = 0; i < workers; i++) cluster.fork();
    });
  }
  console.log(`listening ${port}`);
} else {
  const server = await listen();
  if (cluster.isPrimary) console.log(`listening ${(server.address() as AddressInfo).port}`);
}
