// Starts the app on SHEDWRIGHT_HOST:SHEDWRIGHT_PORT: SHEDWRIGHT_WORKERS processes (one per CPU by
// default) behind one port, or a single process when that is 1.
import cluster from 'node:cluster';
import { runPrimary } from './cluster/primary';
import { loadConfig } from './config';
import { serveApp } from './serve';

const config = loadConfig();
if (cluster.isPrimary && config.workers > 1) await runPrimary(config);
else await serveApp(config);
