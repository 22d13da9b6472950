/*
 * Drafts service load test: `npx tsx tests/bench/drafts-load.ts` with the test database up
 * (`node scripts/db.mjs test`, then export the SHEDWRIGHT_DB_* lines it prints).
 *
 * Starts the real app (in processes of its own: drafts-load-server.ts) on a free loopback port
 * over MariaDB, gives a fresh weaver 1000 drafts, then runs autocannon with 50 connections for 20 s
 * each on:
 *   - list: GET /api/drafts (the first page of the library);
 *   - save: PUT /api/drafts/:id with a 400-end × 400-pick draft. Every save must carry the version
 *     it is based on, so each in-flight save takes a draft of its own from a pool and returns it with
 *     the new version when the answer comes (a 409 here would be a bug in the test, and is counted).
 * Prints requests/s, p50/p95/p99 latency and error counts. Targets: p95 ≤ 50 ms (list),
 * ≤ 100 ms (save), zero errors; also the CPU time per request of the app, MariaDB and autocannon, and
 * how much of the machine's CPU was left idle.
 * Options: --duration=20 --connections=50 --only=list|save --cpu-prof=DIR;
 * --server=express|node measures a floor instead of the app (save-floors.ts: the save's own work
 * without the app around it, and for express the library page's too).
 */
import { spawn } from 'node:child_process';
import { once } from 'node:events';
import { availableParallelism } from 'node:os';
import { readFileSync } from 'node:fs';
import autocannon from 'autocannon';
import { QueryTypes } from 'sequelize';
import { createContext } from '../../server/context';
import { migrate } from '../../server/db/migrate';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { derivedColumns } from '../../server/services/draft-derived';
import { createDraft } from '../../server/services/drafts';
import { createAccount } from '../../server/services/auth';
import { testConfig, uniqueEmail } from '../helpers/test-db';
import { bigDraft } from './drafts-load-data';
import { cpuMs, idleMs, stolenMs, treeCpuMs } from './proc-stat';

const option = (name: string) => process.argv.find((a) => a.startsWith(`--${name}=`))?.split('=')[1];
const arg = (name: string, fallback: number) => Number(option(name) ?? fallback);
const DURATION_S = arg('duration', 20);
const CONNECTIONS = arg('connections', 50);
const SERVER = option('server') ?? 'app';
// The node:http floor answers only the save.
const ONLY = SERVER === 'node' ? 'save' : option('only');
const LIBRARY_SIZE = 1000;
const PASSWORD = 'bench-password-loom';

function percentile(sorted: number[], p: number): number {
  if (sorted.length === 0) return NaN;
  return sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)];
}


interface Figures {
  name: string;
  /** CPU ms per request of the app process and of MariaDB during the run. */
  appCpu: number;
  dbCpu: number;
  /** The same for this process, which runs autocannon. */
  loadCpu: number;
  /** Share of the machine's CPU time left idle during the run. */
  idleShare: number;
  /** CPU ms the host took from this machine during the run (see stolenMs). */
  stolen: number;
  requests: number;
  perSecond: number;
  p50: number;
  p95: number;
  p99: number;
  errors: number;
  timeouts: number;
  non2xx: number;
}

async function run(name: string, options: autocannon.Options): Promise<Figures> {
  const times: number[] = [];
  const cpuBefore = [treeCpuMs(child.pid!), cpuMs(dbPid), stolenMs(), cpuMs(process.pid), idleMs()];
  const instance = autocannon({ connections: CONNECTIONS, duration: DURATION_S, ...options });
  instance.on('response', (_client: unknown, _status: number, _bytes: number, responseTime: number) => { times.push(responseTime); });
  const result = await instance;
  times.sort((a, b) => a - b);
  const perRequest = (before: number, now: number) => (now - before) / result.requests.total;
  return {
    name,
    appCpu: perRequest(cpuBefore[0], treeCpuMs(child.pid!)),
    dbCpu: perRequest(cpuBefore[1], cpuMs(dbPid)),
    loadCpu: perRequest(cpuBefore[3], cpuMs(process.pid)),
    idleShare: (idleMs() - cpuBefore[4]) / (DURATION_S * 1000 * availableParallelism()),
    stolen: stolenMs() - cpuBefore[2],
    requests: result.requests.total,
    perSecond: result.requests.average,
    p50: percentile(times, 50),
    p95: percentile(times, 95),
    p99: percentile(times, 99),
    errors: result.errors,
    timeouts: result.timeouts,
    non2xx: result.non2xx,
  };
}

