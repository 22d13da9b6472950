import fc from 'fast-check';
import { inflateSync } from 'node:zlib';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  compareResponseSchema, draftListResponseSchema, lineageResponseSchema, saveConflictSchema, versionDetailResponseSchema,
  versionListResponseSchema,
} from '../../shared/api';
import { createDraft as buildDraft, MAX_SHAFTS, MAX_THREADS, parseDraft, type Draft } from '../../shared/weave';
import { colourAndWeaveSampler, pointTwillScarf, straightTwillTrial } from '../../server/db/seeders/demo-drafts';
import { saveDraft } from '../../server/services/draft-versions';
import { createDraft } from '../../server/services/drafts';
import { STRUCTURE_TAGS } from '../../server/services/draft-derived';
import { clothSources, threadImage } from '../../server/print/raster';
import { STRUCTURES } from '../../src/features/library/drafts-search';
import { startTestServer, type TestClient, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server.close(); });

/** An owner, an editor and a viewer in one studio, and a studio draft made by the owner. */
async function studioScene(document: Draft = pointTwillScarf()) {
  const { client: owner, user, studioId } = await server.signInWithRole('owner');
  const join = async (role: 'editor' | 'viewer') => {
    const member = await server.createUser({ name: `Studio ${role}` });
    await server.ctx.models.Membership.create({ studioId, userId: member.id, role });
    const client = server.client();
    await client.signIn(member.email);
    return { client, user: member };
  };
  const editor = await join('editor');
  const viewer = await join('viewer');
  const draft = await createDraft(server.ctx.models, { ownerId: user.id, studioId, document, tags: ['twill'] });
  return { owner, ownerUser: user, editor, viewer, studioId, draftId: draft.id };
}

const put = (client: TestClient, id: number, body: unknown) => client.send('put', `/api/drafts/${id}`, body);
const withName = (d: Draft, name: string): Draft => ({ ...d, name });

/** Width and height from a PNG's IHDR, after checking the signature (PNG spec §5.2, §11.2.2). */
function pngSize(bytes: Buffer): { width: number; height: number } {
  expect([...bytes.subarray(0, 8)]).toEqual([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]);
  expect(bytes.subarray(12, 16).toString('latin1')).toBe('IHDR');
  return { width: bytes.readUInt32BE(16), height: bytes.readUInt32BE(20) };
}

/** The RGB pixels of a PNG as the server writes it (8-bit RGB, filter 0 on every row). */
function pngPixels(bytes: Buffer): { width: number; height: number; rgb: Uint8Array } {
  const { width, height } = pngSize(bytes);
  const chunks: Buffer[] = [];
  for (let at = 8; at < bytes.length; ) {
    const length = bytes.readUInt32BE(at);
    if (bytes.subarray(at + 4, at + 8).toString('latin1') === 'IDAT') chunks.push(bytes.subarray(at + 8, at + 8 + length));
    at += 12 + length;
  }
  const raw = inflateSync(Buffer.concat(chunks));
  const rgb = new Uint8Array(width * height * 3);
  for (let y = 0; y < height; y++) {
    const row = y * (width * 3 + 1);
    expect(raw[row]).toBe(0);
    rgb.set(raw.subarray(row + 1, row + 1 + width * 3), y * width * 3);
  }
  return { width, height, rgb };
}

/** The library thumbnail's picture of a document, from the engine: its cloth thread by thread, ends 2 pixels apart. */
function thumbnailOf(document: Draft): { width: number; height: number; rgb: Uint8Array } {
  return threadImage(clothSources(document), 'colour', 2);
}

