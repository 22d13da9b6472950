// A draft's life outside the editor: made from the New draft form's choices, its details (name,
// tags, notes, studio) edited in one place, and deleted into the Bin and back.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { draftCreatedResponseSchema, draftDetailResponseSchema } from '../../shared/api/drafts';
import { computeDrawdown, parseDraft } from '../../shared/weave';
import { startTestServer, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server.close(); });

const start = { shafts: 4, treadles: 4, ends: 24, picks: 16, structure: 'straight-twill' } as const;

describe('a new draft from the New draft form', () => {
  it('builds version 1 from the loom, size and starting structure chosen', async () => {
    const { client } = await server.signInWithRole('owner');
    const res = await client.post('/api/drafts', { name: 'Towels', start });
    expect(res.status).toBe(201);
    const { draft } = draftCreatedResponseSchema.parse(res.body);
    expect(draft).toMatchObject({ name: 'Towels', ends: 24, picks: 16, shafts: 4, version: 1, studioId: null });
    const detail = draftDetailResponseSchema.parse((await client.get(`/api/drafts/${draft.id}`)).body);
    const doc = parseDraft(detail.draft.document);
    expect(doc.name).toBe('Towels');
    // A 2/2 twill on four shafts: every end is up on exactly two of every four picks (common practice).
    const dd = computeDrawdown(doc);
    for (let e = 0; e < dd.ends; e++) {
      let up = 0;
      for (let p = 0; p < 4; p++) if (dd.isUp(e, p)) up++;
      expect(up).toBe(2);
    }
  });

  it('weaves by a lift plan when the loom has no treadles, and goes into a studio the weaver edits in', async () => {
    const { client, studioId } = await server.signInWithRole('editor');
    const res = await client.post('/api/drafts', { name: 'Dobby sampler', studioId, start: { ...start, treadles: 0, shafts: 8 } });
    expect(res.status).toBe(201);
    const id = (res.body as { draft: { id: number; studioId: number } }).draft.id;
    expect((res.body as { draft: { studioId: number } }).draft.studioId).toBe(studioId);
    const doc = parseDraft(((await client.get(`/api/drafts/${id}`)).body as { draft: { document: unknown } }).draft.document);
    expect(doc.control).toBe('liftplan');
    expect(doc.liftplan).toHaveLength(16);
  });

  it('keeps a block design with a draft started as one', async () => {
    const { client } = await server.signInWithRole('owner');
    const res = await client.post('/api/drafts', { name: 'Blocks', start: { ...start, shafts: 8, treadles: 0, structure: 'block', unit: 'double-weave' } });
    expect(res.status).toBe(201);
    const id = (res.body as { draft: { id: number } }).draft.id;
    const doc = parseDraft(((await client.get(`/api/drafts/${id}`)).body as { draft: { document: unknown } }).draft.document);
    expect(doc.profile?.unit).toBe('double-weave');
  });

  it('refuses values the loom cannot take with 422 naming the field', async () => {
    const { client, studioId } = await server.signInWithRole('viewer');
    const cases: [object, string][] = [
      [{ shafts: 1 }, 'start.shafts'],
      [{ shafts: 33 }, 'start.shafts'],
      [{ ends: 0 }, 'start.ends'],
      [{ picks: 2.5 }, 'start.picks'],
      [{ treadles: -1 }, 'start.treadles'],
      // A 4-shaft twill needs 4 treadles.
      [{ treadles: 2 }, 'start.treadles'],
      [{ structure: 'block' }, 'start.unit'],
    ];
    for (const [change, field] of cases) {
      const res = await client.post('/api/drafts', { name: 'Bad', start: { ...start, ...change } });
      expect(res.status, JSON.stringify(change)).toBe(422);
      expect(Object.keys(res.body.error.fields as object)).toEqual([field]);
    }
    // A viewer may not add drafts to the studio.
    expect((await client.post('/api/drafts', { name: 'Not here', studioId, start })).status).toBe(403);
  });
});

