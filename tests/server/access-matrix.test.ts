import { createHash, randomBytes } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { roleRank, type StudioRole } from '../../shared/api/auth';
import { defaultPlan } from '../../shared/plan/plan-schema';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import type { UserRow } from '../../server/models';
import { routeTable } from '../../server/routes';
import type { RouteSpec } from '../../server/http/handler';
import { createDraft } from '../../server/services/drafts';
import { addComment } from '../../server/services/comments';
import { addPhoto } from '../../server/services/photos';
import { createShareLink } from '../../server/services/sharing';
import { tokenHash } from '../../server/services/tokens';
import { createYarn } from '../../server/services/yarns';
import { toWif } from '../../shared/weave';
import { encodePngRgb } from '../../server/print/png';
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
  /** The caller is passed for routes on things a user owns (their comment, their yarn). */
  path: (f: Fixture, caller: Caller) => string | Promise<string>;
  body?: (f: Fixture, caller: Caller) => Promise<unknown> | unknown;
  /** A file sent as multipart field "file" instead of a JSON body. */
  upload?: () => { bytes: Buffer; name: string };
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

/** A sign-up waiting for its link, for a fresh address. */
async function signUpToken(): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await server.ctx.models.PendingSignUp.create({
    email: uniqueEmail('matrix-welcome'), name: 'Welcome', passwordHash: 'not-a-real-hash',
    tokenHash: tokenHash(token), expiresAt: new Date(Date.now() + 60_000),
  });
  return token;
}

const cases: Record<string, Case> = {
  'GET /api/csrf': { path: () => '/api/csrf', success: 200 },
  'GET /api/session': { path: () => '/api/session', success: 200 },
  'POST /api/auth/sign-up': {
    path: () => '/api/auth/sign-up', changes: 'session',
    body: () => ({ email: uniqueEmail('matrix'), password: TEST_PASSWORD, name: 'Matrix' }),
    success: 202,
  },
  // The link works for whoever opens it: it is the permission, like a reset link.
  'POST /api/auth/sign-up/confirm': {
    path: () => '/api/auth/sign-up/confirm', changes: 'session', body: async () => ({ token: await signUpToken() }), success: 201,
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
  'GET /api/drafts/:id/plan': { path: (f) => `/api/drafts/${f.draftId}/plan`, success: 200 },
  'PUT /api/drafts/:id/plan': { path: (f) => `/api/drafts/${f.draftId}/plan`, body: () => defaultPlan('cm'), success: 200 },
  'GET /api/drafts/:id/progress': { path: (f) => `/api/drafts/${f.draftId}/progress`, success: 200 },
  'PUT /api/drafts/:id/progress': {
    path: (f) => `/api/drafts/${f.draftId}/progress`,
    body: () => ({ list: 'threading', position: 3, settings: { side: 'back', direction: 'right-to-left', shaftNumbering: 'near' } }),
    success: 200,
  },
  'GET /api/drafts/:id/results': { path: (f) => `/api/drafts/${f.draftId}/results`, success: 200 },
  'POST /api/drafts/:id/results': {
    path: (f) => `/api/drafts/${f.draftId}/results`,
    body: () => ({ unit: 'inch', widthInReed: 20, lengthOnLoom: 100, widthOffLoom: 18, lengthOffLoom: 90 }),
    success: 201,
  },
  'GET /api/me/plan-defaults': { path: () => '/api/me/plan-defaults', success: 200 },
};

// Drafts service: things the cases act on that belong to one caller, made on demand.
const tinyPng = () => encodePngRgb(1, 1, Uint8Array.of(200, 100, 50));
const ownerOf = (caller: Caller) => people[caller === 'signed out' ? 'owner' : caller];
/** Members comment as themselves; callers who cannot see the draft try to delete the owner's comment. */
async function commentPath(f: Fixture, caller: Caller): Promise<string> {
  const author = caller === 'viewer' || caller === 'editor' ? people[caller] : people.owner;
  const comment = await addComment(server.ctx.models, f.draftId, author.id, { text: 'A question about pick 3' });
  return `/api/drafts/${f.draftId}/comments/${comment.id}`;
}
async function yarnPath(_f: Fixture, caller: Caller): Promise<string> {
  const yarn = await createYarn(server.ctx.models, ownerOf(caller).id, { name: 'Matrix wool', fibre: 'wool', colour: '#336699', count: '2/8', yardsPerPound: null });
  return `/api/yarns/${yarn.id}`;
}
const photoIds = new Map<number, number>();
async function photoPath(f: Fixture): Promise<string> {
  if (!photoIds.has(f.draftId)) {
    const photo = await addPhoto(server.ctx.models, server.ctx.storage, f.draftId, 1, people.owner.id, tinyPng());
    photoIds.set(f.draftId, photo.id);
  }
  return `/api/drafts/${f.draftId}/photos/${photoIds.get(f.draftId)}`;
}
/**
 * To a studio of its own: accepting must not make the matrix's non-member a member of the shared one.
 * Sent to the caller, as only the invited address may accept.
 */
async function inviteToken(caller: Caller): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  const studio = await createStudio(server.ctx.models, people.owner.id, 'Invitation studio');
  await server.ctx.models.Invitation.create({
    studioId: studio.id, invitedById: people.owner.id, email: caller === 'signed out' ? uniqueEmail('invited') : people[caller].email, role: 'viewer',
    tokenHash: tokenHash(token), expiresAt: new Date(Date.now() + 60_000),
  });
  return token;
}
async function sendFile(client: TestClient, path: string, file: { bytes: Buffer; name: string }) {
  return client.agent.post(path).set('x-csrf-token', await client.csrf()).attach('file', file.bytes, file.name);
}