/** Signs in over HTTP as a browser would; returns the session cookie and its CSRF token. */
async function signIn(base: string, email: string): Promise<{ cookie: string; csrf: string }> {
  const first = await fetch(`${base}/api/csrf`);
  const cookieOf = (res: Response) => res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  const { token } = await first.json() as { token: string };
  const res = await fetch(`${base}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', 'x-csrf-token': token, cookie: cookieOf(first) },
    body: JSON.stringify({ email, password: PASSWORD }),
  });
  if (!res.ok) throw new Error(`sign-in failed: ${res.status}`);
  const { csrfToken } = await res.json() as { csrfToken: string };
  return { cookie: cookieOf(res), csrf: csrfToken };
}

const smtp = await startFakeSmtp(0);
const ctx = createContext(testConfig(), smtp);
await migrate(ctx.sequelize);
// MariaDB's own CPU time is read from /proc too, by the pid it reports.
const [{ pidFile }] = await ctx.sequelize.query<{ pidFile: string }>('SELECT @@pid_file AS pidFile', { type: QueryTypes.SELECT });
const dbPid = Number(readFileSync(pidFile, 'utf8').trim());
// --cpu-prof=DIR writes a V8 profile of the app process there when it exits.
const profileDir = option('cpu-prof');
const profile = profileDir ? ['--cpu-prof', `--cpu-prof-dir=${profileDir}`] : [];
const serverOptions = process.argv.filter((a) => a.startsWith("--server="));
const child = spawn(process.execPath, [...profile, '--import', 'tsx', new URL('./drafts-load-server.ts', import.meta.url).pathname, ...serverOptions], {
  stdio: ['ignore', 'pipe', 'inherit'],
});
const [line] = await Promise.race([
  once(child.stdout!, 'data') as Promise<Buffer[]>,
  once(child, 'exit').then(() => { throw new Error('the app process exited before listening'); }),
]);
const base = `http://127.0.0.1:${/listening (\d+)/.exec(String(line))![1]}`;

const email = uniqueEmail('bench');
const user = await createAccount(ctx.models, { email, password: PASSWORD, name: 'Load tester' });
try {
  const small = pointTwillScarf();
  const derived = derivedColumns(small);
  console.log(`Seeding ${LIBRARY_SIZE} drafts…`);
  for (let i = 0; i < LIBRARY_SIZE; i += 200) {
    const rows = await ctx.models.Draft.bulkCreate(Array.from({ length: 200 }, (_, k) => ({
      ownerId: user.id, studioId: null, name: `Library draft ${i + k + 1}`, document: small, tags: ['bench'], version: 1, ...derived,
    })));
    await ctx.models.DraftVersion.bulkCreate(rows.map((r) => ({ draftId: r.id, version: 1, firstVersion: 1, authorId: user.id, message: 'First version', document: small })));
  }
  // One more draft than connections, so a connection never waits for a free one.
  const saveDrafts = [];
  for (let i = 0; i < CONNECTIONS + 1; i++) {
    saveDrafts.push(await createDraft(ctx.models, { ownerId: user.id, studioId: null, document: bigDraft(i), tags: [] }));
  }
  // The floors sign nobody in: the list floor is told whose library to read.
  const { cookie, csrf } = SERVER === 'app' ? await signIn(base, email) : { cookie: '', csrf: '' };
  const headers = { cookie, 'x-csrf-token': csrf, 'content-type': 'application/json' };
  const listUrl = SERVER === 'app' ? `${base}/api/drafts` : `${base}/api/drafts?as=${user.id}`;

  const runs: Figures[] = [];
  if (ONLY !== 'save') runs.push(await run('list (GET /api/drafts)', { url: listUrl, headers }));

  const documents = saveDrafts.map((_, i) => JSON.stringify(bigDraft(1000 + i)));
  const free = saveDrafts.map((d, i) => ({ id: d.id, version: 1, doc: documents[i] }));
  const saveRequest: autocannon.Request = {
    method: 'PUT',
    setupRequest: (req, context) => {
      const slot = free.shift();
      if (!slot) throw new Error('more saves in flight than drafts in the pool');
      context.slot = slot;
      return { ...req, path: `/api/drafts/${slot.id}`, body: `{"baseVersion":${slot.version},"message":"load test","document":${slot.doc}}` };
    },
    onResponse: (status, body, context) => {
      const slot = context.slot as (typeof free)[number];
      if (status === 200) slot.version = (JSON.parse(body) as { version: number }).version;
      free.push(slot);
    },
  };
  if (ONLY !== 'list') runs.push(await run('save (PUT /api/drafts/:id, 400 × 400)', { url: base, headers, requests: [saveRequest] }));

  console.log(`\n${CONNECTIONS} connections, ${DURATION_S} s each, ${LIBRARY_SIZE} drafts in the library`);
  console.table(runs.map((f) => ({
    run: f.name,
    'req/s': Math.round(f.perSecond),
    requests: f.requests,
    'p50 ms': f.p50,
    'p95 ms': f.p95,
    'p99 ms': f.p99,
    errors: f.errors,
    timeouts: f.timeouts,
    'non-2xx': f.non2xx,
    'app CPU ms/req': f.appCpu.toFixed(2),
    'MariaDB CPU ms/req': f.dbCpu.toFixed(2),
    'autocannon CPU ms/req': f.loadCpu.toFixed(2),
    'CPU idle': `${Math.round(100 * f.idleShare)} %`,
    'host steal ms': f.stolen,
  })));
  const verdict = (f: Figures, target: number) => `${f.name}: p95 ${f.p95} ms (target ≤ ${target} ms) ${f.p95 <= target ? 'met' : 'MISSED'}, `
    + `${f.errors + f.timeouts + f.non2xx === 0 ? 'no errors' : 'ERRORS'}`;
  for (const f of runs) console.log(verdict(f, f.name.startsWith('list') ? 50 : 100));
  // One line for tests/bench/floor-ratios.ts.
  console.log(`FIGURES ${JSON.stringify(Object.fromEntries(runs.map((f) => [f.name.split(' ')[0], f.perSecond])))}`);
} finally {
  child.kill('SIGTERM');
  await once(child, 'exit');
  // The weaver's drafts and their versions go with it (foreign keys cascade): some tens of MB a run,
  // which would otherwise pile up in the test database that other tests run against.
  console.log('Removing the load test\'s weaver and drafts…');
  await ctx.models.User.destroy({ where: { id: user.id } });
  await ctx.close();
  await smtp.close();
}
