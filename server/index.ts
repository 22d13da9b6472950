// Starts the app on SHEDWRIGHT_HOST:SHEDWRIGHT_PORT: one process; run more servers to scale (docs/scaling.md).
import { loadConfig } from './config';
import { serveApp } from './serve';

await serveApp(loadConfig());
