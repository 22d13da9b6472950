import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startMariaDB, type MariaDB } from '../../scripts/lib/mariadb.mjs';
import { loadConfig } from '../../server/config';
import { straightTwillTrial } from '../../server/db/seeders/demo-drafts';
import { createDraft } from '../../server/services/drafts';
import type { Models } from '../../server/models';
import { parseDraft, type Draft } from '../../shared/weave';
import { freePort } from '../helpers/e2e';
import { startTestServer, TEST_PASSWORD, type TestServer } from '../helpers/server';

const root = new URL('../..', import.meta.url).pathname;
const work = mkdtempSync(join(tmpdir(), 'shedwright-faults-'));
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Longest a request may take to answer while MariaDB is down: the 3 s connect timeout plus slack. */
const DOWN_ANSWER_BOUND_MS = 4000;
/**
 * Longest a request may take while MariaDB is frozen: "about 5 s" (the 4 s socket timeout, or the
 * 5 s wait for a pooled connection), with slack for a loaded machine; and how long the test's client
 * waits before it calls a request hung.
 */
const FROZEN_ANSWER_BOUND_MS = 8000;
const FROZEN_CLIENT_PATIENCE_MS = 20_000;
/**
 * How long the test waits for traffic to make progress (saves acknowledged, a restarted server
 * answering). These bound nothing the app promises, only how long a machine shared with other test
 * runs may take; the bounds above are the promises.
 */
const PROGRESS_PATIENCE_MS = 90_000;
/** Each test waits for progress a few times over. */
const TEST_TIMEOUT_MS = 6 * PROGRESS_PATIENCE_MS;

let db: MariaDB;
let dbPort = 0;
let dbDir = '';
let server: TestServer;
const database = 'shedwright_faults';

const startDb = () => startMariaDB({ dir: dbDir, port: dbPort, database, user: 'shedwright' });

beforeAll(async () => {
  dbPort = await freePort();
  dbDir = join(root, '.data', `faults-test-${dbPort}`);
  db = await startDb();
  server = await startTestServer({ db: loadConfig({ ...process.env, ...db.env }).db });
}, 2 * PROGRESS_PATIENCE_MS);

afterAll(async () => {
  await server?.close();
  await db?.stop();
  rmSync(dbDir, { recursive: true, force: true });
  rmSync(work, { recursive: true, force: true });
});

type Answer = { status: number; body: { version?: number; error?: { code: string; message: string }; current?: { version: number } } } | 'no answer';
type Put = (draftId: number, body: unknown) => Promise<Answer>;

/**
 * Saves one draft over and over, each save a distinct document built on the last version it knows.
 * Records every save the server acknowledged (200) and every document it attempted per version number.
 */
class Writer {
  readonly acknowledged = new Map<number, Draft>();
  readonly attempted = new Map<number, Draft[]>();
  readonly statuses: number[] = [];
  base = 1;
  private saves = 0;

  constructor(readonly draftId: number, private readonly put: Put, private readonly label: string) {}

  async run(keepGoing: () => boolean) {
    while (keepGoing()) {
      this.saves += 1;
      const document = parseDraft({ ...straightTwillTrial(), notes: `${this.label}, save ${this.saves}` });
      const version = this.base + 1;
      this.attempted.set(version, [...(this.attempted.get(version) ?? []), document]);
      const answer = await this.put(this.draftId, { document, baseVersion: this.base });
      if (answer === 'no answer') {
        await sleep(50);
        continue;
      }
      this.statuses.push(answer.status);
      if (answer.status === 200) {
        expect(answer.body.version).toBe(version);
        this.acknowledged.set(version, document);
        this.base = version;
      } else if (answer.status === 409) {
        // A save whose answer was lost may still have committed; carry on from what the server holds.
        this.base = answer.body.current!.version;
      } else {
        expect(answer.status, JSON.stringify(answer.body)).toBe(503);
        expect(answer.body.error?.code).toBe('database_unavailable');
        await sleep(50);
      }
    }
  }
}

/**
 * The history holds every acknowledged save and nothing half-written: rows whose save numbers run
 * 1..n without gaps or overlaps (a working version holds a run of its sitting's saves), each holding
 * a whole document this writer sent for its newest number, the draft's current version n and its
 * document the same as the newest row's. An acknowledged save is the document of its row when it is
 * that row's newest, and otherwise was the base of the saves after it in the row.
 */
