import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { draftDetailResponseSchema, draftListResponseSchema, type DraftSummary } from '../../shared/api/drafts';
import { parseDraft } from '../../shared/weave';
import { colourAndWeaveSampler, doubleWeaveTableMat, pointTwillScarf, straightTwillTrial } from '../../server/db/seeders/demo-drafts';
import { createDraft, draftStats } from '../../server/services/drafts';
import { startTestServer, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server.close(); });

describe('demo drafts', () => {
  it('are valid documents with the sizes a weaver would count', () => {
    // Counted by hand from the construction: point draw on 4 shafts repeats every 6 ends, 10 times.
    expect(draftStats(pointTwillScarf())).toEqual({ ends: 60, picks: 60, shafts: 4, colors: 2 });
    expect(draftStats(colourAndWeaveSampler())).toEqual({ ends: 48, picks: 48, shafts: 4, colors: 2 });
    expect(draftStats(straightTwillTrial())).toEqual({ ends: 24, picks: 24, shafts: 4, colors: 2 });
    // 11 profile blocks × 40 ends and 14 × 40 picks; two shafts per layer per block, two blocks.
    expect(draftStats(doubleWeaveTableMat('harbour'))).toEqual({ ends: 440, picks: 560, shafts: 8, colors: 3 });
    for (const draft of [pointTwillScarf(), colourAndWeaveSampler(), straightTwillTrial(), doubleWeaveTableMat('meadow')]) {
      expect(parseDraft(JSON.parse(JSON.stringify(draft)))).toEqual(draft);
    }
  });
});

describe('drafts visibility', () => {
  async function scene() {
    const { client: viewer, user, studioId, ownerId } = await server.signInWithRole('viewer');
    const { models } = server.ctx;
    const studioDraft = await createDraft(models, { ownerId, studioId, document: pointTwillScarf(), tags: ['twill', 'scarf'] });
    const ownDraft = await createDraft(models, { ownerId: user.id, studioId: null, document: colourAndWeaveSampler(), tags: ['sampler'] });
    const privateOfOwner = await createDraft(models, { ownerId, studioId: null, document: straightTwillTrial(), tags: ['twill'] });
    return { viewer, user, studioId, studioDraft, ownDraft, privateOfOwner };
  }

  it('lists own drafts and studio drafts, never another member\'s personal drafts', async () => {
    const s = await scene();
    const list = draftListResponseSchema.parse((await s.viewer.get('/api/drafts')).body);
    expect(list.items.map((d) => d.id).sort()).toEqual([s.studioDraft.id, s.ownDraft.id].sort());
    expect(list.total).toBe(2);
    const studioItem = list.items.find((d) => d.id === s.studioDraft.id)!;
    expect(studioItem).toMatchObject({ name: 'Point twill scarf', studioId: s.studioId, studioName: 'Test studio', ends: 60, picks: 60, shafts: 4, version: 1, thumbnailUrl: `/api/drafts/${s.studioDraft.id}/thumbnail.png?v=1` });
    expect((await s.viewer.get(`/api/drafts/${s.privateOfOwner.id}`)).status).toBe(404);
  });

  it('returns the document and the caller\'s role on a draft', async () => {
    const s = await scene();
    const studio = draftDetailResponseSchema.parse((await s.viewer.get(`/api/drafts/${s.studioDraft.id}`)).body);
    expect(studio.draft.role).toBe('viewer');
    expect(parseDraft(studio.draft.document)).toEqual(pointTwillScarf());
    const own = draftDetailResponseSchema.parse((await s.viewer.get(`/api/drafts/${s.ownDraft.id}`)).body);
    expect(own.draft.role).toBe('owner');
  });

  it('filters by text, tag, shafts and studio, and pages', async () => {
    const s = await scene();
    const ids = async (query: string) =>
      (draftListResponseSchema.parse((await s.viewer.get(`/api/drafts?${query}`)).body).items as DraftSummary[]).map((d) => d.id);
    expect(await ids('q=twill')).toEqual([s.studioDraft.id]);
    expect(await ids('q=%25')).toEqual([]);
    expect(await ids('tag=sampler')).toEqual([s.ownDraft.id]);
    expect(await ids('tag=twill')).toEqual([s.studioDraft.id]);
    // Structures found by the server, not the weaver's tags (the sampler is plain weave underneath).
    expect(await ids('structure=twill')).toEqual([s.studioDraft.id]);
    expect(await ids('structure=plain%20weave')).toEqual([s.ownDraft.id]);
    expect(await ids('shafts=8')).toEqual([]);
    expect(await ids(`studio=${s.studioId}`)).toEqual([s.studioDraft.id]);
    const page2 = draftListResponseSchema.parse((await s.viewer.get('/api/drafts?pageSize=1&page=2&sort=name&dir=asc')).body);
    expect(page2).toMatchObject({ total: 2, page: 2, pageSize: 1 });
    expect(page2.items.map((d) => d.name)).toEqual(['Point twill scarf']);
    expect((await s.viewer.get('/api/drafts?pageSize=1000')).status).toBe(400);
  });

  it('sorts by name and size in either direction', async () => {
    const s = await scene();
    await fc.assert(fc.asyncProperty(
      fc.constantFrom('name', 'size', 'updated'), fc.constantFrom('asc', 'desc'),
      async (sort, dir) => {
        const items = draftListResponseSchema.parse((await s.viewer.get(`/api/drafts?sort=${sort}&dir=${dir}`)).body).items;
        const key = (d: DraftSummary) => (sort === 'name' ? d.name : sort === 'size' ? d.ends * d.picks : d.updatedAt);
        const sorted = [...items].sort((a, b) => (key(a) < key(b) ? -1 : key(a) > key(b) ? 1 : a.id - b.id));
        if (dir === 'desc') sorted.reverse();
        expect(items.map((d) => d.id)).toEqual(sorted.map((d) => d.id));
      },
    ), { numRuns: 12, seed: 7 });
  });
});