describe('saving versions', () => {
  it('makes an immutable numbered version per save, with author and message, and lists them newest first', async () => {
    const s = await studioScene();
    const v2 = withName(colourAndWeaveSampler(), 'second');
    const res = await put(s.editor.client, s.draftId, { document: v2, baseVersion: 1, message: 'Changed to tabby' });
    expect(res.status, JSON.stringify(res.body)).toBe(200);
    expect(res.body).toEqual({ version: 2 });

    const list = versionListResponseSchema.parse((await s.viewer.client.get(`/api/drafts/${s.draftId}/versions`)).body);
    expect(list.versions.map((v) => [v.version, v.authorName, v.message])).toEqual([
      [2, 'Studio editor', 'Changed to tabby'],
      [1, 'Test owner', 'First version'],
    ]);
    const one = versionDetailResponseSchema.parse((await s.viewer.client.get(`/api/drafts/${s.draftId}/versions/1`)).body);
    expect(parseDraft(one.version.document)).toEqual(pointTwillScarf());
    const detail = (await s.viewer.client.get(`/api/drafts/${s.draftId}`)).body.draft;
    expect(detail).toMatchObject({ version: 2, ends: 48, picks: 48, structure: ['plain weave'] });
    expect(parseDraft(detail.document)).toEqual(v2);
    expect((await s.viewer.client.get(`/api/drafts/${s.draftId}/versions/3`)).status).toBe(404);
  });

  it('lets exactly one of several saves from the same base win; the others get 409 with what the server holds', async () => {
    const s = await studioScene();
    const clients = [s.owner, s.editor.client];
    let base = 1;
    await fc.assert(fc.asyncProperty(fc.integer({ min: 2, max: 5 }), async (n) => {
      const docs = Array.from({ length: n }, (_, i) => withName(straightTwillTrial(), `attempt ${base}-${i}`));
      const results = await Promise.all(docs.map((document, i) => put(clients[i % 2], s.draftId, { document, baseVersion: base })));
      const winners = results.filter((r) => r.status === 200);
      const losers = results.filter((r) => r.status === 409);
      expect(winners).toHaveLength(1);
      expect(losers).toHaveLength(n - 1);
      expect(winners[0].body).toEqual({ version: base + 1 });
      const winnerDoc = docs[results.indexOf(winners[0])];
      for (const loser of losers) {
        const body = saveConflictSchema.parse(loser.body);
        expect(body.current.version).toBe(base + 1);
        expect(parseDraft(body.current.document)).toEqual(winnerDoc);
      }
      base += 1;
    }), { numRuns: 6, seed: 31 });
  });

  it('keeps both documents: the loser sees the conflict and saves on top of the winner', async () => {
    const s = await studioScene();
    const mine = withName(pointTwillScarf(), 'mine');
    const theirs = withName(straightTwillTrial(), 'theirs');
    const [a, b] = await Promise.all([
      put(s.owner, s.draftId, { document: mine, baseVersion: 1, message: 'owner edit' }),
      put(s.editor.client, s.draftId, { document: theirs, baseVersion: 1, message: 'editor edit' }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 409]);
    const [loser, loserDoc, loserClient, winnerDoc] = a.status === 409 ? [a, mine, s.owner, theirs] : [b, theirs, s.editor.client, mine];
    const conflict = saveConflictSchema.parse(loser.body);
    // The loser keeps their copy and saves it on the version they were shown.
    const retry = await put(loserClient, s.draftId, { document: loserDoc, baseVersion: conflict.current.version, message: 'kept mine' });
    expect(retry.body).toEqual({ version: 3 });
    const v2 = versionDetailResponseSchema.parse((await s.viewer.client.get(`/api/drafts/${s.draftId}/versions/2`)).body);
    const v3 = versionDetailResponseSchema.parse((await s.viewer.client.get(`/api/drafts/${s.draftId}/versions/3`)).body);
    expect(parseDraft(v2.version.document)).toEqual(winnerDoc);
    expect(parseDraft(v3.version.document)).toEqual(loserDoc);
  });

  it('answers a base version the draft never reached with 409, leaving no gap in the history', async () => {
    const s = await studioScene();
    const res = await put(s.owner, s.draftId, { document: straightTwillTrial(), baseVersion: 7 });
    expect(res.status).toBe(409);
    expect(saveConflictSchema.parse(res.body).current.version).toBe(1);
    expect((await put(s.owner, s.draftId, { document: straightTwillTrial(), baseVersion: 1 })).body).toEqual({ version: 2 });
    const list = versionListResponseSchema.parse((await s.owner.get(`/api/drafts/${s.draftId}/versions`)).body);
    expect(list.versions.map((v) => v.version)).toEqual([2, 1]);
  });

  it('writes nothing when the version row cannot be written, and the next save works', async () => {
    const s = await studioScene();
    // No such author: the version row breaks its foreign key after the draft row was updated.
    await expect(saveDraft(server.ctx.models, s.draftId, 2 ** 31 - 1, { document: straightTwillTrial(), baseVersion: 1 }))
      .rejects.toThrow(/foreign key/i);
    const row = await server.ctx.models.Draft.findByPk(s.draftId);
    expect(row!.version).toBe(1);
    expect(parseDraft(row!.document)).toEqual(pointTwillScarf());
    // Every pooled connection is out of that transaction: saves on each of them still commit.
    const saves = await Promise.all(Array.from({ length: 12 }, async () => {
      const other = await createDraft(server.ctx.models, { ownerId: s.ownerUser.id, studioId: s.studioId, document: pointTwillScarf(), tags: [] });
      return put(s.owner, other.id, { document: straightTwillTrial(), baseVersion: 1 });
    }));
    expect(saves.map((r) => r.status)).toEqual(saves.map(() => 200));
    expect((await put(s.owner, s.draftId, { document: straightTwillTrial(), baseVersion: 1 })).body).toEqual({ version: 2 });
  });

  it('lets a restore and a save made at the same moment both land, one after the other', async () => {
    const s = await studioScene();
    const { models, sequelize } = server.ctx;
    // The save is held just after its conditional UPDATE moved the draft row, so it holds that row's
    // lock while the restore arrives: the restore reads version 1 (the save is not committed), waits
    // for the lock, finds the draft moved on and tries again on top of the save. Whatever the timing,
    // both land: the save as version 2, the restore as 3.
    let release!: () => void;
    const gate = new Promise<void>((resolve) => { release = resolve; });
    let holding!: () => void;
    const held = new Promise<void>((resolve) => { holding = resolve; });
    models.Draft.addHook('afterBulkUpdate', 'hold-one-save', async (options: { where?: unknown }) => {
      if ((options.where as { id?: number } | undefined)?.id !== s.draftId) return;
      models.Draft.removeHook('afterBulkUpdate', 'hold-one-save');
      holding();
      await gate;
    });
    try {
      const save = put(s.owner, s.draftId, { document: straightTwillTrial(), baseVersion: 1 });
      await held;
      const restore = s.editor.client.post(`/api/drafts/${s.draftId}/versions/1/restore`);
      // Give the restore up to 3 s to reach the row lock (this user's own threads are visible to it).
      for (let waited = 0; waited < 3000; waited += 50) {
        const [row] = await sequelize.query<{ n: number }>(
          "SELECT COUNT(*) AS n FROM information_schema.PROCESSLIST WHERE INFO LIKE 'UPDATE `drafts`%' AND STATE <> ''",
          { type: QueryTypes.SELECT },
        );
        if (Number(row.n) >= 1) break;
        await new Promise((resolve) => setTimeout(resolve, 50));
      }
      release();
      const [saved, restored] = await Promise.all([save, restore]);
      expect([saved.status, restored.status]).toEqual([200, 200]);
      expect([saved.body.version, restored.body.version]).toEqual([2, 3]);
      const list = versionListResponseSchema.parse((await s.owner.get(`/api/drafts/${s.draftId}/versions`)).body);
      expect(list.versions.map((v) => [v.version, v.named])).toEqual([[3, true], [2, false], [1, true]]);
    } finally {
      release();
      models.Draft.removeHook('afterBulkUpdate', 'hold-one-save');
    }
  });

  it('refuses a draft the engine rejects with 422 naming each problem, and a viewer with 403', async () => {
    const s = await studioScene();
    const bad = { ...pointTwillScarf(), threading: [[9], [1]] };
    const res = await put(s.owner, s.draftId, { document: bad, baseVersion: 1 });
    expect(res.status).toBe(422);
    expect(res.body.error.code).toBe('unprocessable');
    expect(Object.values(res.body.error.fields).join(' ')).toMatch(/threading end 1: shaft 9 but the draft has 4 shafts/);
    expect((await put(s.viewer.client, s.draftId, { document: pointTwillScarf(), baseVersion: 1 })).status).toBe(403);
    expect((await put(s.owner, s.draftId, { document: pointTwillScarf() })).status).toBe(400);
  });

  it('holds the limits: more than 32 shafts or 20 000 ends is 422, a body over the size limit is 413', async () => {
    const s = await studioScene();
    const tooManyShafts = { ...pointTwillScarf(), shafts: MAX_SHAFTS + 1 };
    const shafts = await put(s.owner, s.draftId, { document: tooManyShafts, baseVersion: 1 });
    expect(shafts.status).toBe(422);
    expect(shafts.body.error.fields.shafts).toMatch(/33 shafts is more than 32/);
    const ends = Array.from({ length: MAX_THREADS + 1 }, () => [1]);
    const tooLong = await put(s.owner, s.draftId, { document: { ...pointTwillScarf(), threading: ends, warpColors: [] }, baseVersion: 1 });
    expect(tooLong.status).toBe(422);
    expect(tooLong.body.error.fields.threading).toMatch(/at most 20000/);
    const huge = await put(s.owner, s.draftId, { document: { ...pointTwillScarf(), notes: 'x'.repeat(3_000_000) }, baseVersion: 1 });
    expect(huge.status).toBe(413);
  });

  it('restores an old version as a new version and never rewrites history', async () => {
    const s = await studioScene();
    await put(s.owner, s.draftId, { document: colourAndWeaveSampler(), baseVersion: 1 });
    const res = await s.editor.client.post(`/api/drafts/${s.draftId}/versions/1/restore`);
    expect(res.body).toEqual({ version: 3 });
    const list = versionListResponseSchema.parse((await s.owner.get(`/api/drafts/${s.draftId}/versions`)).body);
    expect(list.versions[0]).toMatchObject({ version: 3, message: 'Restored version 1', authorName: 'Studio editor' });
    const now = (await s.owner.get(`/api/drafts/${s.draftId}`)).body.draft;
    expect(parseDraft(now.document)).toEqual(pointTwillScarf());
    expect((await s.viewer.client.post(`/api/drafts/${s.draftId}/versions/1/restore`)).status).toBe(403);
    expect((await s.owner.post(`/api/drafts/${s.draftId}/versions/9/restore`)).status).toBe(404);
  });
});

describe('compare', () => {
  it('names the ends, picks and tie-up cells that changed, with a difference image of the drawdown', async () => {
    const s = await studioScene();
    const changed = structuredClone(pointTwillScarf());
    changed.threading[4] = [changed.threading[4][0] === 1 ? 2 : 1];
    changed.tieup[0] = changed.tieup[0].includes(4) ? changed.tieup[0].filter((x) => x !== 4) : [...changed.tieup[0], 4];
    await put(s.owner, s.draftId, { document: changed, baseVersion: 1 });
    const res = compareResponseSchema.parse((await s.viewer.client.get(`/api/drafts/${s.draftId}/compare?a=1&b=2`)).body);
    expect(res.ends).toEqual([5]);
    expect(res.tieup).toEqual([{ treadle: 1, shaft: 4 }]);
    // Every pick that presses treadle 1 now lifts different shafts.
    const pressesOne = pointTwillScarf().treadling.flatMap((t, p) => (t.includes(1) ? [p + 1] : []));
    expect(res.picks).toEqual(pressesOne);
    expect(res.cells).toBeGreaterThan(0);
    const png = await s.viewer.client.agent.get(res.imageUrl).buffer(true);
    expect(png.status).toBe(200);
    expect(png.headers['content-type']).toBe('image/png');
    expect(pngSize(png.body as Buffer)).toEqual({ width: 60, height: 60 });
    expect((await s.viewer.client.get(`/api/drafts/${s.draftId}/compare?a=1&b=7`)).status).toBe(404);
    expect((await s.viewer.client.get(`/api/drafts/${s.draftId}/compare?a=1`)).status).toBe(400);
  });
});

describe('thumbnails and the library', () => {
  it('renders a PNG of the cloth at thumbnailUrl, and filters by structure, shafts and studio', async () => {
    const s = await studioScene();
    const list = draftListResponseSchema.parse((await s.viewer.client.get(`/api/drafts?studio=${s.studioId}`)).body);
    const item = list.items.find((d) => d.id === s.draftId)!;
    expect(item.thumbnailUrl).toBe(`/api/drafts/${s.draftId}/thumbnail.png?v=1`);
    expect(item.structure).toEqual(['twill']);
    const png = await s.viewer.client.agent.get(item.thumbnailUrl!).buffer(true);
    expect(png.headers['content-type']).toBe('image/png');
    // 60 ends × 60 picks at 20 per inch, ends 2 pixels apart: 120 × 120 pixels.
    const pic = pngPixels(png.body as Buffer);
    expect([pic.width, pic.height]).toEqual([120, 120]);
    // The scarf's own cloth, drawn thread by thread, pixel for pixel.
    expect(pic).toEqual(thumbnailOf(pointTwillScarf()));

    const ids = async (q: string) => draftListResponseSchema.parse((await s.viewer.client.get(`/api/drafts?studio=${s.studioId}&${q}`)).body).items.map((d) => d.id);
    expect(await ids('structure=twill')).toEqual([s.draftId]);
    expect(await ids('structure=plain%20weave')).toEqual([]);
    expect(await ids('shafts=4')).toEqual([s.draftId]);
    expect(await ids('shafts=8')).toEqual([]);
  });

  it('renders the thumbnail again for the new version after a save, in the new colours', async () => {
    const s = await studioScene();
    const fetched = async (url: string) => pngPixels((await s.viewer.client.agent.get(url).buffer(true)).body as Buffer);
    const before = await fetched(`/api/drafts/${s.draftId}/thumbnail.png?v=1`);
    expect(before).toEqual(thumbnailOf(pointTwillScarf()));
    const recoloured = { ...pointTwillScarf(), palette: ['#aa0000', '#00aa00'] };
    expect((await put(s.editor.client, s.draftId, { document: recoloured, baseVersion: 1 })).status).toBe(200);
    const list = draftListResponseSchema.parse((await s.viewer.client.get(`/api/drafts?studio=${s.studioId}`)).body);
    const url = list.items.find((d) => d.id === s.draftId)!.thumbnailUrl!;
    expect(url).toBe(`/api/drafts/${s.draftId}/thumbnail.png?v=2`);
    const after = await fetched(url);
    expect(after).toEqual(thumbnailOf(recoloured));
    expect(after.rgb).not.toEqual(before.rgb);
  });

  it('offers the client exactly the structures the server tags', () => {
    expect([...STRUCTURES]).toEqual([...STRUCTURE_TAGS]);
  });

  it('tags demo drafts by their structure', async () => {
    const { user } = await server.signInWithRole('owner');
    const sampler = await createDraft(server.ctx.models, { ownerId: user.id, studioId: null, document: colourAndWeaveSampler(), tags: [] });
    const trial = await createDraft(server.ctx.models, { ownerId: user.id, studioId: null, document: straightTwillTrial(), tags: [] });
    expect(sampler.structure).toEqual(['plain weave']);
    expect(trial.structure).toEqual(['twill']);
  });
});

describe('create, rename, tags, delete', () => {
  it('creates a given draft, personal or in a studio where the user may write', async () => {
    const s = await studioScene();
    const mine = await s.viewer.client.post('/api/drafts', { name: 'My first', document: straightTwillTrial() });
    expect(mine.status).toBe(201);
    expect(mine.body.draft).toMatchObject({ name: 'My first', studioId: null, ends: 24, version: 1 });
    const given = await s.editor.client.post('/api/drafts', { name: 'Studio scarf', document: pointTwillScarf(), studioId: s.studioId, tags: ['wool'] });
    expect(given.status).toBe(201);
    expect(given.body.draft).toMatchObject({ studioId: s.studioId, ends: 60, tags: ['wool'] });
    const scarf = pointTwillScarf();
    expect((await s.viewer.client.post('/api/drafts', { name: 'Nope', document: scarf, studioId: s.studioId })).status).toBe(403);
    const outsider = server.client();
    await outsider.signIn((await server.createUser()).email);
    expect((await outsider.post('/api/drafts', { name: 'Nope', document: scarf, studioId: s.studioId })).status).toBe(404);
    expect((await s.owner.post('/api/drafts', { name: 'Bad', document: { schemaVersion: 1 } })).status).toBe(422);
  });

  it('renames and retags (editor), deletes (owner only) with everything hanging on the draft', async () => {
    const s = await studioScene();
    const renamed = await s.editor.client.patch(`/api/drafts/${s.draftId}`, { name: 'Winter scarf', tags: ['wool', 'wool', 'gift'] });
    expect(renamed.body.draft).toMatchObject({ name: 'Winter scarf', tags: ['wool', 'gift'], version: 1 });
    expect((await s.editor.client.patch(`/api/drafts/${s.draftId}`, {})).status).toBe(400);
    expect((await s.editor.client.delete(`/api/drafts/${s.draftId}`)).status).toBe(403);
    await s.viewer.client.post(`/api/drafts/${s.draftId}/comments`, { text: 'Pretty' });
    expect((await s.owner.delete(`/api/drafts/${s.draftId}`)).status).toBe(204);
    expect((await s.owner.get(`/api/drafts/${s.draftId}`)).status).toBe(404);
    // In the Bin for 30 days; past that, the next look at a Bin deletes it for good.
    await server.ctx.models.Draft.update({ binnedAt: new Date(Date.now() - 31 * 86_400_000) }, { where: { id: s.draftId } });
    expect((await s.owner.get('/api/bin')).status).toBe(200);
    expect(await server.ctx.models.DraftVersion.count({ where: { draftId: s.draftId } })).toBe(0);
    expect(await server.ctx.models.Comment.count({ where: { draftId: s.draftId } })).toBe(0);
  });
});

describe('forks and lineage', () => {
  it('lets a student fork a studio draft into their own space in a new colourway, and shows the lineage both ways', async () => {
    const s = await studioScene();
    await put(s.owner, s.draftId, { document: withName(pointTwillScarf(), 'v2'), baseVersion: 1 });
    const fork = await s.viewer.client.post(`/api/drafts/${s.draftId}/fork`, { version: 1, name: 'Scarf in rust', palette: ['#8a3b12', '#f5e9d0'] });
    expect(fork.status, JSON.stringify(fork.body)).toBe(201);
    expect(fork.body.draft).toMatchObject({ name: 'Scarf in rust', studioId: null, version: 1, ends: 60 });
    const forkId = fork.body.draft.id as number;
    const doc = parseDraft((await s.viewer.client.get(`/api/drafts/${forkId}`)).body.draft.document);
    expect(doc.palette).toEqual(['#8a3b12', '#f5e9d0']);
    expect(doc.threading).toEqual(pointTwillScarf().threading);
    expect(doc.warpColors).toEqual(pointTwillScarf().warpColors);
    expect(doc.name).toBe('Scarf in rust');

    const down = lineageResponseSchema.parse((await s.owner.get(`/api/drafts/${s.draftId}/lineage`)).body);
    // The student's own fork is personal: the studio owner does not see it.
    expect(down.children).toEqual([]);
    const fromFork = lineageResponseSchema.parse((await s.viewer.client.get(`/api/drafts/${forkId}/lineage`)).body);
    expect(fromFork.draft).toMatchObject({ id: forkId, parentVersion: 1 });
    expect(fromFork.ancestors).toEqual([{ id: s.draftId, name: 'Point twill scarf', ownerName: 'Test owner', parentVersion: null }]);
    const studioView = lineageResponseSchema.parse((await s.viewer.client.get(`/api/drafts/${s.draftId}/lineage`)).body);
    expect(studioView.children.map((c) => c.id)).toEqual([forkId]);

    // A fork of the fork, then the student leaves: the studio draft is no longer theirs to see.
    const grandchild = (await s.viewer.client.post(`/api/drafts/${forkId}/fork`, { name: 'Rust, narrower' })).body.draft.id as number;
    await server.ctx.models.Membership.destroy({ where: { studioId: s.studioId, userId: s.viewer.user.id } });
    const deep = lineageResponseSchema.parse((await s.viewer.client.get(`/api/drafts/${grandchild}/lineage`)).body);
    expect(deep.ancestors.map((a) => a.id)).toEqual([forkId]);
    expect(deep.hiddenAncestors).toBe(1);
  });

  it('refuses a colourway of the wrong length (422), a studio the user cannot write to (403), a missing version (404)', async () => {
    const s = await studioScene();
    const wrong = await s.viewer.client.post(`/api/drafts/${s.draftId}/fork`, { name: 'x', palette: ['#000000'] });
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.fields.palette).toMatch(/exactly 2 colours/);
    expect((await s.viewer.client.post(`/api/drafts/${s.draftId}/fork`, { name: 'x', studioId: s.studioId })).status).toBe(403);
    expect((await s.viewer.client.post(`/api/drafts/${s.draftId}/fork`, { name: 'x', version: 5 })).status).toBe(404);
    expect((await s.viewer.client.post(`/api/drafts/${s.draftId}/fork`, { name: 'x', palette: ['red', 'blue'] })).status).toBe(400);
  });
});