async function expectIntactHistory(models: Models, writer: Writer) {
  const rows = await models.DraftVersion.findAll({ where: { draftId: writer.draftId }, order: [['version', 'ASC']] });
  const draft = await models.Draft.findByPk(writer.draftId);
  rows.forEach((row, i) => expect(row.firstVersion).toBe(i === 0 ? 1 : rows[i - 1].version + 1));
  expect(draft!.version).toBe(rows.at(-1)!.version);
  expect(draft!.document).toEqual(rows.at(-1)!.document);
  for (const row of rows.slice(1)) {
    expect(writer.attempted.get(row.version)).toContainEqual(parseDraft(row.document));
  }
  for (const [version, document] of writer.acknowledged) {
    const row = rows.find((r) => r.firstVersion <= version && version <= r.version);
    expect(row, `acknowledged save ${version}`).toBeDefined();
    if (row!.version === version) expect(row!.document).toEqual(document);
  }
}

async function draftsFor(ownerId: number, count: number): Promise<number[]> {
  const ids: number[] = [];
  for (let i = 0; i < count; i++) ids.push((await createDraft(server.ctx.models, { ownerId, studioId: null, document: straightTwillTrial(), tags: [] })).id);
  return ids;
}

async function until(what: string, done: () => boolean | Promise<boolean>, timeoutMs: number) {
  const started = Date.now();
  while (!(await done())) {
    if (Date.now() - started > timeoutMs) throw new Error(`timed out waiting for ${what}`);
    await sleep(50);
  }
  return Date.now() - started;
}

describe('MariaDB stops while the app serves saves', () => {
  it('answers 503 database_unavailable quickly, recovers when MariaDB returns, and keeps every acknowledged save', async () => {
    const user = await server.createUser({ name: 'Fault weaver' });
    const client = server.client();
    await client.signIn(user.email);
    const put: Put = async (id, body) => {
      const res = await client.send('put', `/api/drafts/${id}`, body);
      return { status: res.status, body: res.body };
    };
    const writers = (await draftsFor(user.id, 4)).map((id, i) => new Writer(id, put, `writer ${i}`));
    let running = true;
    const traffic = writers.map((w) => w.run(() => running));

    await until('saves before the stop', () => writers.every((w) => w.acknowledged.size >= 3), PROGRESS_PATIENCE_MS);
    await db.stop();
    const stoppedAt = Date.now();

    // Reads while MariaDB is down: each answers 503 with the error shape, within the bound.
    const downAnswers: { status: number; ms: number; code?: string }[] = [];
    while (Date.now() - stoppedAt < 3000) {
      const t = Date.now();
      const res = await client.get(`/api/drafts/${writers[0].draftId}`);
      downAnswers.push({ status: res.status, ms: Date.now() - t, code: res.body?.error?.code });
    }
    expect(downAnswers.length).toBeGreaterThan(0);
    for (const a of downAnswers) {
      expect(a).toMatchObject({ status: 503, code: 'database_unavailable' });
      expect(a.ms).toBeLessThan(DOWN_ANSWER_BOUND_MS);
    }
    const acknowledgedBeforeRestart = writers.map((w) => new Map(w.acknowledged));

    db = await startDb();
    const recoveredMs = await until('a read to succeed again', async () => (await client.get(`/api/drafts/${writers[0].draftId}`)).status === 200, PROGRESS_PATIENCE_MS);
    const countsAtRestart = writers.map((w) => w.acknowledged.size);
    await until('saves after the restart', () => writers.every((w, i) => w.acknowledged.size >= countsAtRestart[i] + 3), PROGRESS_PATIENCE_MS);
    running = false;
    await Promise.all(traffic);

    for (const [i, w] of writers.entries()) {
      expect(w.statuses).toContain(503);
      for (const [version, doc] of acknowledgedBeforeRestart[i]) expect(w.acknowledged.get(version)).toEqual(doc);
      await expectIntactHistory(server.ctx.models, w);
    }
    const slowest = Math.max(...downAnswers.map((a) => a.ms));
    console.log(`faults: ${downAnswers.length} reads while down, all 503, slowest ${slowest} ms; recovered ${recoveredMs} ms after restart; `
      + `saves acknowledged ${writers.map((w) => w.acknowledged.size).join('/')}, answers ${writers.map((w) => w.statuses.length).join('/')}`);
  }, TEST_TIMEOUT_MS);
});

