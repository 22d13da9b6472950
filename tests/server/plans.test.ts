import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { PlanDefaultsResponse, PlanResponse, ProgressResponse, WeavingResult } from '../../shared/api/plans';
import { yarnPairKey } from '../../shared/api/plans';
import { defaultPlan, planDocumentSchema } from '../../shared/plan/plan-schema';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { createDraft } from '../../server/services/drafts';
import { averageAllowances } from '../../server/services/plans';
import { startTestServer, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server.close(); });

/** A studio draft with an editor and a viewer signed in; the owner never signs in. */
async function scene() {
  const editor = await server.signInWithRole('editor');
  const draft = await createDraft(server.ctx.models, { ownerId: editor.ownerId, studioId: editor.studioId, document: pointTwillScarf(), tags: [] });
  const viewerUser = await server.createUser({ name: 'Student weaver' });
  await server.ctx.models.Membership.create({ studioId: editor.studioId, userId: viewerUser.id, role: 'viewer' });
  const viewer = server.client();
  await viewer.signIn(viewerUser.email);
  const outsider = (await server.signInWithRole('owner')).client;
  return { editor: editor.client, viewer, outsider, draftId: draft.id, base: `/api/drafts/${draft.id}` };
}

const workingOrder = { side: 'back', direction: 'right-to-left', shaftNumbering: 'near' } as const;

describe('plans', () => {
  it('is empty until an editor saves one; everyone who can see the draft reads it', async () => {
    const s = await scene();
    expect((await s.viewer.get(`${s.base}/plan`)).body).toEqual({ plan: null, updatedAt: null, updatedByName: null });

    const input = { unit: 'cm', finishedWidth: 40, finishedLength: 150, pieces: 2, warpYarn: { text: '8/2 cotton' }, weave: 'twill22' };
    const saved = await s.editor.send('put', `${s.base}/plan`, input);
    expect(saved.status).toBe(200);
    const body = saved.body as PlanResponse;
    // Defaults are filled in by the plan schema and stored that way.
    expect(body.plan).toEqual(planDocumentSchema.parse(input));
    expect(body.updatedByName).toBe('Test editor');

    const read = (await s.viewer.get(`${s.base}/plan`)).body as PlanResponse;
    expect(read.plan?.pieces).toBe(2);
    expect(read.plan?.warpYarn.text).toBe('8/2 cotton');

    const again = await s.editor.send('put', `${s.base}/plan`, { ...input, pieces: 3 });
    expect((again.body as PlanResponse).plan?.pieces).toBe(3);
    expect(await server.ctx.models.DraftPlan.count({ where: { draftId: s.draftId } })).toBe(1);
  });

  it('refuses viewers (403) and outsiders (404)', async () => {
    const s = await scene();
    const plan = defaultPlan();
    expect((await s.viewer.send('put', `${s.base}/plan`, plan)).status).toBe(403);
    expect((await s.outsider.send('put', `${s.base}/plan`, plan)).status).toBe(404);
    expect((await s.outsider.get(`${s.base}/plan`)).status).toBe(404);
  });

  it('names the bad fields of a plan (400)', async () => {
    const s = await scene();
    const res = await s.editor.send('put', `${s.base}/plan`, {
      finishedWidth: -3, finishedLength: 70, warpYarn: { text: '12 wpi' }, allowances: { takeUp: 1.2 },
    });
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields).sort()).toEqual(['allowances.takeUp', 'finishedWidth', 'warpYarn.text']);
    expect(res.body.error.fields['warpYarn.text']).toMatch(/wraps per inch/);
    expect((await s.editor.send('put', `${s.base}/plan`, { finishedWidth: 10 })).status).toBe(400);
  });

  it('refuses a yarn for a colour the draft lacks (422)', async () => {
    const s = await scene();
    const res = await s.editor.send('put', `${s.base}/plan`, { ...defaultPlan(), warpYarn: { text: '8/2 cotton', byColor: { 7: '20/2 linen' } } });
    expect(res.status).toBe(422);
    expect(res.body.error.fields).toEqual({ 'warpYarn.byColor.7': 'The draft has no colour 8.' });
  });
});

