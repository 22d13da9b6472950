// `npx tsx server/db/setup.ts`: migrate the database and add the demo when it is empty.
// `npx tsx server/db/setup.ts --print-accounts`: print the demo accounts (no database needed).
import { loadConfig } from '../config';
import { defineModels } from '../models';
import { demoAccounts } from './demo-accounts';
import { migrate } from './migrate';
import { isEmpty, seedDemo } from './seeders/demo';
import { createSequelize } from './sequelize';

if (process.argv.includes('--print-accounts')) {
  const width = Math.max(...demoAccounts.map((a) => a.email.length));
  for (const a of demoAccounts) {
    const role = a.role === 'admin' ? 'site admin' : `studio ${a.role}`;
    console.log(`${a.email.padEnd(width)}  password: ${a.password}  (${a.name}, ${role})`);
  }
} else {
  const sequelize = createSequelize(loadConfig().db);
  try {
    const models = defineModels(sequelize);
    const ran = await migrate(sequelize);
    console.log(ran.length > 0 ? `Migrations applied: ${ran.join(', ')}` : 'Database schema is up to date.');
    if (await isEmpty(models)) {
      await seedDemo(models);
      console.log('Demo studio, accounts and drafts added.');
    }
  } finally {
    await sequelize.close();
  }
}
