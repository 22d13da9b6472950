// `node scripts/db.mjs test|dev`: start the private MariaDB for tests or the app in the foreground,
// print its settings as shell exports, and stop it on Ctrl-C. Handy while developing tests.
import { startMariaDB } from './lib/mariadb.mjs';
import { root } from './lib/system.mjs';
import { databases } from './lib/databases.mjs';

const which = process.argv[2] === 'dev' ? 'app' : 'test';
const db = await startMariaDB({ ...databases[which], dir: `${root}/${databases[which].dir}` });
for (const [k, v] of Object.entries(db.env)) console.log(`export ${k}=${v}`);
console.log('# MariaDB is running; Ctrl-C stops it.');
const stop = async () => { await db.stop(); process.exit(0); };
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
setInterval(() => {}, 1 << 30);