describe('progress at the loom', () => {
  it('is kept per person, per list, with the working order', async () => {
    const s = await scene();
    expect((await s.viewer.get(`${s.base}/progress`)).body).toEqual({ progress: null });

    expect((await s.viewer.send('put', `${s.base}/progress`, { list: 'threading', position: 6, settings: workingOrder })).status).toBe(200);
    await s.viewer.send('put', `${s.base}/progress`, { list: 'sleying', position: 2, settings: workingOrder });
    const mine = ((await s.viewer.get(`${s.base}/progress`)).body as ProgressResponse).progress!;
    expect(mine.list).toBe('sleying');
    expect(mine.positions).toEqual({ threading: 6, sleying: 2 });
    expect(mine.settings).toEqual(workingOrder);

    // The editor's place on the same draft is their own.
    expect(((await s.editor.get(`${s.base}/progress`)).body as ProgressResponse).progress).toBeNull();
  });

  it('keeps a newer place when a save queued offline arrives late', async () => {
    const s = await scene();
    const now = Date.now();
    await s.viewer.send('put', `${s.base}/progress`, { list: 'threading', position: 9, settings: workingOrder, movedAt: new Date(now).toISOString() });
    const late = await s.viewer.send('put', `${s.base}/progress`, {
      list: 'threading', position: 4, settings: workingOrder, movedAt: new Date(now - 60_000).toISOString(),
    });
    expect(late.status).toBe(200);
    expect((late.body as ProgressResponse).progress?.positions.threading).toBe(9);
    const next = await s.viewer.send('put', `${s.base}/progress`, {
      list: 'threading', position: 10, settings: workingOrder, movedAt: new Date(now + 1000).toISOString(),
    });
    expect((next.body as ProgressResponse).progress?.positions.threading).toBe(10);
  });

  it('finding 10: a place saved with a time in the future does not freeze the place marker', async () => {
    const s = await scene();
    const put = (position: number, movedAt?: string) =>
      s.viewer.send('put', `${s.base}/progress`, { list: 'weaving', position, settings: workingOrder, ...(movedAt ? { movedAt } : {}) });
    // A tablet whose clock runs a year ahead.
    const ahead = await put(12, new Date(Date.now() + 365 * 24 * 3600_000).toISOString());
    expect(ahead.status).toBe(200);
    const stored = (ahead.body as ProgressResponse).progress!;
    expect(stored.positions.weaving).toBe(12);
    expect(Date.parse(stored.movedAt)).toBeLessThanOrEqual(Date.now());

    // A device with the right clock moves on, with its own time or none.
    expect(((await put(13, new Date().toISOString())).body as ProgressResponse).progress!.positions.weaving).toBe(13);
    expect(((await put(14)).body as ProgressResponse).progress!.positions.weaving).toBe(14);
  });

  it('refuses bad input (400) and outsiders (404)', async () => {
    const s = await scene();
    for (const body of [
      { list: 'warping', position: 1, settings: workingOrder },
      { list: 'threading', position: -1, settings: workingOrder },
      { list: 'threading', position: 1.5, settings: workingOrder },
      { list: 'threading', position: 1, settings: { ...workingOrder, side: 'top' } },
      { list: 'threading', position: 1, settings: workingOrder, movedAt: 'yesterday' },
    ]) {
      expect((await s.viewer.send('put', `${s.base}/progress`, body)).status, JSON.stringify(body)).toBe(400);
    }
    expect((await s.outsider.send('put', `${s.base}/progress`, { list: 'threading', position: 1, settings: workingOrder })).status).toBe(404);
  });
});

