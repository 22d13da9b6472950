// `npm run backup [folder]`: the app's database (a consistent mariadb-dump snapshot) and the photos in its
// S3 bucket, with a manifest, into .data/backups/<time>/ or the folder given. The app may keep running.
import { join, resolve } from 'node:path';
import { backup, openAppDatabase, timestampName } from './lib/backup.mjs';
import { root } from './lib/system.mjs';

const target = process.argv[2] ? resolve(process.argv[2]) : join(root, '.data', 'backups', timestampName());
const db = await openAppDatabase(root);
try {
  if (db.startedHere) console.log('The database was not running; started it for the backup.');
  const manifest = await backup({ conn: db.conn, bucket: db.bucket, target });
  const bytes = manifest.files.reduce((sum, f) => sum + f.bytes, 0);
  console.log(`Backed up ${manifest.counts.drafts} drafts, ${manifest.counts.versions} versions and `
    + `${manifest.counts.attachments} attachments (${manifest.files.length} files, ${(bytes / 1024 / 1024).toFixed(1)} MB, `
    + `schema ${manifest.migrations.at(-1) ?? 'empty'}) to ${target}`);
} catch (err) {
  console.error(`Backup failed: ${err.message}`);
  process.exitCode = 1;
} finally {
  await db.close();
}
