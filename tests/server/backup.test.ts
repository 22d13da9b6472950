import { randomBytes } from 'node:crypto';
import { appendFileSync, cpSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import fc from 'fast-check';
import type { Model, ModelStatic } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { backup, connectionFromEnv, restore, verifyBackup, type Bucket, type Manifest } from '../../scripts/lib/backup.mjs';
import { startMariaDB, type MariaDB } from '../../scripts/lib/mariadb.mjs';
import { loadConfig } from '../../server/config';
import { migrations } from '../../server/db/migrations';
import { createSequelize } from '../../server/db/sequelize';
import { defineModels, type Models } from '../../server/models';
import { createDraft } from '../../server/services/drafts';
import { saveDraft } from '../../server/services/draft-versions';
import { addPhoto } from '../../server/services/photos';
import { s3Storage } from '../../server/storage/s3';
import { parseDraft, pickCount, type Draft } from '../../shared/weave';
import { freePort } from '../helpers/e2e';
import { startTestServer, type TestServer } from '../helpers/server';
import { testConfig } from '../helpers/test-db';
import { draftArb } from '../shared/weave/arbitraries';

const root = new URL('../..', import.meta.url).pathname;
const work = mkdtempSync(join(tmpdir(), 'shedwright-backup-'));
// Buckets of this file's own in the test object store: the app's, and the one a restore fills.
const suffix = randomBytes(4).toString('hex');
const sourceBucket: Bucket = { ...testConfig().s3, bucket: `backup-source-${suffix}` };
const restoredBucket: Bucket = { ...testConfig().s3, bucket: `backup-restored-${suffix}` };
const restoredStorage = s3Storage(restoredBucket);

let server: TestServer;
let fresh: MariaDB | null = null;
let freshDir = '';
let restored: { sequelize: ReturnType<typeof createSequelize>; models: Models } | null = null;

beforeAll(async () => {
  server = await startTestServer({ s3: sourceBucket });
  await restoredStorage.ensureBucket();
});

afterAll(async () => {
  await restored?.sequelize.close();
  await fresh?.stop();
  if (freshDir) rmSync(freshDir, { recursive: true, force: true });
  rmSync(work, { recursive: true, force: true });
  restoredStorage.close();
  await server.close();
});

// Text a dump must carry unchanged: quotes and backslashes (SQL escapes), newlines (one row per
// line in the dump), characters outside the BMP (utf8mb4), and a NUL.
const awkwardText = ['it\'s a "plain" weave', 'back\\slash; -- not a comment', 'line one\nline two\r\n\ttabbed',
  'ends in a quote\'', 'yarn 🧶 and ß, ø, 絹', 'nul \u0000 inside', '/* not a comment */ `ticks`'];

/**
 * Invented drafts (with cloth: a draft is kept only with ends and picks) with awkward names and notes,
 * each created and saved twice: two history rows, the named first version and the working version the
 * two saves made.
 */
function invitedDocuments(): Draft[] {
  const withCloth = draftArb({ maxEnds: 24, maxPicks: 24 }).filter((d) => d.threading.length > 0 && pickCount(d) > 0);
  const drafts = fc.sample(withCloth, { numRuns: awkwardText.length, seed: 20_250_301 });
  return drafts.map((d, i) => parseDraft({ ...d, name: awkwardText[i].slice(0, 80), notes: awkwardText.join('\n') }));
}

/** A PNG signature followed by random bytes: enough for the upload's type check, and incompressible. */
const fakePng = (size: number) => Buffer.concat([Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]), randomBytes(size)]);

type Row = Record<string, unknown>;
async function rowsById(model: ModelStatic<Model>, where: Row = {}): Promise<Map<number, Row>> {
  const rows = await model.findAll({ where, order: [['id', 'ASC']] });
  return new Map(rows.map((r) => [r.get('id') as number, r.get({ plain: true }) as Row]));
}

