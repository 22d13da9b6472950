import connectSessionSequelize from 'connect-session-sequelize';
import session from 'express-session';
import type { PassportStatic } from 'passport';
import type { Sequelize } from 'sequelize';
import type { CapturedMail } from '../shared/api/dev';
import type { Config } from './config';
import { createSequelize } from './db/sequelize';
import { createMailer, type Mailer } from './mail/mailer';
import { createPassport } from './middleware/passport';
import { defineModels, type Models } from './models';

const SequelizeStore = connectSessionSequelize(session.Store);
export type SessionStore = InstanceType<typeof SequelizeStore>;

/** Everything createApp needs from outside: settings, database, session store and mail. */
export interface AppContext {
  config: Config;
  sequelize: Sequelize;
  models: Models;
  sessionStore: SessionStore;
  passport: PassportStatic;
  mailer: Mailer;
  /** Mails captured by the local fake SMTP server, newest first. */
  mails: () => CapturedMail[];
  /** Stops the session store's timer and closes mail and database connections. */
  close(): Promise<void>;
}

/** Opens the database and mail connections; `mailbox` is the fake SMTP server to send to and read from. */
export function createContext(config: Config, mailbox: { port: number; mails: () => CapturedMail[] }): AppContext {
  const sequelize = createSequelize(config.db);
  const models = defineModels(sequelize);
  const sessionStore = new SequelizeStore({
    db: sequelize,
    table: 'Session',
    checkExpirationInterval: 15 * 60 * 1000,
  });
  const mailer = createMailer(mailbox.port);
  return {
    config,
    sequelize,
    models,
    sessionStore,
    passport: createPassport(models),
    mailer,
    mails: mailbox.mails,
    async close() {
      sessionStore.stopExpiringSessions();
      mailer.close();
      await sequelize.close();
    },
  };
}
