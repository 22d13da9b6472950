import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { saveConflictSchema, SITTING_MINUTES, versionDetailResponseSchema, versionListResponseSchema, type VersionSummary } from '../../shared/api';
import { createDraft as buildDraft, parseDraft, toWif, type Draft } from '../../shared/weave';
import { pointTwillScarf, straightTwillTrial } from '../../server/db/seeders/demo-drafts';
import { createDraft } from '../../server/services/drafts';
import { startTestServer, type TestClient, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server.close(); });

/** A studio draft (version 1, named) with its owner and an editor, each signed in. */
async function scene() {
  const { client: owner, user, studioId } = await server.signInWithRole('owner');
  const editorUser = await server.createUser({ name: 'Second weaver' });
  await server.ctx.models.Membership.create({ studioId, userId: editorUser.id, role: 'editor' });
  const editor = server.client();
  await editor.signIn(editorUser.email);
  const draft = await createDraft(server.ctx.models, { ownerId: user.id, studioId, document: pointTwillScarf(), tags: [] });
  return { owner, editor, draftId: draft.id };
}

/** The scarf with a name that tells the saves apart. */
const doc = (name: string): Draft => ({ ...pointTwillScarf(), name });
const save = (client: TestClient, id: number, body: { document: Draft; baseVersion: number; message?: string; named?: boolean }) =>
  client.send('put', `/api/drafts/${id}`, body);

async function history(client: TestClient, id: number): Promise<VersionSummary[]> {
  return versionListResponseSchema.parse((await client.get(`/api/drafts/${id}/versions`)).body).versions;
}
const shape = (versions: VersionSummary[]) => versions.map((v) => [v.firstVersion, v.version, v.named, v.authorName, v.message]);

async function documentAt(client: TestClient, id: number, n: number) {
  const res = await client.get(`/api/drafts/${id}/versions/${n}`);
  expect(res.status).toBe(200);
  const { version } = versionDetailResponseSchema.parse(res.body);
  return { version: version.version, name: parseDraft(version.document).name };
}