describe('results', () => {
  const sizes = { unit: 'inch', widthInReed: 20, lengthOnLoom: 100, widthOffLoom: 18, lengthOffLoom: 92 };

  it('stores the measured take-up, draw-in and, once finished, shrinkage', async () => {
    const s = await scene();
    const first = await s.viewer.post(`${s.base}/results`, sizes);
    expect(first.status).toBe(201);
    const a = (first.body.result as WeavingResult).allowances;
    // (100 − 92) ÷ 100 and (20 − 18) ÷ 20: the definitions in shared/plan/results.ts.
    expect(a.takeUp).toBeCloseTo(0.08, 12);
    expect(a.drawIn).toBeCloseTo(0.1, 12);
    expect(a.lengthShrinkage).toBeUndefined();

    const finished = await s.viewer.post(`${s.base}/results`, { ...sizes, widthFinished: 16.2, lengthFinished: 82.8, notes: 'Hot wash' });
    const b = (finished.body.result as WeavingResult).allowances;
    expect(b.widthShrinkage).toBeCloseTo(0.1, 12);
    expect(b.lengthShrinkage).toBeCloseTo(0.1, 12);

    const list = (await s.editor.get(`${s.base}/results`)).body.results as WeavingResult[];
    expect(list.map((r) => [r.weaverName, r.mine, r.notes])).toEqual([['Student weaver', false, 'Hot wash'], ['Student weaver', false, '']]);
  });

  it('refuses sizes that grow, half-given finished sizes, and non-numbers (400)', async () => {
    const s = await scene();
    const bad = [
      { ...sizes, widthOffLoom: 21 },
      { ...sizes, lengthOffLoom: 101 },
      { ...sizes, widthFinished: 17 },
      { ...sizes, widthFinished: 19, lengthFinished: 80 },
      { ...sizes, widthInReed: 0 },
      { ...sizes, lengthOnLoom: '100' },
      { ...sizes, unit: 'yard' },
    ];
    for (const body of bad) expect((await s.viewer.post(`${s.base}/results`, body)).status, JSON.stringify(body)).toBe(400);
    expect((await s.outsider.post(`${s.base}/results`, sizes)).status).toBe(404);
  });

  it('offers each weaver their own measured allowances, per pair of yarns', async () => {
    const s = await scene();
    await s.editor.send('put', `${s.base}/plan`, { ...defaultPlan(), warpYarn: { text: '8/2 Cotton' }, weftYarn: { text: '8/2 cotton' } });
    // The yarns come from the saved plan when the result does not name them.
    await s.viewer.post(`${s.base}/results`, sizes);
    await s.viewer.post(`${s.base}/results`, { ...sizes, lengthOffLoom: 88, widthOffLoom: 19 });
    await s.viewer.post(`${s.base}/results`, { ...sizes, warpYarn: '2/10 worsted', weftYarn: '2/10 worsted', lengthOffLoom: 95 });

    const mine = (await s.viewer.get('/api/me/plan-defaults')).body as PlanDefaultsResponse;
    expect(mine.overall?.results).toBe(3);
    const cotton = mine.byYarn.find((g) => g.key === yarnPairKey('8/2 cotton', '8/2 cotton'))!;
    expect(cotton.results).toBe(2);
    expect(cotton.warpYarn).toBe('8/2 Cotton');
    // Means of 0.08 and 0.12 take-up, 0.1 and 0.05 draw-in.
    expect(cotton.allowances.takeUp).toBeCloseTo(0.1, 12);
    expect(cotton.allowances.drawIn).toBeCloseTo(0.075, 12);
    expect(mine.overall?.allowances.takeUp).toBeCloseTo((0.08 + 0.12 + 0.05) / 3, 12);

    // The editor recorded nothing.
    expect((await s.editor.get('/api/me/plan-defaults')).body).toEqual({ overall: null, byYarn: [] });
  });
});

describe('averageAllowances', () => {
  const allowance = fc.option(fc.double({ min: 0, max: 0.99, noNaN: true }), { nil: undefined });
  const record = fc.record({ takeUp: allowance, drawIn: allowance, lengthShrinkage: allowance, widthShrinkage: allowance });

  it('gives each allowance between the smallest and largest measured, and leaves out what nobody measured', () => {
    fc.assert(
      fc.property(fc.array(record, { maxLength: 12 }), (list) => {
        const mean = averageAllowances(list);
        for (const key of ['takeUp', 'drawIn', 'lengthShrinkage', 'widthShrinkage'] as const) {
          const values = list.map((a) => a[key]).filter((v): v is number => v !== undefined);
          if (values.length === 0) expect(mean[key]).toBeUndefined();
          else {
            expect(mean[key]!).toBeGreaterThanOrEqual(Math.min(...values) - 1e-12);
            expect(mean[key]!).toBeLessThanOrEqual(Math.max(...values) + 1e-12);
          }
        }
      }),
    );
  });
});
