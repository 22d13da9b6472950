// `node scripts/db.mjs test|dev`: start the private MariaDB (and a fake S3 store) for tests or the app in the foreground,
// print its settings as shell exports, and stop it on Ctrl-C. Handy while developing tests.
import { startMariaDB } from './lib/mariadb.mjs';
import { root } from './lib/system.mjs';
import { databases } from './lib/databases.mjs';
import { startS3Fake } from './lib/s3-fake.mjs';

const which = process.argv[2] === 'dev' ? 'app' : 'test';
const db = await startMariaDB({ ...databases[which], dir: `${root}/${databases[which].dir}` });
const s3 = await startS3Fake({ port: 0, dir: `${root}/${databases[which].dir}-s3`, bucket: which === 'app' ? 'shedwright' : 'shedwright-test' });
for (const [k, v] of Object.entries({ ...db.env, ...s3.env })) console.log(`export ${k}=${v}`);
console.log('# MariaDB and the fake S3 object store are running; Ctrl-C stops them.');
const stop = async () => { await s3.stop(); await db.stop(); process.exit(0); };
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
setInterval(() => {}, 1 << 30);
