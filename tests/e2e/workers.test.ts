// The app as several processes behind one port (server/cluster): whichever worker a request reaches,
// it sees every write another worker answered before it, and the workers share rate-limit counts
// and captured mails. Each request here goes on a new connection; node:cluster hands new connections
// to the workers in turn (round robin, its default on Linux), so consecutive requests alternate.
import { readFileSync } from 'node:fs';
import { request as httpRequest } from 'node:http';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDraft } from '../../shared/weave';
import { DEMO_PASSWORD } from '../../server/db/demo-accounts';
import { childPids } from '../bench/proc-stat';
import { startAppServer, type AppServer } from '../helpers/e2e';

const SIGN_IN_LIMIT = 8;
/** Requests in a row on new connections: more than enough to reach both workers several times. */
const SPREAD = 6;

interface Answer { status: number; body: any; cookies: string[] }

let server: AppServer;

/** One request on a connection of its own (no keep-alive), so node:cluster may give it to any worker. */
function send(method: string, path: string, options: { cookie?: string; csrf?: string; body?: unknown } = {}): Promise<Answer> {
  const url = new URL(path, server.url);
  const payload = options.body === undefined ? undefined : JSON.stringify(options.body);
  return new Promise((resolve, reject) => {
    const req = httpRequest(url, {
      method,
      agent: false,
      headers: {
        ...(payload ? { 'content-type': 'application/json' } : {}),
        ...(options.cookie ? { cookie: options.cookie } : {}),
        ...(options.csrf ? { 'x-csrf-token': options.csrf } : {}),
      },
    }, (res) => {
      let text = '';
      res.on('data', (d) => { text += d; });
      res.on('end', () => resolve({
        status: res.statusCode!,
        body: text && res.headers['content-type']?.includes('json') ? JSON.parse(text) : text,
        cookies: (res.headers['set-cookie'] ?? []).map((c) => c.split(';')[0]),
      }));
    });
    req.on('error', reject);
    req.end(payload);
  });
}

/** The same request SPREAD times, each on a new connection. */
async function spread(method: string, path: string, options: Parameters<typeof send>[2] = {}): Promise<Answer[]> {
  const answers: Answer[] = [];
  for (let i = 0; i < SPREAD; i++) answers.push(await send(method, path, options));
  return answers;
}

interface Session { cookie: string; csrf: string }

/** Sign-in requests made so far: all count towards the limit, as they all come from 127.0.0.1. */
let signIns = 0;

async function signIn(email: string): Promise<Session> {
  const first = await send('GET', '/api/csrf');
  signIns += 1;
  const res = await send('POST', '/api/auth/sign-in', {
    cookie: first.cookies.join('; '), csrf: first.body.token, body: { email, password: DEMO_PASSWORD },
  });
  expect(res.status).toBe(200);
  return { cookie: res.cookies.join('; '), csrf: res.body.csrfToken };
}

/** The workers: the primary's live children that run the app (tsx may also start an esbuild child). */
const workerPids = () => childPids(server.pid).filter((pid) => {
  try {
    return readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes('server/index.ts');
  } catch {
    return false; // gone meanwhile
  }
});

beforeAll(async () => {
  server = await startAppServer({ SHEDWRIGHT_WORKERS: '2', SHEDWRIGHT_SIGNIN_LIMIT: String(SIGN_IN_LIMIT) });
});
afterAll(async () => {
  await server?.stop();
});

