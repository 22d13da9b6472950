import { Sequelize } from 'sequelize';
import type { DbConfig } from '../config';
import { applyMetaFix } from './meta-fix';

/**
 * How long a connection may hear nothing from MariaDB. No statement the app runs takes near this
 * long (the slowest, a library page of a large studio, takes tens of milliseconds).
 */
const SOCKET_TIMEOUT_MS = 4000;

/** A Sequelize instance for MariaDB that stores times in UTC and text as utf8mb4. */
export function createSequelize(db: DbConfig): Sequelize {
  const sequelize = new Sequelize(db.name, db.user, db.password, {
    dialect: 'mariadb',
    host: db.host,
    port: db.port,
    timezone: '+00:00',
    logging: false,
    define: { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
    // When MariaDB is down or frozen a request must fail fast (503) rather than hang: a refused or
    // silent connection attempt gives up after 3 s; a connection that hears nothing for 4 s (a query
    // the server stopped answering) is closed, failing its query; and a request waits at most 5 s
    // for a pooled connection. Idle connections leave the pool before their silence counts.
    // logParam: the driver leaves query values out of its error messages (they hold weavers' text).
    dialectOptions: { connectTimeout: 3000, socketTimeout: SOCKET_TIMEOUT_MS, logParam: false },
    pool: { max: 10, min: 0, idle: SOCKET_TIMEOUT_MS - 1000, acquire: 5000 },
  });
  applyMetaFix(sequelize);
  return sequelize;
}