describe('a draft\'s details', () => {
  it('a new name reaches the library, the draft and its stored document, with no new version', async () => {
    const { client } = await server.signInWithRole('owner');
    const id = ((await client.post('/api/drafts', { name: 'Old name', start })).body as { draft: { id: number } }).draft.id;
    const res = await client.patch(`/api/drafts/${id}`, { name: 'Kitchen towels', tags: ['towels', 'cotton'] });
    expect(res.status).toBe(200);
    const { draft } = draftDetailResponseSchema.parse(res.body);
    expect(draft).toMatchObject({ name: 'Kitchen towels', tags: ['towels', 'cotton'], version: 1 });
    expect(parseDraft(draft.document).name).toBe('Kitchen towels');
    const list = (await client.get('/api/drafts?q=Kitchen')).body as { items: { id: number; name: string }[] };
    expect(list.items.map((d) => [d.id, d.name])).toEqual([[id, 'Kitchen towels']]);
    const wif = await client.get(`/api/drafts/${id}/export.wif?version=1`);
    expect(wif.text).toMatch(/^Title=Kitchen towels$/m);
  });

  it('tags are kept on a new colourway', async () => {
    const { client } = await server.signInWithRole('owner');
    const id = ((await client.post('/api/drafts', { name: 'Scarf', start, tags: ['wool', 'gift'] })).body as { draft: { id: number } }).draft.id;
    const fork = await client.post(`/api/drafts/${id}/fork`, { name: 'Scarf in rust' });
    expect(fork.status).toBe(201);
    expect((fork.body as { draft: { tags: string[] } }).draft.tags).toEqual(['wool', 'gift']);
  });

  it('an editor moves her personal draft into a studio, where its viewers see it, and back', async () => {
    const editor = await server.signInWithRole('editor');
    const viewer = server.client();
    const viewerUser = await server.createUser({ name: 'Studio viewer' });
    await server.ctx.models.Membership.create({ studioId: editor.studioId, userId: viewerUser.id, role: 'viewer' });
    await viewer.signIn(viewerUser.email);
    const id = ((await editor.client.post('/api/drafts', { name: 'To share', start })).body as { draft: { id: number } }).draft.id;
    expect((await viewer.get(`/api/drafts/${id}`)).status).toBe(404);

    const moved = await editor.client.patch(`/api/drafts/${id}`, { studioId: editor.studioId });
    expect(moved.status).toBe(200);
    expect((moved.body as { draft: { studioId: number; role: string } }).draft).toMatchObject({ studioId: editor.studioId, studioName: 'Test studio' });
    expect((await viewer.get(`/api/drafts/${id}`)).status).toBe(200);
    // A viewer can neither move it nor rename it.
    expect((await viewer.patch(`/api/drafts/${id}`, { studioId: null })).status).toBe(403);

    const back = await editor.client.patch(`/api/drafts/${id}`, { studioId: null });
    expect(back.status).toBe(200);
    expect((await viewer.get(`/api/drafts/${id}`)).status).toBe(404);
  });

  it('only the draft\'s author takes a studio draft into her own drafts; a studio the mover does not edit in is refused', async () => {
    const owner = await server.signInWithRole('owner');
    const other = await server.signInWithRole('viewer');
    const editorUser = await server.createUser({ name: 'Other editor' });
    await server.ctx.models.Membership.create({ studioId: owner.studioId, userId: editorUser.id, role: 'editor' });
    const editor = server.client();
    await editor.signIn(editorUser.email);
    const id = ((await owner.client.post('/api/drafts', { name: 'Studio piece', start, studioId: owner.studioId })).body as { draft: { id: number } }).draft.id;
    expect((await editor.patch(`/api/drafts/${id}`, { studioId: null })).status).toBe(403);
    // The owner is no member of the other studio: it does not exist for her.
    expect((await owner.client.patch(`/api/drafts/${id}`, { studioId: other.studioId })).status).toBe(404);
    await server.ctx.models.Membership.create({ studioId: other.studioId, userId: owner.user.id, role: 'viewer' });
    expect((await owner.client.patch(`/api/drafts/${id}`, { studioId: other.studioId })).status).toBe(403);
  });
});

