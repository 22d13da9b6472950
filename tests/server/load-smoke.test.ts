import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { createDraft } from '../../server/services/drafts';
import { availableRoutes, findLostSaves, formatFigures, runMixedLoad, signInAll, type Weaver } from '../bench/load-mix';
import { startTestServer, TEST_PASSWORD, type TestServer } from '../helpers/server';

/*
 * The load check of `npm run load` in small: ten weavers on their own connections for a few seconds
 * against the app on a real port, every answer the expected one, and every save the server
 * acknowledged found in the history afterwards.
 */

const WEAVERS = 10;
const SECONDS = 4;

let server: TestServer;
let listening: Server;
let base: string;
let weavers: Weaver[];
/** Requests the app is still handling: autocannon hangs up at the end without waiting for them. */
let active = 0;

beforeAll(async () => {
  server = await startTestServer();
  listening = server.app.listen(0, '127.0.0.1');
  listening.on('request', (_req, res) => {
    active += 1;
    res.once('close', () => { active -= 1; });
  });
  await new Promise((resolve) => listening.once('listening', resolve));
  base = `http://127.0.0.1:${(listening.address() as AddressInfo).port}`;
  const people = [];
  for (let i = 0; i < WEAVERS; i++) {
    const user = await server.createUser({ name: `Load weaver ${i}` });
    const draft = await createDraft(server.ctx.models, { ownerId: user.id, studioId: null, document: pointTwillScarf(), tags: ['load'] });
    people.push({ email: user.email, draftId: draft.id, version: 1 });
  }
  weavers = await signInAll(base, people, TEST_PASSWORD);
}, 60_000);

afterAll(async () => {
  // Closing the database under a request still running would only fail it noisily.
  for (let waited = 0; active > 0 && waited < 20_000; waited += 50) await new Promise((r) => setTimeout(r, 50));
  if (listening) {
    listening.closeAllConnections();
    await new Promise((resolve) => listening.close(resolve));
  }
  await server?.close();
});

describe('mixed traffic from many weavers at once', () => {
  it('answers every request as expected and loses no acknowledged save', async () => {
    const routes = availableRoutes();
    const result = await runMixedLoad({ base, weavers, seconds: SECONDS, document: pointTwillScarf(), routes, printEvery: 5, timeout: 20 });
    console.log(`load smoke:\n${formatFigures(result)}`);

    expect(result.errors, formatFigures(result)).toBe(0);
    for (const route of result.routes) expect(route.requests, `requests on ${route.route}`).toBeGreaterThan(0);
    // Every weaver saved, and each kept its own sequence of versions.
    expect(new Set(result.saves.map((s) => s.draftId)).size).toBe(WEAVERS);

    const { checked, lost } = await findLostSaves(base, weavers, result.saves);
    console.log(`load smoke: ${checked} acknowledged saves checked, ${lost.length} lost`);
    expect(lost).toEqual([]);
    expect(checked).toBe(result.saves.length);
  }, 60_000);

  it('would notice a lost save', async () => {
    // The check itself must be able to fail: a save the history does not hold is reported.
    const weaver = weavers[0];
    const missing = { draftId: weaver.draftId, version: 10_000, marker: 'never saved' };
    const { lost } = await findLostSaves(base, [weaver], [missing]);
    expect(lost).toHaveLength(2);
  });
});
