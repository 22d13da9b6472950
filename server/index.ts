// Starts the API (and the built client, when present) on SHEDWRIGHT_HOST:SHEDWRIGHT_PORT.
import type { Server } from 'node:http';
import { createApp } from './app';
import { loadConfig } from './config';
import { createContext } from './context';
import { migrate } from './db/migrate';
import { startFakeSmtp } from './mail/fake-smtp';

const config = loadConfig();
const smtp = await startFakeSmtp(config.smtpPort);
const ctx = createContext(config, smtp);
await migrate(ctx.sequelize);
const app = createApp(ctx);

const server: Server = app.listen(config.port, config.host);
server.on('error', (err) => {
  console.error(`Could not listen on ${config.host}:${config.port}: ${err.message}`);
  process.exit(1);
});

async function shutdown() {
  server.close();
  server.closeAllConnections();
  await ctx.close();
  await smtp.close();
  process.exit(0);
}
process.on('SIGINT', shutdown);
process.on('SIGTERM', shutdown);
