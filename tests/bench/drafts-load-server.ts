// The server for tests/bench/drafts-load.ts, in a process of its own so autocannon does not share
// its event loop. Prints `listening <port>` once it listens; exits on SIGTERM.
//   --server=app (default): the real app over the test database, run as server/index.ts runs it;
//   --server=express | node: the floors of save-floors.ts.
import { once } from 'node:events';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { serveApp } from '../../server/serve';
import { testConfig } from '../helpers/test-db';
import { floorServer } from './save-floors';

const option = (name: string) => process.argv.find((a) => a.startsWith(`--${name}=`))?.split('=')[1];
const kind = option('server') ?? 'app';
if (!['app', 'express', 'node'].includes(kind)) throw new Error(`--server must be app, express or node, not ${kind}`);
// Logs as a server in use writes them: one line per request, in the background, to a file.
const config = testConfig({
  smtpPort: Number(process.env.SHEDWRIGHT_SMTP_PORT ?? 0),
  log: { level: 'info', file: join(tmpdir(), `shedwright-bench-${process.pid}.log`) },
});

// Handlers still running when the load stops would only fail noisily on a closing pool: just exit.
process.on('SIGTERM', () => process.exit(0));

async function listen(): Promise<Server> {
  if (kind === 'app') return serveApp(config);
  const server = floorServer(kind as 'express' | 'node', config).listen(0, '127.0.0.1');
  await once(server, 'listening');
  return server;
}

const server = await listen();
console.log(`listening ${(server.address() as AddressInfo).port}`);