describe('MariaDB freezes (the process stopped, its connections left open)', () => {
  it('finding 7: a frozen database answers 503 within about 5 s, and the app recovers by itself when it thaws', async () => {
    const user = await server.createUser({ name: 'Frozen weaver' });
    const client = server.client();
    await client.signIn(user.email);
    const [draftId] = await draftsFor(user.id, 1);
    const document = straightTwillTrial();
    // Connections in the pool, open and idle, as a busy app has them when the database stalls.
    await Promise.all(Array.from({ length: 6 }, () => client.get(`/api/drafts/${draftId}`)));
    const token = await client.csrf();
    const mariadbPid = Number(readFileSync(join(dbDir, 'mariadb.pid'), 'utf8').trim());

    process.kill(mariadbPid, 'SIGSTOP');
    let answers: { status: number; code?: string; ms: number }[];
    try {
      const started = Date.now();
      // Without timeouts these wait for as long as the database is frozen: the client gives up long after the bound.
      answers = await Promise.all([
        ...Array.from({ length: 6 }, () => client.agent.get(`/api/drafts/${draftId}`).timeout(FROZEN_CLIENT_PATIENCE_MS)),
        ...Array.from({ length: 3 }, () => client.agent.put(`/api/drafts/${draftId}`).set('x-csrf-token', token)
          .send({ document, baseVersion: 1 }).timeout(FROZEN_CLIENT_PATIENCE_MS)),
        client.agent.get('/api/drafts').timeout(FROZEN_CLIENT_PATIENCE_MS),
      ].map((req) => req.then(
        (res) => ({ status: res.status, code: res.body?.error?.code as string | undefined, ms: Date.now() - started }),
        (err: { timeout?: number }) => ({ status: err.timeout ? 0 : -1, ms: Date.now() - started }),
      )));
    } finally {
      process.kill(mariadbPid, 'SIGCONT');
    }
    for (const a of answers) {
      expect(a).toMatchObject({ status: 503, code: 'database_unavailable' });
      expect(a.ms).toBeLessThan(FROZEN_ANSWER_BOUND_MS);
    }
    // Thawed: the next requests work again without a restart of the app.
    const recoveredMs = await until('a read to succeed after the thaw', async () => (await client.get(`/api/drafts/${draftId}`)).status === 200, PROGRESS_PATIENCE_MS);
    // A save answered 503 may still have committed once the database woke (as when MariaDB stops): build on what it holds.
    const { version } = (await client.get(`/api/drafts/${draftId}`)).body.draft as { version: number };
    expect((await client.send('put', `/api/drafts/${draftId}`, { document, baseVersion: version })).status).toBe(200);
    console.log(`faults: frozen database, ${answers.length} requests all 503 within ${Math.max(...answers.map((a) => a.ms))} ms; recovered ${recoveredMs} ms after the thaw`);
  }, TEST_TIMEOUT_MS);
});

/** A real server process (as `npm start` runs it) over the faults database. */
class ServerProcess {
  private child: ChildProcess | null = null;
  output = '';

  constructor(readonly env: NodeJS.ProcessEnv, readonly url: string) {}

  async start() {
    const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: root, env: this.env, stdio: ['ignore', 'pipe', 'pipe'] });
    child.stdout!.on('data', (d) => { this.output += d; });
    child.stderr!.on('data', (d) => { this.output += d; });
    this.child = child;
    await until('the server to answer', async () => {
      if (child.exitCode !== null) throw new Error(`server exited with ${child.exitCode}:\n${this.output}`);
      return fetch(`${this.url}/api/session`).then((r) => r.ok, () => false);
    }, PROGRESS_PATIENCE_MS);
  }

  get alive() {
    return this.child !== null && this.child.exitCode === null && this.child.signalCode === null;
  }

  async kill(signal: NodeJS.Signals) {
    const child = this.child;
    if (!child || !this.alive) return;
    const exited = new Promise((r) => child.once('exit', r));
    child.kill(signal);
    await exited;
  }
}