describe('a save as the weaver leaves', () => {
  it('needs no token request of its own: the session answer carries the CSRF token, and only for someone signed in', async () => {
    const { client } = await server.signInWithRole('owner');
    const id = ((await client.post('/api/drafts', { name: 'Leaving', start })).body as { draft: { id: number; } }).draft.id;
    const document = ((await client.get(`/api/drafts/${id}`)).body as { draft: { document: object } }).draft.document;
    const session = await client.agent.get('/api/session');
    const token = (session.body as { csrfToken?: string }).csrfToken;
    expect(token).toBeTypeOf('string');
    const saved = await client.agent.put(`/api/drafts/${id}`).set('x-csrf-token', token!).send({ document, baseVersion: 1 });
    expect(saved.status).toBe(200);
    expect((await server.client().agent.get('/api/session')).body).toEqual({ user: null });
  });
});

describe('the Bin', () => {
  it('keeps a deleted draft out of sight for 30 days, restorable by its owner, then deletes it for good', async () => {
    const owner = await server.signInWithRole('owner');
    const editorUser = await server.createUser({ name: 'Bin editor' });
    await server.ctx.models.Membership.create({ studioId: owner.studioId, userId: editorUser.id, role: 'editor' });
    const editor = server.client();
    await editor.signIn(editorUser.email);
    const id = ((await owner.client.post('/api/drafts', { name: 'Binned mat', start, studioId: owner.studioId })).body as { draft: { id: number } }).draft.id;
    const token = ((await owner.client.post(`/api/drafts/${id}/share`)).body as { token: string }).token;

    expect((await editor.delete(`/api/drafts/${id}`)).status).toBe(403);
    expect((await owner.client.delete(`/api/drafts/${id}`)).status).toBe(204);
    // Gone from everywhere it showed: the draft, the library, a share link.
    expect((await owner.client.get(`/api/drafts/${id}`)).status).toBe(404);
    expect((await editor.get(`/api/drafts/${id}`)).status).toBe(404);
    expect(((await owner.client.get('/api/drafts?q=Binned')).body as { total: number }).total).toBe(0);
    expect((await server.client().get(`/api/shared/${token}`)).status).toBe(404);
    // In the owner's Bin, not the editor's.
    const bin = (await owner.client.get('/api/bin')).body as { drafts: { id: number; name: string; purgeAt: string; binnedAt: string }[] };
    expect(bin.drafts.map((d) => [d.id, d.name])).toEqual([[id, 'Binned mat']]);
    expect(Date.parse(bin.drafts[0].purgeAt) - Date.parse(bin.drafts[0].binnedAt)).toBe(30 * 86_400_000);
    expect(((await editor.get('/api/bin')).body as { drafts: unknown[] }).drafts).toEqual([]);
    expect((await editor.post(`/api/drafts/${id}/restore`)).status).toBe(403);

    const restored = await owner.client.post(`/api/drafts/${id}/restore`);
    expect(restored.status).toBe(200);
    expect((restored.body as { draft: { name: string; version: number } }).draft).toMatchObject({ name: 'Binned mat', version: 1 });
    expect((await editor.get(`/api/drafts/${id}`)).status).toBe(200);
    expect((await server.client().get(`/api/shared/${token}`)).status).toBe(200);
    // Restoring a draft not in the Bin: there is no such draft in the Bin.
    expect((await owner.client.post(`/api/drafts/${id}/restore`)).status).toBe(404);

    // After 30 days it cannot be restored, and the next look at any Bin deletes it with its history.
    expect((await owner.client.delete(`/api/drafts/${id}`)).status).toBe(204);
    await server.ctx.models.Draft.update({ binnedAt: new Date(Date.now() - 30 * 86_400_000 - 60_000) }, { where: { id } });
    expect((await owner.client.post(`/api/drafts/${id}/restore`)).status).toBe(404);
    await editor.get('/api/bin');
    expect(await server.ctx.models.Draft.count({ where: { id } })).toBe(0);
    expect(await server.ctx.models.DraftVersion.count({ where: { draftId: id } })).toBe(0);
  });
});
