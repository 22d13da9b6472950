// The app for tests/bench/drafts-load.ts, in a process of its own so autocannon does not share its
// event loop. Prints `listening <port>` once it answers; exits on SIGTERM. One process, as the app
// runs: its access and library caches live in the process (server/models/access-cache.ts).
import type { AddressInfo } from 'node:net';
import { createApp } from '../../server/app';
import { createContext } from '../../server/context';
import { migrate } from '../../server/db/migrate';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { testConfig } from '../helpers/test-db';

const smtp = await startFakeSmtp(0);
const ctx = createContext(testConfig(), smtp);
await migrate(ctx.sequelize);
const server = createApp(ctx).listen(0, '127.0.0.1', () => {
  console.log(`listening ${(server.address() as AddressInfo).port}`);
});
// Handlers still running when the load stops would only fail noisily on a closing pool: just exit.
process.on('SIGTERM', () => process.exit(0));