const draftsServiceCases: Record<string, Case> = {
  'POST /api/drafts': { path: () => '/api/drafts', body: () => ({ name: 'Matrix draft', document: pointTwillScarf() }), success: 201 },
  'POST /api/drafts/import-wif': {
    path: () => '/api/drafts/import-wif', upload: () => ({ bytes: Buffer.from(toWif(pointTwillScarf())), name: 'scarf.wif' }), success: 201,
  },
  'PUT /api/drafts/:id': {
    path: (f) => `/api/drafts/${f.draftId}`, body: () => ({ document: pointTwillScarf(), baseVersion: 1 }), success: 200, changes: 'studio',
  },
  'PATCH /api/drafts/:id': { path: (f) => `/api/drafts/${f.draftId}`, body: () => ({ tags: ['matrix'] }), success: 200 },
  'DELETE /api/drafts/:id': { path: (f) => `/api/drafts/${f.draftId}`, success: 204, changes: 'studio' },
  'GET /api/bin': { path: () => '/api/bin', success: 200 },
  // Restoring acts on a draft in the Bin: the fixture's draft is put there first.
  'POST /api/drafts/:id/restore': {
    path: async (f) => {
      await server.ctx.models.Draft.update({ binnedAt: new Date() }, { where: { id: f.draftId } });
      return `/api/drafts/${f.draftId}/restore`;
    },
    success: 200, changes: 'studio',
  },
  'GET /api/drafts/:id/thumbnail.png': { path: (f) => `/api/drafts/${f.draftId}/thumbnail.png?v=1`, success: 200 },
  'GET /api/drafts/:id/versions': { path: (f) => `/api/drafts/${f.draftId}/versions`, success: 200 },
  'GET /api/drafts/:id/versions/:n': { path: (f) => `/api/drafts/${f.draftId}/versions/1`, success: 200 },
  'GET /api/drafts/:id/versions/:n/thumbnail.png': { path: (f) => `/api/drafts/${f.draftId}/versions/1/thumbnail.png`, success: 200 },
  'POST /api/drafts/:id/versions/:n/restore': { path: (f) => `/api/drafts/${f.draftId}/versions/1/restore`, success: 200 },
  'GET /api/drafts/:id/compare': { path: (f) => `/api/drafts/${f.draftId}/compare?a=1&b=1`, success: 200 },
  'GET /api/drafts/:id/compare.png': { path: (f) => `/api/drafts/${f.draftId}/compare.png?a=1&b=1`, success: 200 },
  'POST /api/drafts/:id/fork': { path: (f) => `/api/drafts/${f.draftId}/fork`, body: () => ({ name: 'Matrix colourway' }), success: 201 },
  'GET /api/drafts/:id/lineage': { path: (f) => `/api/drafts/${f.draftId}/lineage`, success: 200 },
  'GET /api/drafts/:id/export.wif': { path: (f) => `/api/drafts/${f.draftId}/export.wif`, success: 200 },
  'GET /api/drafts/:id/export.json': { path: (f) => `/api/drafts/${f.draftId}/export.json?version=1`, success: 200 },
  'GET /api/drafts/:id/share': { path: (f) => `/api/drafts/${f.draftId}/share`, success: 200 },
  'POST /api/drafts/:id/share': { path: (f) => `/api/drafts/${f.draftId}/share`, success: 201 },
  'DELETE /api/drafts/:id/share': { path: (f) => `/api/drafts/${f.draftId}/share`, success: 200 },
  'GET /api/shared/:token': {
    path: async (f) => `/api/shared/${(await createShareLink(server.ctx.models, f.draftId, people.owner.id, 'http://x')).token}`, success: 200,
  },
  'POST /api/studios/:id/invitations': {
    path: (f) => `/api/studios/${f.studioId}/invitations`, body: () => ({ email: uniqueEmail('invitee'), role: 'viewer' }), success: 201,
  },
  'POST /api/invitations/accept': { path: () => '/api/invitations/accept', body: async (_f, caller) => ({ token: await inviteToken(caller) }), success: 200 },
  'GET /api/drafts/:id/comments': { path: (f) => `/api/drafts/${f.draftId}/comments`, success: 200 },
  'POST /api/drafts/:id/comments': { path: (f) => `/api/drafts/${f.draftId}/comments`, body: () => ({ text: 'Lovely', end: 3 }), success: 201 },
  'DELETE /api/drafts/:id/comments/:commentId': { path: commentPath, success: 204 },
  'GET /api/drafts/:id/photos': { path: (f) => `/api/drafts/${f.draftId}/photos`, success: 200 },
  'POST /api/drafts/:id/versions/:n/photos': {
    path: (f) => `/api/drafts/${f.draftId}/versions/1/photos`, upload: () => ({ bytes: tinyPng(), name: 'cloth.png' }), success: 201,
  },
  'GET /api/drafts/:id/photos/:photoId': { path: photoPath, success: 200 },
  'GET /api/yarns': { path: () => '/api/yarns', success: 200 },
  'POST /api/yarns': { path: () => '/api/yarns', body: () => ({ name: 'Linen', colour: '#eeddcc' }), success: 201 },
  'PATCH /api/yarns/:id': { path: yarnPath, body: () => ({ name: 'Renamed wool' }), success: 200 },
  'DELETE /api/yarns/:id': { path: yarnPath, success: 204 },
};
Object.assign(cases, draftsServiceCases);

