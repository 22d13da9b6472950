/*
 * Where the time of one library list and one 400 × 400 save goes: `npx tsx tests/bench/drafts-load-profile.ts`
 * with the test database up (as for drafts-load.ts). Counts the SQL statements each request sends
 * (Sequelize's logging with its benchmark option) and times the engine steps of a save on their own.
 */
import { performance } from 'node:perf_hooks';
import { parseDraft } from '../../shared/weave';
import { derivedColumns, draftStats, structureTags, thumbnailPng } from '../../server/services/draft-derived';
import { createDraft } from '../../server/services/drafts';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { startTestServer } from '../helpers/server';
import { bigDraft } from './drafts-load-data';

const REPEAT = 20;

function timed<T>(what: string, work: () => T): T {
  let result = work();
  const start = performance.now();
  for (let i = 0; i < REPEAT; i++) result = work();
  console.log(`${what.padEnd(36)} ${((performance.now() - start) / REPEAT).toFixed(2)} ms`);
  return result;
}

const server = await startTestServer();
try {
  const { ctx } = server;
  const user = await server.createUser({ name: 'Profiler' });
  const small = pointTwillScarf();
  const derived = derivedColumns(small);
  await ctx.models.Draft.bulkCreate(Array.from({ length: 200 }, (_, k) => ({
    ownerId: user.id, studioId: null, name: `Profile draft ${k}`, document: small, tags: ['bench'], version: 1, ...derived,
  })));
  const target = await createDraft(ctx.models, { ownerId: user.id, studioId: null, document: bigDraft(1), tags: [] });
  const client = server.client();
  await client.signIn(user.email);

  const statements: { sql: string; ms: number }[] = [];
  // Sequelize reads these options on every query, so setting them here turns logging on from now.
  const options = (ctx.sequelize as unknown as { options: { benchmark: boolean; logging: false | ((sql: string, ms?: number) => void) } }).options;
  options.benchmark = true;
  options.logging = (sql, ms) => { statements.push({ sql, ms: ms ?? 0 }); };
  const trace = async (what: string, request: () => Promise<{ status: number }>) => {
    statements.length = 0;
    const start = performance.now();
    const res = await request();
    const total = performance.now() - start;
    console.log(`\n${what}: ${res.status}, ${statements.length} statements, ${total.toFixed(1)} ms in all`);
    for (const s of statements) console.log(`  ${String(s.ms).padStart(4)} ms  ${s.sql.slice(0, 150)}`);
  };

  // Warm up (first queries prepare connections), then trace.
  await client.get('/api/drafts');
  await trace('GET /api/drafts', () => client.get('/api/drafts'));
  const text = JSON.stringify(bigDraft(2));
  let version = 1;
  for (let i = 0; i < 2; i++) {
    await trace(`PUT /api/drafts/${target.id} (400 × 400, ${(text.length / 1024).toFixed(0)} KiB)`, async () => {
      const res = await client.send('put', `/api/drafts/${target.id}`, { baseVersion: version, message: 'profile', document: JSON.parse(text) });
      version = res.body.version ?? version;
      return res;
    });
  }
  options.logging = false;

  // One request at a time: the service time of each, with nothing else in the app's queue.
  const sequential = async (what: string, n: number, request: () => Promise<unknown>) => {
    const start = performance.now();
    for (let i = 0; i < n; i++) await request();
    console.log(`${what.padEnd(36)} ${((performance.now() - start) / n).toFixed(2)} ms (mean of ${n}, one at a time)`);
  };
  console.log('');
  await sequential('GET /api/drafts', 200, () => client.get('/api/drafts'));
  await sequential('PUT /api/drafts/:id (400 × 400)', 50, async () => {
    const res = await client.send('put', `/api/drafts/${target.id}`, { baseVersion: version, message: 'profile', document: JSON.parse(text) });
    version = res.body.version;
  });

  console.log(`\nEngine work in a save, mean of ${REPEAT}:`);
  const json = timed('JSON.parse of the body', () => JSON.parse(text) as unknown);
  const doc = timed('parseDraft', () => parseDraft(json));
  timed('draftStats', () => draftStats(doc));
  timed('structureTags', () => structureTags(doc));
  timed('thumbnailPng', () => thumbnailPng(doc));
  timed('JSON.stringify of the document', () => JSON.stringify(doc));
} finally {
  await server.close();
}
