import { existsSync } from 'node:fs';
import { resolve } from 'node:path';
import { csrfSync } from 'csrf-sync';
import express, { type Express } from 'express';
import session from 'express-session';
import { QueryTypes } from 'sequelize';
import type { AppContext } from './context';
import { routeNotFound, errorHandler } from './middleware/errors';
import { requestLog } from './middleware/request-log';
import { securityHeaders } from './middleware/security';
import { apiRouter } from './routes';

export const SESSION_COOKIE = 'shedwright.sid';

/** How long /readyz waits for MariaDB and the object store before calling the server not ready. */
const READY_TIMEOUT_MS = 1000;

/** Null when MariaDB and the object store both answer within READY_TIMEOUT_MS, else what failed. */
async function readiness(ctx: AppContext): Promise<string | null> {
  let timer: NodeJS.Timeout | undefined;
  const abort = new AbortController();
  const late = new Promise<string>((resolve) => {
    timer = setTimeout(() => { abort.abort(); resolve('the database or the object store did not answer within 1 s'); }, READY_TIMEOUT_MS);
  });
  const database = ctx.sequelize.query('SELECT 1', { type: QueryTypes.SELECT }).then(() => null, () => 'the database cannot be reached');
  const objects = ctx.storage.check(abort.signal).then(() => null, () => 'the object store cannot be reached');
  const checks = Promise.all([database, objects]).then((problems) => problems.find((p) => p !== null) ?? null);
  try {
    return await Promise.race([checks, late]);
  } finally {
    clearTimeout(timer);
  }
}

/** Builds the Express app without listening, so tests can drive it with supertest. */
export function createApp(ctx: AppContext): Express {
  const { config } = ctx;
  const secure = config.publicUrl.startsWith('https:');
  const app = express();
  app.disable('x-powered-by');
  // API answers are per user and small: hashing every one to offer a 304 cost about a tenth of a
  // library request. Static files keep their own ETags (express.static).
  app.set('etag', false);
  // Which proxies' X-Forwarded-* headers give the client address and protocol (SHEDWRIGHT_TRUST_PROXY).
  app.set('trust proxy', config.trustProxy);
  app.use(requestLog(ctx.logger));
  app.use(securityHeaders(config));

  // For load balancers and orchestrators, without a session: the process answers; it can do its work.
  app.get('/healthz', (_req, res) => { res.json({ ok: true }); });
  app.get('/readyz', async (_req, res) => {
    const problem = await readiness(ctx);
    res.status(problem ? 503 : 200).json(problem ? { ok: false, problem } : { ok: true });
  });

  const { csrfSynchronisedProtection } = csrfSync();
  const api = express.Router();
  api.use(express.json({ limit: config.bodyLimit }));
  api.use(session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store: ctx.sessionStore,
    resave: false,
    saveUninitialized: false,
    cookie: { httpOnly: true, sameSite: 'lax', secure, maxAge: config.sessionMaxAgeMs },
  }));
  // The session store hands back an expired session until its periodic sweep deletes it: a browser
  // drops the cookie by then, but a copied cookie sent again must not sign anyone in either.
  api.use((req, _res, next) => {
    const expires = req.session?.cookie.expires;
    if (expires && expires.getTime() <= Date.now()) req.session.regenerate(next);
    else next();
  });
  api.use(ctx.passport.session());
  api.use(csrfSynchronisedProtection);
  api.use(apiRouter(ctx));
  api.use(routeNotFound);
  app.use('/api', api);

  const staticDir = resolve(config.staticDir);
  const indexHtml = resolve(staticDir, 'index.html');
  if (existsSync(indexHtml)) {
    app.use(express.static(staticDir, { index: false }));
    // Client routes (/drafts/12, /reset?token=…) all load the single-page app.
    app.get(['/', '/*rest'], (_req, res) => res.sendFile(indexHtml));
  }
  app.use(routeNotFound);
  app.use(errorHandler);
  return app;
}