describe('exports', () => {
  it('downloads the draft as WIF and JSON, of any version', async () => {
    const s = await studioScene();
    await put(s.owner, s.draftId, { document: colourAndWeaveSampler(), baseVersion: 1 });
    const wif = await s.viewer.client.get(`/api/drafts/${s.draftId}/export.wif?version=1`);
    expect(wif.status).toBe(200);
    expect(wif.headers['content-disposition']).toMatch(/attachment; filename="Point twill scarf.wif"/);
    const { fromWif } = await import('../../shared/weave');
    expect(fromWif(wif.text).threading).toEqual(pointTwillScarf().threading);
    const json = await s.viewer.client.get(`/api/drafts/${s.draftId}/export.json`);
    expect(json.headers['content-type']).toMatch(/application\/json/);
    expect(parseDraft(JSON.parse(json.text))).toEqual(colourAndWeaveSampler());
    expect((await s.viewer.client.get(`/api/drafts/${s.draftId}/export.json?version=4`)).status).toBe(404);
  });

  it('round-trips any small draft through save and JSON export', async () => {
    const s = await studioScene();
    let base = 1;
    const arb = fc.record({ ends: fc.integer({ min: 1, max: 30 }), shafts: fc.integer({ min: 2, max: 8 }), seed: fc.integer({ min: 0, max: 1000 }) })
      .map(({ ends, shafts, seed }) => buildDraft({
        shafts, treadles: shafts,
        threading: Array.from({ length: ends }, (_, e) => [((e * 7 + seed) % shafts) + 1]),
        tieup: Array.from({ length: shafts }, (_, t) => [t + 1]),
        treadling: Array.from({ length: ends }, (_, p) => [((p * 3 + seed) % shafts) + 1]),
      }));
    await fc.assert(fc.asyncProperty(arb, async (doc) => {
      expect((await put(s.owner, s.draftId, { document: doc, baseVersion: base })).status).toBe(200);
      base += 1;
      expect(parseDraft(JSON.parse((await s.owner.get(`/api/drafts/${s.draftId}/export.json`)).text))).toEqual(doc);
    }), { numRuns: 8, seed: 5 });
  });
});
