import connectSessionSequelize from 'connect-session-sequelize';
import session from 'express-session';
import type { Store } from 'express-rate-limit';
import { LRUCache } from 'lru-cache';
import type { PassportStatic } from 'passport';
import type { Sequelize } from 'sequelize';
import type { CapturedMail } from '../shared/api/dev';
import { singleProcess, type CacheRelay } from './cluster/relay';
import type { Config } from './config';
import { createSequelize } from './db/sequelize';
import { createMailer, type Mailer } from './mail/mailer';
import { createPassport } from './middleware/passport';
import { defineModels, type Models } from './models';
import { localDiskStorage, type BlobStorage } from './storage';

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

/**
 * Every request reads its session before anything else; a copy of each session this process wrote or
 * read is kept in memory and written through, so that read is no database query. Sessions change only
 * through this store (sign-in, sign-out, regenerate), and a change drops the other processes' copies
 * (through `relay`) before it is answered, so with one app server (config.processCaches) no copy
 * goes stale. It is kept as JSON because express-session changes the object it is handed.
 * Expired sessions are judged by their cookie's expiry in createApp, as for sessions read from the table.
 */
function cacheSessions(store: SessionStore, relay: CacheRelay): SessionStore {
  const copies = new LRUCache<string, string>({ max: 20_000 });
  relay.subscribe((drop) => {
    if (drop.kind === 'session') copies.delete(drop.sid);
  });
  const dropElsewhere = (sid: string, callback: ((err?: unknown) => void) | undefined) => (err?: unknown) => {
    if (err) callback?.(err);
    else relay.publish({ kind: 'session', sid }).then(() => callback?.(), callback);
  };
  const get = store.get.bind(store);
  const set = store.set.bind(store);
  const destroy = store.destroy.bind(store);
  store.get = (sid, callback) => {
    const copy = copies.get(sid);
    if (copy !== undefined) {
      callback(null, JSON.parse(copy) as session.SessionData);
      return;
    }
    get(sid, (err, data) => {
      if (!err && data) copies.set(sid, JSON.stringify(data));
      callback(err, data);
    });
  };
  store.set = (sid, data, callback) => {
    copies.delete(sid);
    const done = dropElsewhere(sid, callback);
    set(sid, data, (err) => {
      if (!err) copies.set(sid, JSON.stringify(data));
      done(err);
    });
  };
  store.destroy = (sid, callback) => {
    copies.delete(sid);
    destroy(sid, dropElsewhere(sid, callback));
  };
  return store;
}

/** Everything createApp needs from outside: settings, database, session store and mail. */
export interface AppContext {
  config: Config;
  sequelize: Sequelize;
  models: Models;
  sessionStore: SessionStore;
  passport: PassportStatic;
  mailer: Mailer;
  /** Uploaded files (photos of cloth); local disk here, an object store elsewhere. */
  storage: BlobStorage;
  /** Where rate-limit counts live when the app runs as several processes; this process's memory otherwise. */
  rateLimitStore?: (prefix: string) => Store;
  /** Mails captured by the local fake SMTP server, newest first. */
  mails: () => CapturedMail[] | Promise<CapturedMail[]>;
  /** Stops the session store's timer and closes mail and database connections. */
  close(): Promise<void>;
}

/** What a process of the app needs from the others when it runs as several (server/cluster). */
export interface SiblingProcesses {
  relay: CacheRelay;
  /** A rate-limit store whose counts all processes share. */
  rateLimitStore: (prefix: string) => Store;
}

/**
 * Opens the database and mail connections; `mailbox` is the fake SMTP server to send to and read from.
 * `siblings` is given when the app runs as several processes.
 */
export function createContext(
  config: Config, mailbox: Pick<AppContext, 'mails'> & { port: number }, siblings?: SiblingProcesses,
): AppContext {
  const relay = siblings?.relay ?? singleProcess;
  const sequelize = createSequelize(config.db);
  const models = defineModels(sequelize, { processCaches: config.processCaches, relay });
  const store = throttleTouch(new SequelizeStore({
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: 15 * 60 * 1000,
  }));
  const sessionStore = config.processCaches ? cacheSessions(store, relay) : store;
  const mailer = createMailer(mailbox.port);
  return {
    config,
    sequelize,
    models,
    sessionStore,
    passport: createPassport(models),
    mailer,
    storage: localDiskStorage(config.attachmentsDir),
    rateLimitStore: siblings?.rateLimitStore,
    mails: mailbox.mails,
    async close() {
      sessionStore.stopExpiringSessions();
      mailer.close();
      await sequelize.close();
    },
  };
}
