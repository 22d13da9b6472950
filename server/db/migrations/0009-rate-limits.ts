import { QueryTypes, type QueryInterface } from 'sequelize';

/**
 * Rate-limit counters live in MariaDB so every app server counts the same sign-in failures, sign-ups
 * and reset requests: one row per limiter and key (a client address, or the hash of an account's
 * e-mail), with its hits in the current window and when that window ends.
 * The save procedure of 0006 goes: saves are an ordinary transaction in server/services/draft-versions.ts
 * (the procedure predates working versions and nothing calls it).
 */
export async function up({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.sequelize.query(
    'CREATE TABLE IF NOT EXISTS rate_limits ('
    + ' `key` VARCHAR(191) NOT NULL PRIMARY KEY,'
    + ' hits INT UNSIGNED NOT NULL,'
    + ' resetAt DATETIME(3) NOT NULL,'
    + ' INDEX rate_limits_reset_at (resetAt)'
    + ') ENGINE=InnoDB DEFAULT CHARSET=utf8mb4 COLLATE=utf8mb4_unicode_ci',
    { type: QueryTypes.RAW },
  );
  await qi.sequelize.query('DROP PROCEDURE IF EXISTS save_draft_version', { type: QueryTypes.RAW });
}

export async function down({ context: qi }: { context: QueryInterface }): Promise<void> {
  await qi.dropTable('rate_limits');
}
