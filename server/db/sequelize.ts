import { Sequelize } from 'sequelize';
import type { DbConfig } from '../config';
import { applyMetaFix } from './meta-fix';

/** A Sequelize instance for MariaDB that stores times in UTC and text as utf8mb4. */
export function createSequelize(db: DbConfig): Sequelize {
  const sequelize = new Sequelize(db.name, db.user, db.password, {
    dialect: 'mariadb',
    host: db.host,
    port: db.port,
    timezone: '+00:00',
    logging: false,
    define: { charset: 'utf8mb4', collate: 'utf8mb4_unicode_ci' },
    // When MariaDB is down a request must fail fast (503) rather than hang: a refused or silent
    // connection attempt gives up after 3 s, and a request waits at most 5 s for a pooled connection.
    // logParam: the driver leaves query values out of its error messages (they hold weavers' text).
    dialectOptions: { connectTimeout: 3000, logParam: false },
    pool: { max: 10, min: 0, idle: 10_000, acquire: 5000 },
  });
  applyMetaFix(sequelize);
  return sequelize;
}