describe('working versions', () => {
  it('carries one working version through a sitting of autosaves; each save still gets its own number', async () => {
    const s = await scene();
    const answers = [];
    for (const [i, name] of ['a', 'b', 'c'].entries()) answers.push((await save(s.owner, s.draftId, { document: doc(name), baseVersion: i + 1 })).body);
    expect(answers).toEqual([{ version: 2 }, { version: 3 }, { version: 4 }]);
    expect(shape(await history(s.owner, s.draftId))).toEqual([
      [2, 4, false, 'Test owner', ''],
      [1, 1, true, 'Test owner', 'First version'],
    ]);
    // Every save number answered is still found: the earlier ones lead to the version that carried them on.
    for (const n of [2, 3, 4]) expect(await documentAt(s.owner, s.draftId, n)).toEqual({ version: 4, name: 'c' });
    expect((await s.owner.get(`/api/drafts/${s.draftId}/versions/5`)).status).toBe(404);
  });

  it('makes a named version with "Save version", which ends the sitting', async () => {
    const s = await scene();
    await save(s.owner, s.draftId, { document: doc('draft'), baseVersion: 1 });
    expect((await save(s.owner, s.draftId, { document: doc('kept'), baseVersion: 2, named: true, message: 'Border settled' })).body).toEqual({ version: 3 });
    await save(s.owner, s.draftId, { document: doc('after'), baseVersion: 3 });
    // A named save straight after another named one is a version of its own.
    await save(s.owner, s.draftId, { document: doc('second name'), baseVersion: 4, named: true, message: 'Second try' });
    await save(s.owner, s.draftId, { document: doc('again'), baseVersion: 5, named: true });
    expect(shape(await history(s.owner, s.draftId))).toEqual([
      [6, 6, true, 'Test owner', ''],
      [4, 5, true, 'Test owner', 'Second try'],
      [2, 3, true, 'Test owner', 'Border settled'],
      [1, 1, true, 'Test owner', 'First version'],
    ]);
    expect(await documentAt(s.owner, s.draftId, 2)).toEqual({ version: 3, name: 'kept' });
  });

  it('starts a new working version when someone else saved in between, or after the sitting has lapsed', async () => {
    const s = await scene();
    await save(s.owner, s.draftId, { document: doc('mine'), baseVersion: 1 });
    await save(s.editor, s.draftId, { document: doc('theirs'), baseVersion: 2 });
    await save(s.owner, s.draftId, { document: doc('mine again'), baseVersion: 3 });
    // The owner's last save was long ago: the next one starts a new sitting.
    const lapsed = new Date(Date.now() - (SITTING_MINUTES + 1) * 60_000);
    await server.ctx.models.DraftVersion.update({ savedAt: lapsed }, { where: { draftId: s.draftId, version: 4 } });
    await save(s.owner, s.draftId, { document: doc('next day'), baseVersion: 4 });
    await save(s.owner, s.draftId, { document: doc('next day, later'), baseVersion: 5 });
    expect(shape(await history(s.owner, s.draftId))).toEqual([
      [5, 6, false, 'Test owner', ''],
      [4, 4, false, 'Test owner', ''],
      [3, 3, false, 'Second weaver', ''],
      [2, 2, false, 'Test owner', ''],
      [1, 1, true, 'Test owner', 'First version'],
    ]);
  });

  it('refuses a save from a stale base even within one sitting (two tabs of one weaver), keeping what was saved', async () => {
    const s = await scene();
    expect((await save(s.owner, s.draftId, { document: doc('tab one'), baseVersion: 1 })).status).toBe(200);
    const stale = await save(s.owner, s.draftId, { document: doc('tab two'), baseVersion: 1 });
    expect(stale.status).toBe(409);
    const { current } = saveConflictSchema.parse(stale.body);
    expect(current.version).toBe(2);
    expect(parseDraft(current.document).name).toBe('tab one');
    expect(await documentAt(s.owner, s.draftId, 2)).toEqual({ version: 2, name: 'tab one' });
  });

  it('keeps every answered save findable, whoever saves and however the saves interleave', async () => {
    const s = await scene();
    const clients = [s.owner, s.editor];
    let current = 1;
    // Each step: who saves, named or not, and whether the save is from the current or an older base.
    const step = fc.record({ who: fc.integer({ min: 0, max: 1 }), named: fc.boolean(), stale: fc.integer({ min: 0, max: 4 }) });
    await fc.assert(fc.asyncProperty(fc.array(step, { minLength: 1, maxLength: 6 }), async (steps) => {
      const answered = new Map<number, string>();
      for (const [i, st] of steps.entries()) {
        const name = `save ${current}-${i}`;
        const baseVersion = st.stale === 0 && current > 1 ? current - 1 : current;
        const res = await save(clients[st.who], s.draftId, { document: doc(name), baseVersion, named: st.named });
        if (baseVersion !== current) {
          expect(res.status).toBe(409);
          continue;
        }
        expect(res.body).toEqual({ version: current + 1 });
        current += 1;
        answered.set(current, name);
      }
      const versions = await history(s.owner, s.draftId);
      for (const [n, name] of answered) {
        const row = versions.find((v) => v.firstVersion <= n && n <= v.version);
        expect(row, `save ${n}`).toBeDefined();
        // A row holds the document of its newest save; the saves before it in the row were its base.
        const found = await documentAt(s.owner, s.draftId, n);
        expect(found.version).toBe(row!.version);
        if (row!.version === n) expect(found.name).toBe(name);
      }
      // Rows never overlap and leave no save number out.
      const ranges = versions.map((v) => [v.firstVersion, v.version]).reverse();
      ranges.forEach(([first], i) => expect(first).toBe(i === 0 ? 1 : ranges[i - 1][1] + 1));
      expect(ranges.at(-1)![1]).toBe(current);
    }), { numRuns: 8, seed: 15 });
  });

  it('lists each version with its author, times and a thumbnail of its cloth', async () => {
    const s = await scene();
    await save(s.owner, s.draftId, { document: doc('autosaved'), baseVersion: 1 });
    const [working, first] = await history(s.owner, s.draftId);
    expect(working).toMatchObject({ version: 2, named: false, thumbnailUrl: `/api/drafts/${s.draftId}/versions/2/thumbnail.png` });
    expect(Date.parse(working.savedAt)).toBeGreaterThanOrEqual(Date.parse(first.savedAt));
    const png = await s.owner.agent.get(working.thumbnailUrl!).buffer(true);
    expect(png.status).toBe(200);
    expect(png.headers['content-type']).toBe('image/png');
    expect(png.headers['cache-control']).toContain('immutable');
    expect([...png.body.subarray(1, 4)].map((c: number) => String.fromCharCode(c)).join('')).toBe('PNG');
    expect((await s.owner.agent.get(`/api/drafts/${s.draftId}/versions/9/thumbnail.png`)).status).toBe(404);
  });

  it('makes a restore a named version of its own, leaving the working version it replaced in the history', async () => {
    const s = await scene();
    await save(s.owner, s.draftId, { document: doc('changed'), baseVersion: 1 });
    expect((await s.owner.post(`/api/drafts/${s.draftId}/versions/1/restore`)).body).toEqual({ version: 3 });
    await save(s.owner, s.draftId, { document: doc('after restore'), baseVersion: 3 });
    expect(shape(await history(s.owner, s.draftId))).toEqual([
      [4, 4, false, 'Test owner', ''],
      [3, 3, true, 'Test owner', 'Restored version 1'],
      [2, 2, false, 'Test owner', ''],
      [1, 1, true, 'Test owner', 'First version'],
    ]);
    expect(await documentAt(s.owner, s.draftId, 2)).toEqual({ version: 2, name: 'changed' });
  });
});