describe('backup and restore', () => {
  let manifest: Manifest;
  const target = join(work, 'backup');
  const created: { draftIds: number[]; photoIds: number[] } = { draftIds: [], photoIds: [] };

  it('backs up the test database and the bucket\'s photos with a manifest that verifies', async () => {
    const { models, storage } = server.ctx;
    const owner = await server.createUser({ name: 'Backup weaver' });
    for (const [i, document] of invitedDocuments().entries()) {
      const row = await createDraft(models, { ownerId: owner.id, studioId: null, document, tags: ['backup', `t${i}`] });
      created.draftIds.push(row.id);
      await saveDraft(models, row.id, owner.id, { document: { ...document, notes: `${document.notes}\nsecond` }, baseVersion: 1 });
      await saveDraft(models, row.id, owner.id, { document: { ...document, name: `${document.name} (3)` }, baseVersion: 2, message: awkwardText[i] });
      if (i < 3) created.photoIds.push((await addPhoto(models, storage, row.id, 2, owner.id, fakePng(10_000 + i))).id);
    }

    manifest = await backup({ conn: connectionFromEnv(process.env), bucket: sourceBucket, target });
    expect(manifest.database).toBe(process.env.SHEDWRIGHT_DB_NAME);
    expect(manifest.migrations).toEqual(migrations.map((m) => m.name));
    expect(manifest.counts.drafts).toBeGreaterThanOrEqual(created.draftIds.length);
    expect(manifest.counts.versions).toBeGreaterThanOrEqual(created.draftIds.length * 2);
    expect(manifest.counts.attachments).toBeGreaterThanOrEqual(3);
    const photoFiles = manifest.files.filter((f) => f.path.startsWith('attachments/'));
    expect(photoFiles).toHaveLength(3);
    expect(verifyBackup(target)).toEqual(manifest);
  });

  it('restores into a fresh MariaDB instance and an empty bucket: every draft, version and photo byte the same', async () => {
    const port = await freePort();
    freshDir = join(root, '.data', `restore-test-${port}`);
    fresh = await startMariaDB({ dir: freshDir, port, database: 'shedwright_restored', user: 'shedwright' });
    const conn = connectionFromEnv(fresh.env);
    const started = Date.now();
    await restore({ conn, bucket: restoredBucket, source: target });
    console.log(`backup: restored ${manifest.counts.drafts} drafts and ${manifest.counts.versions} versions in ${Date.now() - started} ms`);

    const config = loadConfig({ ...process.env, ...fresh.env });
    const sequelize = createSequelize(config.db);
    restored = { sequelize, models: defineModels(sequelize) };
    const src = server.ctx.models;
    const dst = restored.models;

    // The restored copy holds exactly the counts the manifest promised.
    expect(await dst.Draft.count()).toBe(manifest.counts.drafts);
    expect(await dst.DraftVersion.count()).toBe(manifest.counts.versions);
    expect(await dst.Attachment.count()).toBe(manifest.counts.attachments);

    // This test's rows: whole rows equal (documents deep-equal, thumbnails byte-equal, times equal).
    const mine = { id: created.draftIds };
    expect(await rowsById(dst.Draft, mine)).toEqual(await rowsById(src.Draft, mine));
    const myVersions = { draftId: created.draftIds };
    const versions = await rowsById(dst.DraftVersion, myVersions);
    expect(versions.size).toBe(created.draftIds.length * 2);
    expect(versions).toEqual(await rowsById(src.DraftVersion, myVersions));

    // Every other restored row too. Versions never change once written; drafts other suites may have
    // saved or deleted since the backup are left out, as only those can differ.
    const backedUpAt = new Date(manifest.createdAt).getTime();
    const [srcDrafts, dstDrafts] = [await rowsById(src.Draft), await rowsById(dst.Draft)];
    for (const [id, row] of dstDrafts) {
      const now = srcDrafts.get(id);
      if (now && (now.updatedAt as Date).getTime() < backedUpAt) expect(row).toEqual(now);
    }
    const srcVersions = await rowsById(src.DraftVersion);
    for (const [id, row] of await rowsById(dst.DraftVersion)) if (srcVersions.has(id)) expect(row).toEqual(srcVersions.get(id));

    // Photo bytes, read back through each side's bucket by the row's storage key.
    const attachments = await rowsById(dst.Attachment, { id: created.photoIds });
    expect(attachments.size).toBe(3);
    for (const row of attachments.values()) {
      const key = row.storageKey as string;
      const bytes = await restoredStorage.get(key);
      expect(bytes).not.toBeNull();
      expect(bytes!.equals((await server.ctx.storage.get(key))!)).toBe(true);
      expect(bytes!.length).toBe(row.bytes);
    }

    // Restoring over a database that now has tables needs the explicit overwrite; the bucket then
    // holds exactly the backup's objects again, a stray one gone.
    await restoredStorage.put('drafts/0/stray.png', fakePng(5));
    await expect(restore({ conn, bucket: restoredBucket, source: target })).rejects.toThrow(/--yes/);
    await restore({ conn, bucket: restoredBucket, source: target, overwrite: true });
    expect(await dst.DraftVersion.count()).toBe(manifest.counts.versions);
    expect(await restoredStorage.get('drafts/0/stray.png')).toBeNull();

    // The restored database takes saves.
    const head = (await dst.Draft.findByPk(created.draftIds[0]))!;
    const saved = await saveDraft(dst, head.id, head.ownerId, { document: head.document, baseVersion: head.version, message: 'after restore' });
    expect(saved).toEqual({ version: head.version + 1 });
  }, 180_000);

  it('refuses a backup that does not match its manifest, before touching the database', async () => {
    const conn = connectionFromEnv(fresh!.env);
    const before = await restored!.models.DraftVersion.count();
    const tamperings: [string, (dir: string) => void][] = [
      ['a changed byte', (dir) => {
        const path = join(dir, 'database.sql');
        const bytes = readFileSync(path);
        bytes[bytes.length - 2] ^= 1;
        writeFileSync(path, bytes);
      }],
      ['a missing attachment', (dir) => rmSync(join(dir, manifest.files.find((f) => f.path.startsWith('attachments/'))!.path))],
      ['an unlisted file', (dir) => writeFileSync(join(dir, 'attachments', 'extra.png'), fakePng(10))],
      ['a longer dump', (dir) => appendFileSync(join(dir, 'database.sql'), 'DROP TABLE drafts;\n')],
      ['no manifest', (dir) => rmSync(join(dir, 'manifest.json'))],
    ];
    for (const [what, tamper] of tamperings) {
      const copy = join(work, `tampered-${what.replaceAll(' ', '-')}`);
      cpSync(target, copy, { recursive: true });
      tamper(copy);
      expect(() => verifyBackup(copy), what).toThrow();
      await expect(restore({ conn, bucket: restoredBucket, source: copy, overwrite: true }), what).rejects.toThrow();
    }
    expect(await restored!.models.DraftVersion.count()).toBe(before);
  });
});
