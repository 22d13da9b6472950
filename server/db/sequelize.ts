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
    dialectOptions: { connectTimeout: 5000 },
    pool: { max: 10, min: 0, idle: 10_000 },
  });
  applyMetaFix(sequelize);
  return sequelize;
}
