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

/**
 * Brings the schema up to date and returns the names of the migrations it ran.
 * NOTE: test suites and the app may migrate the same database at once, so the run is wrapped in a
 * MariaDB named lock. The lock belongs to one connection, so a transaction pins that connection while
 * the migrations themselves run on others (it touches no table, so it blocks no DDL).
 */
export async function migrate(sequelize: Sequelize): Promise<string[]> {
  return sequelize.transaction(async (transaction) => {
    const [row] = await sequelize.query<{ ok: number | null }>('SELECT GET_LOCK(?, ?) AS ok', {
      replacements: [LOCK_NAME, LOCK_TIMEOUT_S], type: QueryTypes.SELECT, transaction,
    });
    if (Number(row?.ok) !== 1) throw new Error(`Could not take the migration lock within ${LOCK_TIMEOUT_S} s`);
    try {
      const ran = await umzugFor(sequelize).up();
      return ran.map((m) => m.name);
    } finally {
      await sequelize.query('SELECT RELEASE_LOCK(?)', { replacements: [LOCK_NAME], type: QueryTypes.SELECT, transaction });
    }
  });
}