describe('a draft with no ends or no picks', () => {
  const noEnds = buildDraft({ shafts: 4, treadles: 2, tieup: [[1], [2]], treadling: [[1], [2]] });
  const noPicks = buildDraft({ shafts: 4, treadles: 2, tieup: [[1], [2]], threading: [[1], [2]] });
  const noLiftPlanPicks = buildDraft({ shafts: 4, threading: [[1]], control: 'liftplan', treadles: 1, tieup: [[1]], treadling: [[1]] });

  it('is never saved: 422 naming what is missing, and the history is unchanged', async () => {
    const s = await scene();
    const ends = await save(s.owner, s.draftId, { document: noEnds, baseVersion: 1 });
    expect(ends.status).toBe(422);
    expect(ends.body.error.fields).toEqual({ threading: 'the draft has no ends: it needs at least one' });
    const picks = await save(s.owner, s.draftId, { document: noPicks, baseVersion: 1, named: true });
    expect(picks.status).toBe(422);
    expect(picks.body.error.fields).toEqual({ treadling: 'the draft has no picks: it needs at least one' });
    expect((await save(s.owner, s.draftId, { document: noLiftPlanPicks, baseVersion: 1 })).body.error.fields)
      .toEqual({ liftplan: 'the draft has no picks: it needs at least one' });
    expect((await history(s.owner, s.draftId)).map((v) => v.version)).toEqual([1]);
  });

  it('is never created, imported or made by a restore', async () => {
    const s = await scene();
    const missing = await s.owner.post('/api/drafts', { name: 'Nothing yet' });
    expect(missing.status).toBe(422);
    expect(missing.body.error.fields).toHaveProperty('document');
    const empty = await s.owner.post('/api/drafts', { name: 'Empty', document: noEnds });
    expect(empty.status).toBe(422);
    expect(empty.body.error.fields).toHaveProperty('threading');
    const wif = await s.owner.agent.post('/api/drafts/import-wif').set('x-csrf-token', await s.owner.csrf())
      .attach('file', Buffer.from(toWif(noPicks)), 'no-picks.wif');
    expect(wif.status).toBe(422);
    expect(wif.body.error.message).toContain('no picks');
    // A version stored before the rule cannot come back through a restore.
    await server.ctx.models.DraftVersion.update({ document: noEnds }, { where: { draftId: s.draftId, version: 1 } });
    await save(s.owner, s.draftId, { document: straightTwillTrial(), baseVersion: 1 });
    expect((await s.owner.post(`/api/drafts/${s.draftId}/versions/1/restore`)).status).toBe(422);
    expect((await history(s.owner, s.draftId)).find((v) => v.version === 1)?.thumbnailUrl).toBeNull();
  });
});