// Printed drafts and pictures (server/routes/exports.ts).
const shareToken = async (f: Fixture) => (await createShareLink(server.ctx.models, f.draftId, people.owner.id, 'http://x')).token;
Object.assign(cases, {
  'GET /api/drafts/:id/print.pdf': { path: (f) => `/api/drafts/${f.draftId}/print.pdf?paper=letter&lists=threading`, success: 200 },
  'GET /api/drafts/:id/drawdown.png': { path: (f) => `/api/drafts/${f.draftId}/drawdown.png?view=structure&scale=2`, success: 200 },
  'GET /api/shared/:token/print.pdf': { path: async (f) => `/api/shared/${await shareToken(f)}/print.pdf?lists=`, success: 200 },
  'GET /api/shared/:token/drawdown.png': { path: async (f) => `/api/shared/${await shareToken(f)}/drawdown.png?scale=1`, success: 200 },
} satisfies Record<string, Case>);

const keyOf = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;

/** The status a caller should get from a route, from nothing but the route's declared minimum role. */
function expectedStatus(spec: RouteSpec, caller: Caller, success: number): number {
  // The tests run outside development mode, where developers' tools do not exist.
  if (spec.devOnly) return 404;
  const min = spec.minimumRole;
  if (min === 'public') return success;
  if (caller === 'signed out') return 401;
  if (min === 'user') return success;
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
    const body = c.body ? await c.body(fixture, caller) : undefined;
    const path = await c.path(fixture, caller);
    const res = c.upload ? await sendFile(client, path, c.upload()) : await client.send(spec.method, path, body);
    const expected = expectedStatus(spec, caller, c.success);
    expect(res.status, `${keyOf(spec)} as ${caller}: ${JSON.stringify(res.body)}`).toBe(expected);
    if (expected >= 400) expect(res.body.error?.code).toBeTypeOf('string');
  });
});
