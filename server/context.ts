import connectSessionSequelize from 'connect-session-sequelize';
import session from 'express-session';
import type { PassportStatic } from 'passport';
import type { Logger } from 'pino';
import type { Sequelize } from 'sequelize';
import type { CapturedMail } from '../shared/api/dev';
import type { Config } from './config';
import { createSequelize } from './db/sequelize';
import { createMailer, type Mailer } from './mail/mailer';
import { createPassport } from './middleware/passport';
import { createLogger } from './middleware/request-log';
import { defineModels, type Models } from './models';
import { s3Storage, type S3Storage } from './storage/s3';

const SequelizeStore = connectSessionSequelize(session.Store);

/** How often one process renews a session row's expiry: far more often than sessions last (days). */
const TOUCH_INTERVAL_MS = 10 * 60 * 1000;

export type SessionStore = InstanceType<typeof SequelizeStore>;

/**
 * The store renews a session row's expiry (which its sweeper deletes rows by) on every request, a
 * database write per request. Renewing it at most every few minutes per process keeps the rows of
 * sessions in use without that write. The cookie's own expiry does not slide: it is set when the
 * session is saved, at sign-in (express-session's `rolling` is off).
 */
function throttleTouch(store: SessionStore): SessionStore {
  const touch = store.touch.bind(store);
  const touched = new Map<string, number>();
  store.touch = (sid, data, callback) => {
    const now = Date.now();
    const last = touched.get(sid);
    if (last !== undefined && now - last < TOUCH_INTERVAL_MS) {
      callback?.(undefined);
      return;
    }
    if (touched.size > 50_000) touched.clear();
    touched.set(sid, now);
    touch(sid, data, callback);
  };
  return store;
}

/** Everything createApp needs from outside: settings, database, session store and mail. */
export interface AppContext {
  config: Config;
  /** Structured log lines (pino); each request's own child logger is `req.log`. */
  logger: Logger;
  sequelize: Sequelize;
  models: Models;
  sessionStore: SessionStore;
  passport: PassportStatic;
  mailer: Mailer;
  /** Uploaded files (photos of cloth), in the object store's bucket. */
  storage: S3Storage;
  /** Mails captured by the local fake SMTP server, newest first. */
  mails: () => CapturedMail[] | Promise<CapturedMail[]>;
  /** Stops the session store's timer and closes mail and database connections. */
  close(): Promise<void>;
}

/** Opens the database and mail connections; `mailbox` is the fake SMTP server to send to and read from. */
export function createContext(config: Config, mailbox: Pick<AppContext, 'mails'> & { port: number }): AppContext {
  const sequelize = createSequelize(config.db);
  const models = defineModels(sequelize);
  const sessionStore = throttleTouch(new SequelizeStore({
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: 15 * 60 * 1000,
  }));
  const mailer = createMailer(mailbox.port);
  const storage = s3Storage(config.s3);
  const logger = createLogger(config.log);
  return {
    config,
    logger,
    sequelize,
    models,
    sessionStore,
    passport: createPassport(models),
    mailer,
    storage,
    mails: mailbox.mails,
    async close() {
      sessionStore.stopExpiringSessions();
      mailer.close();
      storage.close();
      await sequelize.close();
      await new Promise<void>((resolve) => { logger.flush(() => resolve()); });
    },
  };
}