describe('the app as two worker processes', () => {
  let lead: Session;
  let studioId: number;

  beforeAll(async () => {
    lead = await signIn('lead@shedwright.test');
    studioId = (await send('GET', '/api/studios', lead)).body.studios[0].id;
  });

  it('runs two workers behind one port', () => {
    expect(workerPids()).toHaveLength(2);
  });

  it('shows a save in the library at once, whichever worker lists it', async () => {
    const created = await send('POST', '/api/drafts', { ...lead, body: { name: 'Worker relay check', studioId } });
    expect(created.status).toBe(201);
    const id: number = created.body.draft.id;
    const document = createDraft({ name: 'Worker relay check', shafts: 4, treadles: 4 });
    try {
      for (let version = 1; version <= 4; version++) {
        // Every worker holds the page before the save, so a worker the save did not reach has it cached.
        for (const page of await spread('GET', '/api/drafts', lead)) {
          expect(page.body.items.find((d: { id: number }) => d.id === id).version).toBe(version);
        }
        const saved = await send('PUT', `/api/drafts/${id}`, { ...lead, body: { baseVersion: version, document } });
        expect(saved.body).toEqual({ version: version + 1 });
        for (const page of await spread('GET', '/api/drafts', lead)) {
          expect(page.body.items.find((d: { id: number }) => d.id === id).version).toBe(version + 1);
        }
      }
    } finally {
      expect((await send('DELETE', `/api/drafts/${id}`, lead)).status).toBe(204);
    }
  });

  it('applies a changed studio role at once, whichever worker checks it', async () => {
    const members = (await send('GET', `/api/studios/${studioId}`, lead)).body.members as { userId: number; email: string }[];
    const studentId = members.find((m) => m.email === 'student2@shedwright.test')!.userId;
    const created = await send('POST', '/api/drafts', { ...lead, body: { name: 'Role relay check', studioId } });
    const id: number = created.body.draft.id;
    const student = await signIn('student2@shedwright.test');
    const rename = (name: string) => send('PATCH', `/api/drafts/${id}`, { ...student, body: { name } });
    try {
      // A viewer may read but not rename; every worker now holds that role.
      expect((await spread('GET', `/api/drafts/${id}`, student)).map((a) => a.status)).toEqual(Array(SPREAD).fill(200));
      expect((await rename('Renamed by a viewer')).status).toBe(403);
      expect((await send('PATCH', `/api/studios/${studioId}/members/${studentId}`, { ...lead, body: { role: 'editor' } })).status).toBe(200);
      for (let i = 0; i < SPREAD; i++) expect((await rename(`Renamed by an editor ${i}`)).status).toBe(200);
      expect((await send('PATCH', `/api/studios/${studioId}/members/${studentId}`, { ...lead, body: { role: 'viewer' } })).status).toBe(200);
      for (let i = 0; i < SPREAD; i++) expect((await rename('Renamed by a viewer again')).status).toBe(403);
    } finally {
      await send('PATCH', `/api/studios/${studioId}/members/${studentId}`, { ...lead, body: { role: 'viewer' } });
      await send('DELETE', `/api/drafts/${id}`, lead);
    }
  });

  it('signs a weaver out of every worker at once', async () => {
    const student = await signIn('student1@shedwright.test');
    // Every worker reads (and keeps a copy of) the session.
    for (const answer of await spread('GET', '/api/session', student)) expect(answer.body.user.email).toBe('student1@shedwright.test');
    expect((await send('POST', '/api/auth/sign-out', student)).status).toBe(200);
    for (const answer of await spread('GET', '/api/session', student)) expect(answer.body.user).toBeNull();
  });

  it('serves captured mails from whichever worker is asked', async () => {
    expect((await send('POST', '/api/auth/forgot', { ...(await anonymous()), body: { email: 'student2@shedwright.test' } })).status).toBe(202);
    const admin = await signIn('admin@shedwright.test');
    for (const answer of await spread('GET', '/api/dev/mails', admin)) {
      expect(answer.body.mails.some((m: { to: string }) => m.to.includes('student2@shedwright.test'))).toBe(true);
    }
  });

  it('replaces a worker that dies, and sessions live on', async () => {
    const [victim] = workerPids();
    process.kill(victim, 'SIGKILL');
    const started = Date.now();
    while (workerPids().length < 2 || workerPids().includes(victim)) {
      if (Date.now() - started > 30_000) throw new Error('no worker replaced the one that died');
      await new Promise((r) => setTimeout(r, 200));
    }
    // Wait until the new worker listens: its first answers come through.
    let answers: Answer[] = [];
    while (Date.now() - started < 60_000) {
      answers = await spread('GET', '/api/session', lead).catch(() => []);
      if (answers.length === SPREAD && answers.every((a) => a.status === 200)) break;
      await new Promise((r) => setTimeout(r, 200));
    }
    expect(answers.map((a) => a.body.user?.email)).toEqual(Array(SPREAD).fill('lead@shedwright.test'));
  });

  it('counts sign-in attempts across all workers', async () => {
    const statuses: number[] = [];
    const before = signIns;
    for (let i = 0; i < SIGN_IN_LIMIT + 2; i++) {
      const first = await send('GET', '/api/csrf');
      signIns += 1;
      const res = await send('POST', '/api/auth/sign-in', {
        cookie: first.cookies.join('; '), csrf: first.body.token, body: { email: 'lead@shedwright.test', password: 'not the password' },
      });
      statuses.push(res.status);
      if (res.status === 429) break;
    }
    // The earlier sign-ins count too; then wrong passwords until the shared count passes the limit.
    expect(statuses).toEqual([...Array(SIGN_IN_LIMIT - before).fill(401), 429]);
  });
});

async function anonymous(): Promise<Session> {
  const first = await send('GET', '/api/csrf');
  return { cookie: first.cookies.join('; '), csrf: first.body.token };
}
