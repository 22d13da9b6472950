import { randomBytes } from 'node:crypto';
import { existsSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import express from 'express';
import fc from 'fast-check';
import request from 'supertest';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import type { z } from 'zod';
import { SESSION_COOKIE } from '../../server/app';
import { loadConfig } from '../../server/config';
import { errorHandler } from '../../server/middleware/errors';
import { createLogger, requestLog } from '../../server/middleware/request-log';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { encodePngRgb } from '../../server/print/png';
import { routeTable } from '../../server/routes';
import type { RouteSpec } from '../../server/http/handler';
import { addComment } from '../../server/services/comments';
import { createDraft } from '../../server/services/drafts';
import { addPhoto } from '../../server/services/photos';
import { createShareLink } from '../../server/services/sharing';
import { createStudio } from '../../server/services/studios';
import { tokenHash } from '../../server/services/tokens';
import { createYarn } from '../../server/services/yarns';
import { defaultPlan } from '../../shared/plan/plan-schema';
import { toWif } from '../../shared/weave';
import { startTestServer, TEST_PASSWORD, type TestClient, type TestServer } from '../helpers/server';
import { testLogFile, uniqueEmail } from '../helpers/test-db';

/*
 * Access control beyond the access matrix (which covers callers inside the studio): callers who hold
 * every role in a studio of their OWN, aimed at another studio's things; share tokens; session
 * expiry; sign-in rate limits; CSRF on every state-changing route; passwords kept out of answers and
 * logs; SQL injection through every text field of every route's body.
 */

let server: TestServer;
const keyOf = (spec: RouteSpec) => `${spec.method.toUpperCase()} ${spec.path}`;
const tinyPng = () => encodePngRgb(1, 1, Uint8Array.of(10, 20, 30));

/** A studio with everything the routes act on: a draft, a member, a comment, a photo, a yarn, a share link. */
interface Studio {
  owner: TestClient;
  ownerId: number;
  ownerEmail: string;
  studioId: number;
  draftId: number;
  memberId: number;
  commentId: number;
  photoId: number;
  yarnId: number;
  shareToken: string;
}

async function makeStudio(name: string): Promise<Studio> {
  const { models } = server.ctx;
  const owner = await server.createUser({ name: `${name} owner` });
  const member = await server.createUser({ name: `${name} member` });
  const studio = await createStudio(models, owner.id, `${name} studio`);
  await models.Membership.create({ studioId: studio.id, userId: member.id, role: 'viewer' });
  const draft = await createDraft(models, { ownerId: owner.id, studioId: studio.id, document: pointTwillScarf(), tags: ['private'] });
  const comment = await addComment(models, draft.id, owner.id, { text: 'Check pick 5' });
  const photo = await addPhoto(models, server.ctx.storage, draft.id, 1, owner.id, tinyPng());
  const yarn = await createYarn(models, owner.id, { name: `${name} wool`, fibre: 'wool', colour: '#224466', count: '2/8', yardsPerPound: null });
  const { token } = await createShareLink(models, draft.id, owner.id, 'http://x');
  const client = server.client();
  await client.signIn(owner.email);
  return {
    owner: client, ownerId: owner.id, ownerEmail: owner.email, studioId: studio.id, draftId: draft.id, memberId: member.id,
    commentId: comment.id, photoId: photo.id, yarnId: yarn.id, shareToken: token,
  };
}

/** The route's path with the studio's ids filled in (and the two versions a comparison needs). */
function pathIn(spec: RouteSpec, s: Pick<Studio, 'studioId' | 'draftId' | 'memberId' | 'commentId' | 'photoId' | 'yarnId' | 'shareToken'>): string {
  const id = spec.path.startsWith('/api/studios/') ? s.studioId : spec.path.startsWith('/api/yarns/') ? s.yarnId : s.draftId;
  const path = spec.path.replace(':id', String(id)).replace(':userId', String(s.memberId)).replace(':n', '1')
    .replace(':commentId', String(s.commentId)).replace(':photoId', String(s.photoId)).replace(':token', s.shareToken);
  return path.includes('/compare') ? `${path}?a=1&b=1` : path;
}

/** Ids nothing has: what a caller gets for these is what "does not exist" looks like. */
const ghost = { studioId: 2 ** 31 - 1, draftId: 2 ** 31 - 1, memberId: 2 ** 31 - 1, commentId: 2 ** 31 - 1, photoId: 2 ** 31 - 1, yarnId: 2 ** 31 - 1, shareToken: 'x'.repeat(43) };

async function freshResetToken(userId: number): Promise<string> {
  const token = randomBytes(32).toString('base64url');
  await server.ctx.models.PasswordReset.create({ userId, tokenHash: tokenHash(token), expiresAt: new Date(Date.now() + 60_000) });
  return token;
}

/** A body each route with a body schema accepts, so an answer is about access, not validation. */
const validBodies: Record<string, (s: Studio) => unknown> = {
  'POST /api/auth/sign-up': () => ({ email: uniqueEmail('sec'), password: 'a-long-enough-password', name: 'Security' }),
  'POST /api/auth/sign-in': (s) => ({ email: s.ownerEmail, password: TEST_PASSWORD }),
  'POST /api/auth/forgot': () => ({ email: uniqueEmail('sec') }),
  'POST /api/auth/reset': () => ({ token: randomBytes(32).toString('base64url'), password: 'another-long-password' }),
  'POST /api/auth/sign-up/confirm': () => ({ token: randomBytes(32).toString('base64url') }),
  'POST /api/studios': () => ({ name: 'Security studio' }),
  'PATCH /api/studios/:id/members/:userId': () => ({ role: 'editor' }),
  'POST /api/drafts': () => ({ name: 'Security draft', tags: ['sec'] }),
  'POST /api/drafts/import-wif': () => ({}),
  'PUT /api/drafts/:id': () => ({ document: pointTwillScarf(), baseVersion: 1 }),
  'PATCH /api/drafts/:id': () => ({ name: 'Renamed' }),
  'POST /api/drafts/:id/fork': () => ({ name: 'Security fork' }),
  'POST /api/studios/:id/invitations': () => ({ email: uniqueEmail('invitee'), role: 'viewer' }),
  'POST /api/invitations/accept': () => ({ token: randomBytes(32).toString('base64url') }),
  'POST /api/drafts/:id/comments': () => ({ text: 'Nice' }),
  'POST /api/yarns': () => ({ name: 'Linen', colour: '#eeddcc' }),
  'PATCH /api/yarns/:id': () => ({ name: 'Renamed yarn' }),
  'PUT /api/drafts/:id/plan': () => defaultPlan('cm'),
  'PUT /api/drafts/:id/progress': () => ({ list: 'threading', position: 2, settings: { side: 'back', direction: 'right-to-left', shaftNumbering: 'near' } }),
  'POST /api/drafts/:id/results': () => ({ unit: 'cm', widthInReed: 50, lengthOnLoom: 200, widthOffLoom: 46, lengthOffLoom: 190 }),
};

/** Sends a request the way the route takes its input: a file for upload routes, JSON otherwise. */
async function call(client: TestClient, spec: RouteSpec, path: string, body: unknown) {
  if (spec.upload) {
    const file = path.includes('/photos') ? tinyPng() : Buffer.from('[WIF]\nVersion=1.1\n');
    return client.agent.post(path).set('x-csrf-token', await client.csrf()).attach('file', file, path.includes('/photos') ? 'c.png' : 'd.wif');
  }
  return client.send(spec.method, path, body);
}

beforeAll(async () => {
  server = await startTestServer();
}, 60_000);
afterAll(async () => {
  await server.close();
});

describe('the test knows a valid body for every route that takes one', () => {
  it('and each one passes the route\'s own schema', async () => {
    const s = await makeStudio('Schema');
    for (const spec of routeTable.filter((r) => r.body)) {
      const body = validBodies[keyOf(spec)];
      expect(body, `a valid body for ${keyOf(spec)}`).toBeDefined();
      const parsed = spec.body!.safeParse(body(s));
      expect(parsed.success, `${keyOf(spec)}: ${JSON.stringify(parsed.error?.issues)}`).toBe(true);
    }
  });
});

describe("another studio's things", () => {
  const roles = ['viewer', 'editor', 'owner', 'admin'] as const;
  type Role = (typeof roles)[number];
  /** Callers who hold each role in a studio of their own (the admin owns theirs), none in the target's. */
  const callers = new Map<Role, { client: TestClient; studioId: number; draftId: number }>();
  let target: Studio;
  const countsByRoute: Record<string, number> = {};

  // Routes with no studio resource behind them: what stands in for "another studio's" there, or why nothing does.
  const notApplicable: Record<string, string> = {
    'GET /api/csrf': 'the caller\'s own session',
    'GET /api/session': 'the caller\'s own session',
    'POST /api/auth/sign-up': 'answers alike for every e-mail and mails the address (auth.test.ts)',
    'POST /api/auth/sign-up/confirm': 'the token is the permission',
    'POST /api/auth/sign-in': 'the caller\'s own account',
    'POST /api/auth/sign-out': 'the caller\'s own session',
    'POST /api/auth/forgot': 'answers alike for every e-mail (auth.test.ts)',
    'POST /api/auth/reset': 'the token is the permission',
    'GET /api/dev/mails': 'site tool, not studio content',
    'POST /api/studios': 'makes a new studio of the caller\'s own',
    'POST /api/yarns': 'the caller\'s own stash',
    'GET /api/me/plan-defaults': 'the caller\'s own defaults',
    'POST /api/invitations/accept': 'the token is the permission',
    'GET /api/shared/:token': 'the token is the permission; guessing it is tested below',
    'GET /api/shared/:token/print.pdf': 'the token is the permission; guessing it is tested below',
    'GET /api/shared/:token/drawdown.png': 'the token is the permission; guessing it is tested below',
  };
  /** Non-resource routes aimed at the target through their body, query or a private id: must answer 404 or leave it out. */
  const aimed: Record<string, (role: Role) => Promise<void>> = {
    'GET /api/studios': async (role) => {
      const res = await callers.get(role)!.client.get('/api/studios');
      expect(res.status).toBe(200);
      expect(JSON.stringify(res.body)).not.toContain(`"id":${target.studioId},`);
      expect(JSON.stringify(res.body)).not.toContain('Target studio');
    },
    'GET /api/drafts': async (role) => {
      for (const query of [`studio=${target.studioId}`, 'tag=private', 'q=Point']) {
        const res = await callers.get(role)!.client.get(`/api/drafts?${query}&pageSize=100`);
        expect(res.status).toBe(200);
        expect((res.body.items as { id: number }[]).map((d) => d.id)).not.toContain(target.draftId);
      }
    },
    'POST /api/drafts': async (role) => {
      const res = await callers.get(role)!.client.post('/api/drafts', { name: 'Smuggled', studioId: target.studioId });
      expect(res.status, JSON.stringify(res.body)).toBe(404);
    },
    'POST /api/drafts/import-wif': async (role) => {
      const c = callers.get(role)!.client;
      const res = await c.agent.post('/api/drafts/import-wif').set('x-csrf-token', await c.csrf()).field('studioId', String(target.studioId))
        .attach('file', Buffer.from(toWif(pointTwillScarf())), 'smuggled.wif');
      expect([404, 422], JSON.stringify(res.body)).toContain(res.status);
      if (res.status === 422) throw new Error('the WIF file was refused before the studio was checked; make it valid');
    },
    'GET /api/bin': async (role) => {
      // The target's draft in its studio's Bin for the moment of the call.
      const { Draft } = server.ctx.models;
      await Draft.update({ binnedAt: new Date() }, { where: { id: target.draftId } });
      try {
        const res = await callers.get(role)!.client.get('/api/bin');
        expect(res.status).toBe(200);
        expect((res.body.drafts as { id: number }[]).map((d) => d.id)).not.toContain(target.draftId);
      } finally {
        await Draft.update({ binnedAt: null }, { where: { id: target.draftId } });
      }
    },
    'GET /api/yarns': async (role) => {
      const res = await callers.get(role)!.client.get('/api/yarns');
      expect(res.status).toBe(200);
      expect(JSON.stringify(res.body)).not.toContain('Target wool');
    },
    'PATCH /api/yarns/:id': async (role) => {
      expect((await callers.get(role)!.client.patch(`/api/yarns/${target.yarnId}`, { name: 'Stolen' })).status).toBe(404);
    },
    'DELETE /api/yarns/:id': async (role) => {
      expect((await callers.get(role)!.client.delete(`/api/yarns/${target.yarnId}`)).status).toBe(404);
    },
  };

  /** What the target holds, to show nothing changed however the callers were answered. */
  async function snapshot() {
    const { models } = server.ctx;
    const where = { draftId: target.draftId };
    const draft = await models.Draft.findByPk(target.draftId);
    return {
      draft: draft && { name: draft.name, version: draft.version, tags: draft.tags, studioId: draft.studioId },
      versions: await models.DraftVersion.count({ where }),
      comments: await models.Comment.count({ where }),
      shareLinks: await models.ShareLink.count({ where }),
      members: (await models.Membership.findAll({ where: { studioId: target.studioId }, order: [['userId', 'ASC']] })).map((m) => [m.userId, m.role]),
      invitations: await models.Invitation.count({ where: { studioId: target.studioId } }),
      yarn: (await models.Yarn.findByPk(target.yarnId))?.name,
      forks: await models.Draft.count({ where: { parentDraftId: target.draftId } }),
      drafts: await models.Draft.count({ where: { studioId: target.studioId } }),
    };
  }

  beforeAll(async () => {
    target = await makeStudio('Target');
    for (const role of roles) {
      const { client, user, studioId } = await server.signInWithRole(role === 'admin' ? 'owner' : role);
      if (role === 'admin') await user.update({ isAdmin: true });
      const draft = await createDraft(server.ctx.models, { ownerId: user.id, studioId, document: pointTwillScarf(), tags: [] });
      callers.set(role, { client, studioId, draftId: draft.id });
    }
  }, 60_000);

  it('classifies every route in the table: on a resource, aimed through its input, or not applicable', () => {
    const unclassified = routeTable.filter((r) => !r.resource && !(keyOf(r) in notApplicable) && !(keyOf(r) in aimed)).map(keyOf);
    expect(unclassified).toEqual([]);
    const stale = [...Object.keys(notApplicable), ...Object.keys(aimed)].filter((k) => !routeTable.some((r) => keyOf(r) === k));
    expect(stale).toEqual([]);
  });

  const resourceRows = routeTable.filter((r) => r.resource).flatMap((spec) => roles.map((role) => [keyOf(spec), role, spec] as const));
  it.each(resourceRows)('%s as a %s of another studio: 404, like an id that does not exist', async (key, role, spec) => {
    const { client } = callers.get(role)!;
    const body = validBodies[key]?.(target);
    const res = await call(client, spec, pathIn(spec, target), body);
    expect(res.status, `${key} as ${role}: ${JSON.stringify(res.body)}`).toBe(404);
    expect(res.body.error.code).toBe('not_found');
    // The same as for an id no studio or draft has: the answer says nothing about the target existing.
    const none = await call(client, spec, pathIn(spec, ghost), body);
    expect({ status: none.status, body: none.body }).toEqual({ status: res.status, body: res.body });
    countsByRoute[key] = (countsByRoute[key] ?? 0) + 1;
  });

  const aimedRows = Object.keys(aimed).flatMap((key) => roles.map((role) => [key, role] as const));
  it.each(aimedRows)('%s as a %s of another studio: the target is out of reach', async (key, role) => {
    await aimed[key](role);
    countsByRoute[key] = (countsByRoute[key] ?? 0) + 1;
  });

  it("refuses the target's ids smuggled into requests on the caller's own draft and studio", async () => {
    for (const role of roles) {
      const own = callers.get(role)!;
      // Forking one's own draft into a studio one is not in.
      const fork = await own.client.post(`/api/drafts/${own.draftId}/fork`, { name: 'Smuggled fork', studioId: target.studioId });
      expect(fork.status, `fork as ${role}: ${JSON.stringify(fork.body)}`).toBe(404);
      // The target's comment and photo through the caller's own draft.
      expect((await own.client.delete(`/api/drafts/${own.draftId}/comments/${target.commentId}`)).status).toBe(404);
      expect((await own.client.get(`/api/drafts/${own.draftId}/photos/${target.photoId}`)).status).toBe(404);
      // The target's member through the caller's own studio: owners get 404 (no such member here),
      // the others their own studio's 403, which says nothing about the target.
      const change = await own.client.patch(`/api/studios/${own.studioId}/members/${target.memberId}`, { role: 'owner' });
      expect(change.status, `member change as ${role}`).toBe(role === 'owner' || role === 'admin' ? 404 : 403);
      const remove = await own.client.delete(`/api/studios/${own.studioId}/members/${target.memberId}`);
      expect(remove.status, `member removal as ${role}`).toBe(role === 'owner' || role === 'admin' ? 404 : 403);
    }
  });

  it('changed nothing of the target, and its own owner still reaches every route', async () => {
    const before = await snapshot();
    expect(before.draft).toEqual({ name: 'Point twill scarf', version: 1, tags: ['private'], studioId: target.studioId });
    expect(before).toMatchObject({ versions: 1, comments: 1, shareLinks: 1, invitations: 0, yarn: 'Target wool', forks: 0, drafts: 1 });
    expect(before.members).toHaveLength(2);
    // Control: the same paths answer the target's owner (reads only, so the target stays as it is).
    for (const spec of routeTable.filter((r) => r.resource && r.method === 'get')) {
      const res = await target.owner.get(pathIn(spec, target));
      expect(res.status, `${keyOf(spec)} as the target's owner`).toBe(200);
    }
    const total = Object.values(countsByRoute).reduce((a, b) => a + b, 0);
    console.log(`security: ${total} route × role cases against another studio (${Object.keys(countsByRoute).length} routes × ${roles.length} roles)`);
    expect(Object.keys(countsByRoute).length).toBe(routeTable.filter((r) => r.resource).length + Object.keys(aimed).length);
  });
});

describe('share tokens', () => {
  let s: Studio;
  beforeAll(async () => { s = await makeStudio('Tokens'); });

  it('carry at least 128 random bits, never repeat, and look like coin flips', async () => {
    const tokens: string[] = [];
    for (let i = 0; i < 100; i++) tokens.push((await s.owner.post(`/api/drafts/${s.draftId}/share`)).body.token as string);
    expect(new Set(tokens).size).toBe(tokens.length);
    let ones = 0;
    let bits = 0;
    for (const token of tokens) {
      const bytes = Buffer.from(token, 'base64url');
      expect(bytes.toString('base64url')).toBe(token);
      // Source: NIST SP 800-63B §5.1 and OWASP session guidance ask for at least 64 bits (from memory); we keep 128 for margin.
      expect(bytes.length * 8).toBeGreaterThanOrEqual(128);
      for (const b of bytes) for (let k = 0; k < 8; k++) ones += (b >> k) & 1;
      bits += bytes.length * 8;
    }
    // Over ~25 600 bits a fair source lands within 0.5 ± 0.03 (more than 9 standard deviations).
    expect(ones / bits).toBeGreaterThan(0.47);
    expect(ones / bits).toBeLessThan(0.53);
    s.shareToken = tokens.at(-1)!;
    expect((await server.client().get(`/api/shared/${s.shareToken}`)).status).toBe(200);
  });

  it('answer 404 to random tokens and to near misses of a real one, the same answer as for a withdrawn link', async () => {
    const anonymous = server.client();
    const live = s.shareToken;
    const notFound = (await anonymous.get(`/api/shared/${randomBytes(32).toString('base64url')}`)).body;
    await fc.assert(fc.asyncProperty(
      fc.oneof(
        fc.uint8Array({ minLength: 16, maxLength: 48 }).map((b) => Buffer.from(b).toString('base64url')),
        // One character changed, the case flipped, cut short or lengthened.
        fc.tuple(fc.nat({ max: live.length - 1 }), fc.constantFrom(...'ABCabc019-_')).map(([i, ch]) => live.slice(0, i) + ch + live.slice(i + 1))
          .filter((t) => t !== live),
        fc.constant(live.toUpperCase()), fc.constant(live.toLowerCase()), fc.constant(live.slice(0, -1)), fc.constant(`${live}A`),
      ).filter((t) => t !== live),
      async (token) => {
        const res = await anonymous.get(`/api/shared/${token}`);
        expect(res.status, token).toBe(404);
        expect(res.body).toEqual(notFound);
      },
    ), { numRuns: 60, seed: 12 });

    await s.owner.delete(`/api/drafts/${s.draftId}/share`);
    const withdrawn = await anonymous.get(`/api/shared/${live}`);
    expect({ status: withdrawn.status, body: withdrawn.body }).toEqual({ status: 404, body: notFound });
  });

  it('take about as long to refuse whether the token was never issued or was withdrawn', async () => {
    const anonymous = server.client();
    const withdrawn = s.shareToken;
    const time = async (token: string) => {
      const t = performance.now();
      expect((await anonymous.get(`/api/shared/${token}`)).status).toBe(404);
      return performance.now() - t;
    };
    const never: number[] = [];
    const revoked: number[] = [];
    // Interleaved, so a busy moment on the machine falls on both kinds alike.
    for (let i = 0; i < 40; i++) {
      never.push(await time(randomBytes(32).toString('base64url')));
      revoked.push(await time(withdrawn));
    }
    const median = (xs: number[]) => xs.sort((a, b) => a - b)[xs.length >> 1];
    const [a, b] = [median(never), median(revoked)];
    // The lookup is by a hash of the token, so neither kind should be cheaper; a loose bound keeps a busy machine from failing it.
    expect(Math.abs(a - b), `never issued ${a.toFixed(1)} ms, withdrawn ${b.toFixed(1)} ms`).toBeLessThan(Math.max(10, 0.5 * Math.max(a, b)));
  });
});

describe('sessions', () => {
  it('take their maximum age from SHEDWRIGHT_SESSION_MAX_AGE_MS, 30 days when unset', () => {
    expect(loadConfig({ SHEDWRIGHT_SESSION_MAX_AGE_MS: '5000' }).sessionMaxAgeMs).toBe(5000);
    expect(loadConfig({}).sessionMaxAgeMs).toBe(30 * 24 * 60 * 60 * 1000);
    expect(() => loadConfig({ SHEDWRIGHT_SESSION_MAX_AGE_MS: 'soon' })).toThrow(/SHEDWRIGHT_SESSION_MAX_AGE_MS/);
  });

  it('expire: a session cookie older than the maximum age signs nobody in, even sent again by hand', async () => {
    const maxAge = 1500;
    const short = await startTestServer({ sessionMaxAgeMs: maxAge });
    try {
      const user = await short.createUser();
      const client = short.client();
      const signIn = await client.signIn(user.email);
      const setCookie = (signIn.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith(`${SESSION_COOKIE}=`))!;
      expect(setCookie).toMatch(/Expires=/);
      const cookie = setCookie.split(';')[0];
      const sessionWith = async () => (await short.client().agent.get('/api/session').set('cookie', cookie)).body.user;
      // Within the maximum age the cookie signs the user in (so the test below can fail).
      expect((await sessionWith())?.id).toBe(user.id);
      await new Promise((r) => setTimeout(r, maxAge + 500));
      // A browser drops the cookie itself; a copied cookie sent anyway must not work either.
      expect(await sessionWith()).toBeNull();
      expect((await short.client().agent.get('/api/drafts').set('cookie', cookie)).status).toBe(401);
    } finally {
      await short.close();
    }
  });
});

describe('sign-in rate limit', () => {
  it('answers 429 once the limit is reached, even to the right password, and counts resets on their own', async () => {
    const limited = await startTestServer({ rateLimit: { windowMs: 60_000, signIn: 3, passwordReset: 2 } });
    try {
      const user = await limited.createUser();
      const client = limited.client();
      for (let i = 0; i < 3; i++) expect((await client.post('/api/auth/sign-in', { email: user.email, password: `guess-number-${i}` })).status).toBe(401);
      const right = await client.post('/api/auth/sign-in', { email: user.email, password: TEST_PASSWORD });
      expect(right.status).toBe(429);
      expect(right.body.error.code).toBe('rate_limited');
      expect(right.headers.ratelimit).toBeDefined();
      // Another client from the same address is held back too: the limit is per address, not per cookie.
      expect((await limited.client().post('/api/auth/sign-in', { email: user.email, password: TEST_PASSWORD })).status).toBe(429);
      const reset = () => limited.client().post('/api/auth/reset', { token: randomBytes(32).toString('base64url'), password: 'a-new-long-password' });
      for (let i = 0; i < 2; i++) expect((await reset()).status).toBe(400);
      expect((await reset()).status).toBe(429);
    } finally {
      await limited.close();
    }
  });
});

describe('CSRF', () => {
  const changing = routeTable.filter((r) => r.method !== 'get');
  it.each(changing.map((spec) => [keyOf(spec), spec] as const))('%s refuses a request without a token or with a wrong one (403)', async (key, spec) => {
    const s = await makeStudio('Csrf');
    const path = pathIn(spec, s);
    const body = validBodies[key]?.(s) ?? {};
    for (const token of [null, 'not-the-token', (await server.client().csrf())]) {
      let req = s.owner.agent[spec.method](path);
      if (token) req = req.set('x-csrf-token', token);
      const res = await req.send(body as object);
      expect(res.status, `${key} with token ${token}: ${JSON.stringify(res.body)}`).toBe(403);
      expect(res.body.error.code).toBe('csrf');
    }
    // Nothing happened: the draft, its share link, comment, member and yarn are as they were.
    const { models } = server.ctx;
    expect((await models.Draft.findByPk(s.draftId))).toMatchObject({ name: 'Point twill scarf', version: 1 });
    expect(await models.Comment.count({ where: { draftId: s.draftId } })).toBe(1);
    expect(await models.ShareLink.count({ where: { draftId: s.draftId, revokedAt: null } })).toBe(1);
    expect(await models.Membership.count({ where: { studioId: s.studioId } })).toBe(2);
    expect((await models.Yarn.findByPk(s.yarnId))?.name).toBe('Csrf wool');
    // The same request with the session's token is let through (it is not refused for another reason).
    const allowed = await call(s.owner, spec, path, body);
    expect(allowed.body?.error?.code).not.toBe('csrf');
  });
});

describe('passwords', () => {
  it('never appear in logs or answers through sign-up, sign-in, reset; no answer carries a password hash', async () => {
    const writes: string[] = [];
    const spies = [
      ...(['log', 'info', 'warn', 'error', 'debug'] as const).map((m) => vi.spyOn(console, m)),
      vi.spyOn(process.stdout, 'write').mockImplementation((chunk) => { writes.push(String(chunk)); return true; }),
      vi.spyOn(process.stderr, 'write').mockImplementation((chunk) => { writes.push(String(chunk)); return true; }),
    ];
    const first = 'first-secret-password-5521';
    const second = 'second-secret-password-8832';
    const texts: string[] = [];
    try {
      const email = uniqueEmail('quiet');
      const client = server.client();
      texts.push((await client.post('/api/auth/sign-up', { email, password: first, name: 'Quiet' })).text);
      texts.push((await server.signUp(client, { email, password: first, name: 'Quiet' })).text);
      texts.push((await client.post('/api/auth/sign-out')).text);
      texts.push((await client.post('/api/auth/sign-in', { email, password: `${first}-wrong` })).text);
      texts.push((await client.post('/api/auth/sign-in', { email, password: first })).text);
      texts.push((await client.post('/api/auth/forgot', { email })).text);
      const user = await server.ctx.models.User.findOne({ where: { email } });
      const token = await freshResetToken(user!.id);
      texts.push((await server.client().post('/api/auth/reset', { token, password: second })).text);
      texts.push((await server.client().post('/api/auth/sign-in', { email, password: second })).text);
    } finally {
      for (const spy of spies) spy.mockRestore();
    }
    const logged = [...spies.slice(0, 5).flatMap((spy) => spy.mock.calls.map((c) => JSON.stringify(c))), ...writes].join('\n');
    for (const password of [first, second]) {
      expect(logged).not.toContain(password);
      for (const text of texts) expect(text).not.toContain(password);
    }
    expect(JSON.parse(texts.at(-1)!).user).toBeDefined();

    // Every read in the table, as an owner of everything it names.
    const s = await makeStudio('Hashes');
    const reads = routeTable.filter((r) => r.method === 'get');
    for (const spec of reads) {
      const res = await s.owner.get(pathIn(spec, s));
      expect(res.status, keyOf(spec)).toBeLessThan(500);
      const text = res.text ?? '';
      expect(text, keyOf(spec)).not.toMatch(/passwordHash|\$argon2/);
      expect(text, keyOf(spec)).not.toContain(TEST_PASSWORD);
    }
  });
});

describe('SQL injection through every text field', () => {
  /** Classic attempts, each made unique per case so a hit cannot come from an earlier case. */
  const attacks = ["' OR 1=1 --", '"; DROP TABLE Users; --', "\\' UNION SELECT passwordHash FROM Users --", "1'; SELECT SLEEP(3); --"];
  type Path = (string | number)[];
  interface Def { type: string; shape?: Record<string, z.ZodType>; element?: z.ZodType; in?: z.ZodType; innerType?: z.ZodType }

  /** Where a string can go in a body the schema describes (enums too: they must refuse the attempt). */
  function textPaths(schema: z.ZodType, path: Path = []): Path[] {
    const def = schema._zod.def as unknown as Def;
    if (def.type === 'string' || def.type === 'enum') return [path];
    if (def.type === 'object') return Object.entries(def.shape!).flatMap(([k, s]) => textPaths(s, [...path, k]));
    // The draft document is checked by the engine, not the schema; its name and notes are text all the same.
    if (def.type === 'unknown' && path.at(-1) === 'document') return [[...path, 'name'], [...path, 'notes']];
    if (def.type === 'array') return textPaths(def.element!, [...path, 0]);
    if (def.type === 'pipe') return textPaths(def.in!, path);
    if (def.innerType) return textPaths(def.innerType, path);
    return [];
  }

  function withValue(body: unknown, path: Path, value: string): unknown {
    const copy = structuredClone(body ?? {}) as Record<string | number, unknown>;
    let at = copy;
    path.forEach((key, i) => {
      if (i === path.length - 1) at[key] = value;
      else {
        at[key] ??= typeof path[i + 1] === 'number' ? [] : {};
        at = at[key] as Record<string | number, unknown>;
      }
    });
    return copy;
  }

  let s: Studio;
  /** Resets change a password and may end the user's other sessions: they happen to someone else. */
  let resetUser: { id: number; email: string };
  let tablesBefore: string[];
  let usersBefore: number;
  let cases = 0;
  const outcomes = { refused: 0, stored: 0, passwords: 0, searches: 0 };
  beforeAll(async () => {
    s = await makeStudio('Injection');
    resetUser = await server.createUser({ name: 'Resetting' });
    tablesBefore = (await server.ctx.sequelize.query<{ name: string }>('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY 1', { type: QueryTypes.SELECT })).map((r) => r.name);
    usersBefore = await server.ctx.models.User.count();
  });

  /** Everything the studio's owner can read back, with the answer itself and any draft it made. */
  async function readBack(answer: { body: Record<string, unknown>; text: string }): Promise<string> {
    const made = (answer.body?.draft as { id?: number } | undefined)?.id;
    const paths = [`/api/drafts/${s.draftId}`, `/api/drafts/${s.draftId}/versions`, `/api/drafts/${s.draftId}/comments`, `/api/drafts/${s.draftId}/plan`,
      `/api/drafts/${s.draftId}/results`, '/api/yarns', '/api/studios', `/api/studios/${s.studioId}`, ...(made ? [`/api/drafts/${made}`] : [])];
    const texts = [answer.text];
    for (const p of paths) texts.push((await s.owner.get(p)).text);
    return texts.join('\n');
  }

  const bodyRoutes = routeTable.filter((r) => r.body && !r.upload);
  it.each(bodyRoutes.map((spec) => [keyOf(spec), spec] as const))('%s: refused (4xx) or stored and read back verbatim', async (key, spec) => {
    const paths = textPaths(spec.body!);
    for (const path of paths) {
      for (const attack of attacks) {
        cases += 1;
        const value = `${attack} #${cases}`;
        // Account routes change who the client is: each attempt gets a fresh client there.
        const isAuth = spec.path.startsWith('/api/auth/');
        const client = isAuth ? server.client() : s.owner;
        let base = validBodies[key](s);
        if (key === 'PUT /api/drafts/:id') base = { ...(base as object), baseVersion: (await server.ctx.models.Draft.findByPk(s.draftId))!.version };
        if (key === 'POST /api/auth/reset') base = { ...(base as object), token: await freshResetToken(resetUser.id) };
        let res = await client.send(spec.method, pathIn(spec, s), withValue(base, path, value));
        if (key === 'POST /api/auth/sign-up' && res.status === 202) {
          // The account is made from the mailed link: its answer is what reads back.
          const { email } = withValue(base, path, value) as { email: string };
          const token = decodeURIComponent(/\/welcome\?token=([\w%-]+)/.exec((await server.mailTo(email, /Finish making/)).text)![1]);
          res = await client.post('/api/auth/sign-up/confirm', { token });
        }
        const what = `${key} ${path.join('.')} = ${value}: ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`;
        expect(res.status, what).toBeLessThan(500);
        if (res.status >= 400) {
          outcomes.refused += 1;
          continue;
        }
        if (path.at(-1) === 'password') {
          outcomes.passwords += 1;
          // Stored as a hash: it reads back by signing in with it.
          const email = key === 'POST /api/auth/reset' ? resetUser.email : (withValue(base, path, value) as { email: string }).email;
          expect((await server.client().post('/api/auth/sign-in', { email, password: value })).status, what).toBe(200);
          continue;
        }
        // Only a wrong sign-in or an unknown e-mail can succeed without storing anything, and both were refused above.
        expect(await readBack(res), what).toContain(JSON.stringify(value).slice(1, -1));
        outcomes.stored += 1;
      }
    }
  }, 120_000);

  it('finds nothing with injected search text, and leaves every table in place', async () => {
    for (const attack of attacks) {
      for (const field of ['q', 'tag', 'structure']) {
        const res = await s.owner.get(`/api/drafts?${field}=${encodeURIComponent(`${attack} #q`)}`);
        expect(res.status, `${field}=${attack}`).toBe(200);
        expect(res.body.total, `${field}=${attack}`).toBe(0);
        cases += 1;
        outcomes.searches += 1;
      }
    }
    const tablesAfter = (await server.ctx.sequelize.query<{ name: string }>('SELECT table_name AS name FROM information_schema.tables WHERE table_schema = DATABASE() ORDER BY 1', { type: QueryTypes.SELECT })).map((r) => r.name);
    expect(tablesAfter).toEqual(tablesBefore);
    expect(await server.ctx.models.User.count()).toBeGreaterThanOrEqual(usersBefore);
    expect(await server.ctx.models.Draft.findByPk(s.draftId)).not.toBeNull();
    console.log(`security: ${cases} SQL injection attempts (${outcomes.refused} refused with a 4xx, ${outcomes.stored} stored and read back verbatim, `
      + `${outcomes.passwords} passwords that sign in as typed, ${outcomes.searches} searches finding nothing); tables intact`);
    expect(outcomes.stored).toBeGreaterThan(20);
  });
});

describe('broken text', () => {
  it('finding 8: a lone UTF-16 surrogate in a draft name, tag, notes, fork name or WIF title is refused (400/422), never a 500', async () => {
    const errorsBefore = loggedErrors().length;
    {
      const s = await makeStudio('Surrogates');
      const lone = 'Scarf \uD800 end';
      const answers = [
        await s.owner.post('/api/drafts', { name: lone, document: pointTwillScarf() }),
        await s.owner.patch(`/api/drafts/${s.draftId}`, { tags: ['wool', lone] }),
        await s.owner.send('put', `/api/drafts/${s.draftId}`, { document: { ...pointTwillScarf(), notes: `Notes ${lone}` }, baseVersion: 1 }),
        await s.owner.post(`/api/drafts/${s.draftId}/fork`, { name: lone }),
        await s.owner.post(`/api/drafts/${s.draftId}/comments`, { text: lone }),
      ];
      for (const res of answers) {
        expect(res.status, res.text).toBe(400);
        expect(JSON.stringify(res.body.error.fields)).toMatch(/broken character/);
      }
      // A WIF title may carry the half as a JSON escape.
      const wif = toWif(pointTwillScarf()).replace(/^Title=.*$/m, 'Title="Scarf \\ud800 end"');
      const imported = await s.owner.agent.post('/api/drafts/import-wif').set('x-csrf-token', await s.owner.csrf()).attach('file', Buffer.from(wif), 'scarf.wif');
      expect(imported.status, imported.text).toBe(422);
      expect(imported.body.error.message).toMatch(/broken character/);
      // Well-formed pairs are text like any other.
      expect((await s.owner.post('/api/drafts', { name: 'Scarf 🧶', document: pointTwillScarf() })).status).toBe(201);
      expect(loggedErrors().slice(errorsBefore)).toEqual([]);
    }
  });

  it('finding 8: a database error is logged with its stack but without its SQL or the values it carried', async () => {
    const s = await makeStudio('Quiet errors');
    const secret = 'private-tag-6617';
    // A value MariaDB itself refuses, written past the schemas, as a bug would.
    const failure = await server.ctx.models.Draft.update({ tags: [`${secret} \uD800`] }, { where: { id: s.draftId } }).then(() => null, (err: unknown) => err);
    expect(failure).toBeInstanceOf(Error);
    const dir = mkdtempSync(join(tmpdir(), 'shedwright-log-'));
    try {
      const app = express();
      app.use(requestLog(createLogger({ level: 'info', file: join(dir, 'app.log'), sync: true })));
      app.get('/fails', () => { throw failure; });
      app.use(errorHandler);
      const res = await request(app).get('/fails');
      expect(res.status).toBe(500);
      const lines = readFileSync(join(dir, 'app.log'), 'utf8').trim().split('\n').map((l) => JSON.parse(l) as LogLine);
      expect(lines).toHaveLength(1);
      expect(lines[0]).toMatchObject({ level: 50, req: { method: 'GET', path: '/fails' }, res: { status: 500 } });
      expect(lines[0].id).toBe(res.headers['x-request-id']);
      expect(lines[0].err?.stack).toMatch(/^SequelizeDatabaseError.*\n\s+at /);
      const logged = JSON.stringify(lines);
      expect(logged).not.toContain(secret);
      expect(logged).not.toMatch(/UPDATE|parameters/);
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });
});

interface LogLine {
  level: number;
  id?: string;
  msg?: string;
  req?: { method: string; path: string };
  res?: { status: number };
  err?: { stack?: string };
}

/** What the apps of this file have logged so far (their log file, from tests/helpers/test-db.ts). */
function logLines(): LogLine[] {
  if (!existsSync(testLogFile)) return [];
  return readFileSync(testLogFile, 'utf8').split('\n').filter(Boolean).map((l) => JSON.parse(l) as LogLine);
}
const loggedErrors = () => logLines().filter((l) => l.level >= 50);

// Runs last in this file: everything the suite above sent has been logged by then.
describe('the log after the security suite', () => {
  it('has one line per request with its id, and never a password, token, cookie or request body', () => {
    const text = existsSync(testLogFile) ? readFileSync(testLogFile, 'utf8') : '';
    const requests = logLines().filter((l) => l.req && l.res);
    expect(requests.length).toBeGreaterThan(500);
    for (const line of requests) {
      expect(line.id).toMatch(/^[\w.-]{8,64}$/);
      expect(line.req!.method).toMatch(/^[A-Z]+$/);
    }
    for (const password of [TEST_PASSWORD, 'first-secret-password-5521', 'second-secret-password-8832', 'a-new-long-password', 'guess-number-']) {
      expect(text).not.toContain(password);
    }
    // No header is logged: not the cookie, the CSRF token or any authorisation; no body field either.
    expect(text).not.toMatch(/"(cookie|set-cookie|x-csrf-token|authorization|headers|password|email)"/i);
    expect(text).not.toContain(SESSION_COOKIE);
    // Share and reset tokens are 43 base64url characters, CSRF tokens 64 hex: no such run is logged
    // (apart from the request ids, UUIDs the server made).
    expect(text.replace(/"id":"[\w-]+"/g, '')).not.toMatch(/[\w-]{32,}/);
    // Bodies: nothing of a draft (its name, palette or threading) or of a comment's text.
    expect(text).not.toMatch(/"(body|document|threading|palette|text)"/);
    expect(text).not.toContain('Scarf');
  });
});
