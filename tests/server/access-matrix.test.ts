import { createHash, randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roleRank, type StudioRole } from '../../shared/api/auth';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import type { UserRow } from '../../server/models';
import { routeTable } from '../../server/routes';
import type { RouteSpec } from '../../server/routes/route';
import { createDraft } from '../../server/services/drafts';
import { createStudio } from '../../server/services/studios';
import { startTestServer, TEST_PASSWORD, type TestClient, type TestServer } from '../helpers/server';
import { uniqueEmail } from '../helpers/test-db';

/**
 * Every route in the server's route table × every kind of caller, asserting the status the route's
 * minimum role implies. A route added to the table without a case here fails the first test.
 */
const callers = ['signed out', 'viewer', 'editor', 'owner', 'admin', 'non-member'] as const;
type Caller = (typeof callers)[number];

interface Fixture {
  studioId: number;
  draftId: number;
  /** A viewer in the studio whom member routes act on (never the caller). */
  targetId: number;
}
interface Case {
  path: (f: Fixture) => string;
  body?: () => Promise<unknown> | unknown;
  success: number;
  /** Changes the studio (needs its own), or the session (needs its own signed-in client). */
  changes?: 'studio' | 'session';
}

let server: TestServer;
const people = {} as Record<Exclude<Caller, 'signed out'>, UserRow>;

async function freshResetToken(): Promise<string> {
  const user = await server.createUser({ name: 'Resetting' });
  const token = randomBytes(32).toString('base64url');
  await server.ctx.models.PasswordReset.create({
    userId: user.id,
    tokenHash: createHash('sha256').update(token).digest('hex'),
    expiresAt: new Date(Date.now() + 60_000),
  });
  return token;
}

const cases: Record<string, Case> = {
  'GET /api/csrf': { path: () => '/api/csrf', success: 200 },
  'GET /api/session': { path: () => '/api/session', success: 200 },
  'POST /api/auth/sign-up': {
    path: () => '/api/auth/sign-up', changes: 'session',
    body: () => ({ email: uniqueEmail('matrix'), password: TEST_PASSWORD, name: 'Matrix' }),
    success: 201,
  },
  'POST /api/auth/sign-in': {
    path: () => '/api/auth/sign-in', changes: 'session', body: () => ({ email: people.viewer.email, password: TEST_PASSWORD }), success: 200,
  },
  'POST /api/auth/sign-out': { path: () => '/api/auth/sign-out', changes: 'session', success: 200 },
  'POST /api/auth/forgot': { path: () => '/api/auth/forgot', body: () => ({ email: uniqueEmail('nobody') }), success: 202 },
  'POST /api/auth/reset': {
    path: () => '/api/auth/reset', changes: 'session',
    body: async () => ({ token: await freshResetToken(), password: 'matrix-new-password' }),
    success: 200,
  },
  'GET /api/dev/mails': { path: () => '/api/dev/mails', success: 200 },
  'GET /api/studios': { path: () => '/api/studios', success: 200 },
  'POST /api/studios': { path: () => '/api/studios', body: () => ({ name: 'Matrix studio' }), success: 201 },
  'GET /api/studios/:id': { path: (f) => `/api/studios/${f.studioId}`, success: 200 },
  'PATCH /api/studios/:id/members/:userId': {
    path: (f) => `/api/studios/${f.studioId}/members/${f.targetId}`, body: () => ({ role: 'editor' }), success: 200, changes: 'studio',
  },
  'DELETE /api/studios/:id/members/:userId': {
    path: (f) => `/api/studios/${f.studioId}/members/${f.targetId}`, success: 200, changes: 'studio',
  },
  'GET /api/drafts': { path: () => '/api/drafts', success: 200 },
  'GET /api/drafts/:id': { path: (f) => `/api/drafts/${f.draftId}`, success: 200 },
};

const keyOf = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;

/** The status a caller should get from a route, from nothing but the route's declared minimum role. */
function expectedStatus(spec: RouteSpec, caller: Caller, success: number): number {
  const min = spec.minimumRole;
  if (min === 'public') return success;
  if (caller === 'signed out') return 401;
  if (min === 'user') return success;
  if (min === 'admin') return caller === 'admin' ? success : 403;
  if (caller === 'admin' || caller === 'non-member') return 404;
  return roleRank(caller as StudioRole) >= roleRank(min) ? success : 403;
}

/** A studio with the callers in their roles, a draft in it and a member to act on. */
async function createFixture(): Promise<Fixture> {
  const { models } = server.ctx;
  const studio = await createStudio(models, people.owner.id, 'Matrix studio');
  // The target never signs in, so it needs no real password hash.
  const target = await models.User.create({ email: uniqueEmail('target'), name: 'Target', passwordHash: '-' });
  for (const [userId, role] of [[people.editor.id, 'editor'], [people.viewer.id, 'viewer'], [target.id, 'viewer']] as const) {
    await models.Membership.create({ studioId: studio.id, userId, role });
  }
  const draft = await createDraft(models, { ownerId: people.owner.id, studioId: studio.id, document: pointTwillScarf(), tags: [] });
  return { studioId: studio.id, draftId: draft.id, targetId: target.id };
}

async function signedInClient(caller: Caller): Promise<TestClient> {
  const client = server.client();
  if (caller !== 'signed out') await client.signIn(people[caller].email);
  return client;
}

// Read-only cases share one studio and one signed-in client per caller; the rest get their own.
let sharedFixture: Fixture;
const sharedClients = new Map<Caller, TestClient>();

beforeAll(async () => {
  server = await startTestServer();
  people.owner = await server.createUser({ name: 'Matrix owner' });
  people.editor = await server.createUser({ name: 'Matrix editor' });
  people.viewer = await server.createUser({ name: 'Matrix viewer' });
  people['non-member'] = await server.createUser({ name: 'Matrix outsider' });
  people.admin = await server.createUser({ name: 'Matrix admin', isAdmin: true });
  sharedFixture = await createFixture();
  for (const caller of callers) sharedClients.set(caller, await signedInClient(caller));
});
afterAll(async () => { await server.close(); });

describe('access matrix', () => {
  it('has a case for every route in the table, and no case for a route that is gone', () => {
    const keys = routeTable.map(keyOf);
    expect(keys.filter((k) => !(k in cases))).toEqual([]);
    expect(Object.keys(cases).filter((k) => !keys.includes(k))).toEqual([]);
    expect(new Set(keys).size).toBe(keys.length);
  });

  const rows = routeTable.flatMap((spec) => callers.map((caller) => ({ spec, caller })));
  it.each(rows.map((r) => [keyOf(r.spec), r.caller, r.spec] as const))('%s as %s', async (_key, caller, spec) => {
    const c = cases[keyOf(spec)];
    expect(c, `a case for ${keyOf(spec)}`).toBeDefined();
    const fixture = c.changes === 'studio' ? await createFixture() : sharedFixture;
    const client = c.changes === 'session' ? await signedInClient(caller) : sharedClients.get(caller)!;
    const body = c.body ? await c.body() : undefined;
    const res = await client.send(spec.method, c.path(fixture), body);
    const expected = expectedStatus(spec, caller, c.success);
    expect(res.status, `${keyOf(spec)} as ${caller}: ${JSON.stringify(res.body)}`).toBe(expected);
    if (expected >= 400) expect(res.body.error?.code).toBeTypeOf('string');
  });
});
