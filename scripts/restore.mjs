// `npm run restore -- <backup folder> [--yes]`: puts a backup made by `npm run backup` back into the
// app's database and its S3 bucket. Refuses a backup whose manifest does not verify, and asks for
// --yes before replacing a database that has tables (there is no prompt: CI has no stdin).
import { resolve } from 'node:path';
import { openAppDatabase, restore, verifyBackup } from './lib/backup.mjs';
import { root } from './lib/system.mjs';

const args = process.argv.slice(2);
const overwrite = args.includes('--yes');
const source = args.find((a) => !a.startsWith('--'));
if (!source) {
  console.error('Usage: npm run restore -- <backup folder> [--yes]');
  process.exit(2);
}

let db;
try {
  // Checked before the database is touched (or started), so a damaged backup changes nothing.
  verifyBackup(resolve(source));
  db = await openAppDatabase(root);
  if (!db.startedHere) console.log('Note: the database is running; stop the app first so no one writes during the restore.');
  const manifest = await restore({ conn: db.conn, bucket: db.bucket, source: resolve(source), overwrite });
  console.log(`Restored ${manifest.counts.drafts} drafts, ${manifest.counts.versions} versions and `
    + `${manifest.counts.attachments} attachments from the backup of ${manifest.createdAt}.`);
} catch (err) {
  console.error(`Restore failed: ${err.message}`);
  process.exitCode = 1;
} finally {
  await db?.close();
}