/** Cookies and the CSRF token for fetch, as a browser would keep them. */
class FetchClient {
  private cookies = new Map<string, string>();
  private token = '';

  constructor(private readonly url: string) {}

  async request(method: string, path: string, body?: unknown): Promise<{ status: number; body: Record<string, unknown> }> {
    const headers: Record<string, string> = { cookie: [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ') };
    if (body !== undefined) headers['content-type'] = 'application/json';
    if (method !== 'GET') headers['x-csrf-token'] = this.token;
    const res = await fetch(`${this.url}${path}`, { method, headers, body: body === undefined ? undefined : JSON.stringify(body), signal: AbortSignal.timeout(10_000) });
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const eq = pair.indexOf('=');
      this.cookies.set(pair.slice(0, eq), pair.slice(eq + 1));
    }
    const json = (await res.json().catch(() => ({}))) as Record<string, unknown>;
    if (typeof json.token === 'string') this.token = json.token;
    if (typeof json.csrfToken === 'string') this.token = json.csrfToken;
    return { status: res.status, body: json };
  }

  async signIn(email: string) {
    await this.request('GET', '/api/csrf');
    const res = await this.request('POST', '/api/auth/sign-in', { email, password: TEST_PASSWORD });
    expect(res.status).toBe(200);
  }
}

describe('the server process is killed during saves', () => {
  let app: ServerProcess | null = null;
  afterAll(async () => { await app?.kill('SIGTERM'); });

  it('comes back after SIGKILL with every acknowledged save in the history and none half-written; survives a MariaDB stop', async () => {
    const port = await freePort();
    const url = `http://127.0.0.1:${port}`;
    app = new ServerProcess({
      ...process.env,
      ...db.env,
      SHEDWRIGHT_HOST: '127.0.0.1',
      SHEDWRIGHT_PORT: String(port),
      SHEDWRIGHT_SMTP_PORT: String(await freePort()),
      SHEDWRIGHT_PUBLIC_URL: url,
      SHEDWRIGHT_SESSION_SECRET: 'faults-test-session-secret',
      SHEDWRIGHT_STATIC_DIR: join(work, 'no-client'),
    }, url);
    await app.start();

    const user = await server.createUser({ name: 'Killed-server weaver' });
    const client = new FetchClient(url);
    await client.signIn(user.email);
    const put: Put = (id, body) => client.request('PUT', `/api/drafts/${id}`, body).catch(() => 'no answer' as const);
    const writers = (await draftsFor(user.id, 4)).map((id, i) => new Writer(id, put, `process writer ${i}`));
    let running = true;
    const traffic = writers.map((w) => w.run(() => running));

    await until('saves before the kill', () => writers.every((w) => w.acknowledged.size >= 3), PROGRESS_PATIENCE_MS);
    await app.kill('SIGKILL');
    await sleep(300);
    await app.start();
    const countsAtRestart = writers.map((w) => w.acknowledged.size);
    await until('saves after the restart', () => writers.every((w, i) => w.acknowledged.size >= countsAtRestart[i] + 3), PROGRESS_PATIENCE_MS);

    // The same process through a MariaDB stop: it answers 503 and stays up.
    await db.stop();
    await until('a 503 from every writer', () => writers.every((w) => w.statuses.includes(503)), PROGRESS_PATIENCE_MS);
    expect(app.alive).toBe(true);
    db = await startDb();
    const countsAtDbRestart = writers.map((w) => w.acknowledged.size);
    await until('saves after MariaDB returns', () => writers.every((w, i) => w.acknowledged.size >= countsAtDbRestart[i] + 3), PROGRESS_PATIENCE_MS);
    running = false;
    await Promise.all(traffic);

    expect(app.alive).toBe(true);
    // The log (one JSON line per request) has 503s while MariaDB was away, and no unexpected error (500).
    expect(app.output).toMatch(/"status":503/);
    expect(app.output).not.toMatch(/"status":500/);
    for (const w of writers) await expectIntactHistory(server.ctx.models, w);
    console.log(`faults (process): saves acknowledged ${writers.map((w) => w.acknowledged.size).join('/')}; `
      + `statuses seen ${[...new Set(writers.flatMap((w) => w.statuses))].sort().join(', ')}`);
  }, TEST_TIMEOUT_MS);
});
