import { QueryTypes, type QueryInterface, type Sequelize } from 'sequelize';
import { SequelizeStorage, Umzug } from 'umzug';
import { migrations } from './migrations';

const LOCK_NAME = 'shedwright_migrate';
const LOCK_TIMEOUT_S = 60;

function umzugFor(sequelize: Sequelize): Umzug<QueryInterface> {
  return new Umzug({
    migrations,
    context: sequelize.getQueryInterface(),
    storage: new SequelizeStorage({ sequelize, tableName: 'schema_migrations' }),
    logger: undefined,
  });
}

/** How long one GET_LOCK waits, and how often the lock's connection speaks: both well inside the 4 s socket timeout. */
const LOCK_STEP_S = 2;

/**
 * Brings the schema up to date and returns the names of the migrations it ran.
 * NOTE: test suites and the app may migrate the same database at once, so the run is wrapped in a
 * MariaDB named lock. The lock belongs to one connection, so a transaction pins that connection while
 * the migrations themselves run on others (it touches no table, so it blocks no DDL). A connection
 * silent for 4 s is closed (server/db/sequelize.ts), which would drop the lock: so the lock is asked
 * for in short waits, and the connection holding it says SELECT 1 every 2 s while migrations run.
 */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  return sequelize.transaction(async (transaction) => {
    const select = { type: QueryTypes.SELECT, transaction } as const;
    for (let waited = 0; ; waited += LOCK_STEP_S) {
      const [row] = await sequelize.query<{ ok: number | null }>('SELECT GET_LOCK(?, ?) AS ok', { ...select, replacements: [LOCK_NAME, LOCK_STEP_S] });
      if (Number(row?.ok) === 1) break;
      if (waited >= LOCK_TIMEOUT_S) throw new Error(`Could not take the migration lock within ${LOCK_TIMEOUT_S} s`);
    }
    const keepAlive = setInterval(() => { sequelize.query('SELECT 1', select).catch(() => undefined); }, LOCK_STEP_S * 1000);
    try {
      const ran = await umzugFor(sequelize).up();
      return ran.map((m) => m.name);
    } finally {
      clearInterval(keepAlive);
      await sequelize.query('SELECT RELEASE_LOCK(?)', { ...select, replacements: [LOCK_NAME] });
    }
  });
}
