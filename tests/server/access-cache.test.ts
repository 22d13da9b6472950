// The in-process caches (server/models/access-cache.ts and the session copies in server/context.ts):
// every answer they give must be the one MariaDB would give, right after any write through the app.
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { draftListResponseSchema } from '../../shared/api';
import type { CacheDrop, CacheRelay } from '../../server/cluster/relay';
import { createSequelize } from '../../server/db/sequelize';
import { defineModels } from '../../server/models';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { createDraft } from '../../server/services/drafts';
import { createStudio } from '../../server/services/studios';
import { tokenHash } from '../../server/services/tokens';
import { startTestServer, type TestServer } from '../helpers/server';
import { testConfig } from '../helpers/test-db';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server?.close(); });

const listed = async (client: ReturnType<TestServer['client']>) =>
  draftListResponseSchema.parse((await client.get('/api/drafts')).body).items;

describe('the access and library caches', () => {
  it('are on for the app by default', () => {
    expect(server.ctx.config.processCaches).toBe(true);
  });

  it('take away a removed member\'s access at the next request', async () => {
    const { ctx } = server;
    const owner = await server.createUser({ name: 'Studio owner' });
    const member = await server.createUser({ name: 'Member' });
    const studio = await createStudio(ctx.models, owner.id, 'Cache studio');
    await ctx.models.Membership.create({ studioId: studio.id, userId: member.id, role: 'viewer' });
    const draft = await createDraft(ctx.models, { ownerId: owner.id, studioId: studio.id, document: pointTwillScarf(), tags: [] });
    const ownerClient = server.client();
    await ownerClient.signIn(owner.email);
    const memberClient = server.client();
    await memberClient.signIn(member.email);

    // Twice, so the second answer comes from the caches.
    for (let i = 0; i < 2; i++) {
      expect((await memberClient.get(`/api/drafts/${draft.id}`)).status).toBe(200);
      expect((await listed(memberClient)).map((d) => d.id)).toEqual([draft.id]);
    }
    expect((await ownerClient.delete(`/api/studios/${studio.id}/members/${member.id}`)).status).toBe(200);
    expect((await memberClient.get(`/api/drafts/${draft.id}`)).status).toBe(404);
    expect(await listed(memberClient)).toEqual([]);
  });

  it('show every save, rename, new and deleted draft in the library at once', async () => {
    const { ctx } = server;
    const user = await server.createUser();
    const client = server.client();
    await client.signIn(user.email);
    const first = await createDraft(ctx.models, { ownerId: user.id, studioId: null, document: pointTwillScarf(), tags: [] });
    expect((await listed(client)).map((d) => [d.id, d.version])).toEqual([[first.id, 1]]);

    const saved = await client.send('put', `/api/drafts/${first.id}`, { baseVersion: 1, document: { ...pointTwillScarf(), notes: 'second' } });
    expect(saved.status).toBe(200);
    expect((await listed(client)).map((d) => [d.id, d.version])).toEqual([[first.id, 2]]);

    expect((await client.patch(`/api/drafts/${first.id}`, { name: 'Renamed scarf' })).status).toBe(200);
    expect((await listed(client))[0].name).toBe('Renamed scarf');

    const created = await client.post('/api/drafts', { name: 'New draft', document: pointTwillScarf() });
    expect(created.status).toBe(201);
    const second = created.body.draft.id as number;
    expect((await listed(client)).map((d) => d.id).sort()).toEqual([first.id, second].sort());

    expect((await client.delete(`/api/drafts/${first.id}`)).status).toBe(204);
    expect((await listed(client)).map((d) => d.id)).toEqual([second]);
  });

  it('see a changed account at the next request', async () => {
    const user = await server.createUser();
    const client = server.client();
    await client.signIn(user.email);
    // An invitation is accepted only by the invited address, as the request's account gives it.
    const studio = await createStudio(server.ctx.models, (await server.createUser()).id, 'Cache studio');
    const token = 'cache-test-invitation-token-000000000000000';
    const email = `changed-${user.email}`;
    await server.ctx.models.Invitation.create({
      studioId: studio.id, invitedById: user.id, email, role: 'viewer', tokenHash: tokenHash(token), expiresAt: new Date(Date.now() + 60_000),
    });
    expect((await client.post('/api/invitations/accept', { token })).status).toBe(403);
    await user.update({ email });
    expect((await client.post('/api/invitations/accept', { token })).status).toBe(200);
    await user.destroy();
    expect((await client.get('/api/drafts')).status).toBe(401);
  });

  it('drop what was read while a write was still uncommitted, once it commits', async () => {
    const { ctx } = server;
    const user = await server.createUser({ name: 'Before' });
    await ctx.sequelize.transaction(async (transaction) => {
      await ctx.models.User.update({ name: 'After' }, { where: { id: user.id }, transaction });
      // Outside the transaction MariaDB still answers with the committed name, and the cache keeps it…
      expect((await ctx.models.access.account(user.id))?.name).toBe('Before');
      expect((await ctx.models.access.account(user.id))?.name).toBe('Before');
    });
    // …until the commit, which empties it again.
    expect((await ctx.models.access.account(user.id))?.name).toBe('After');
  });

  it('forget a session at sign-out, so its cookie signs nobody in', async () => {
    const user = await server.createUser();
    const client = server.client();
    const signedIn = await client.signIn(user.email);
    const cookie = (signedIn.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
    expect((await client.get('/api/drafts')).status).toBe(200);
    expect((await client.post('/api/auth/sign-out')).status).toBe(200);
    const replay = await server.client().agent.get('/api/drafts').set('cookie', cookie);
    expect(replay.status).toBe(401);
  });
});

describe('with SHEDWRIGHT_PROCESS_CACHES=0 (several app servers)', () => {
  let other: TestServer;
  beforeAll(async () => { other = await startTestServer({ processCaches: false }); });
  afterAll(async () => { await other?.close(); });

  it('one server sees another server\'s writes at once', async () => {
    const user = await other.createUser();
    const client = other.client();
    await client.signIn(user.email);
    expect(await listed(client)).toEqual([]);
    // Written through the first app's models: the second app has no way of hearing about it.
    const draft = await createDraft(server.ctx.models, { ownerId: user.id, studioId: null, document: pointTwillScarf(), tags: [] });
    expect((await listed(client)).map((d) => d.id)).toEqual([draft.id]);
    await server.ctx.models.Draft.destroy({ where: { id: draft.id } });
    expect((await client.get(`/api/drafts/${draft.id}`)).status).toBe(404);
  });
});

/** A stand-in for the other processes: records what is published, and answers when told to. */
function otherProcesses() {
  const published: CacheDrop[] = [];
  const waiting: (() => void)[] = [];
  const appliers: ((drop: CacheDrop) => void)[] = [];
  const relay: CacheRelay = {
    publish: (drop) => {
      published.push(drop);
      return new Promise((resolve) => waiting.push(resolve));
    },
    subscribe: (apply) => { appliers.push(apply); },
  };
  return {
    relay,
    published,
    /** The others have all applied what was published. */
    answer: () => { for (const resolve of waiting.splice(0)) resolve(); },
    /** Another process published `drop`. */
    deliver: (drop: CacheDrop) => { for (const apply of appliers) apply(drop); },
  };
}

/** Whether `promise` settles while the event loop runs a while (longer than a database round trip). */
const settles = async (promise: Promise<unknown>) => {
  let done = false;
  void promise.then(() => { done = true; });
  await new Promise((r) => setTimeout(r, 200));
  return done;
};

/** Waits until `count` drops have been published. */
async function published(others: ReturnType<typeof otherProcesses>, count: number): Promise<CacheDrop[]> {
  for (let waited = 0; others.published.length < count && waited < 5000; waited += 10) await new Promise((r) => setTimeout(r, 10));
  return others.published;
}

describe('the caches of a process among several (server/cluster/relay.ts)', () => {
  const sequelize = createSequelize(testConfig().db);
  const others = otherProcesses();
  const models = defineModels(sequelize, { processCaches: true, relay: others.relay });
  afterAll(async () => { await sequelize.close(); });

  /** `write` tells the others to drop access rows, and finishes only once they have. */
  async function expectHeldForOthers(write: Promise<unknown>) {
    expect(await published(others, 1)).toEqual([{ kind: 'access' }]);
    expect(await settles(write)).toBe(false);
    others.answer();
    expect(await settles(write)).toBe(true);
  }

  it('finish a write only once the other processes have dropped what it changes', async () => {
    const user = await server.createUser({ name: 'Before' });
    others.published.length = 0;
    const update = models.User.update({ name: 'After' }, { where: { id: user.id } });
    await expectHeldForOthers(update);
  });

  it('tell the other processes about a write in a transaction only once it commits', async () => {
    const owner = await server.createUser();
    const studio = await createStudio(server.ctx.models, owner.id, 'Relay studio');
    const member = await server.createUser();
    others.published.length = 0;
    const transaction = sequelize.transaction(async (t) => {
      await models.Membership.create({ studioId: studio.id, userId: member.id, role: 'viewer' }, { transaction: t });
      // Before the commit another process could only read the old rows again: nothing to tell yet.
      expect(others.published).toEqual([]);
    });
    await expectHeldForOthers(transaction);
  });

  it('tell them library pages only, for a save or a rename, and nothing for a thumbnail', async () => {
    const user = await server.createUser();
    const draft = await createDraft(server.ctx.models, { ownerId: user.id, studioId: null, document: pointTwillScarf(), tags: [] });
    others.published.length = 0;
    // As services/draft-thumbnails stores it: silent, so the library's sort key stays.
    await models.Draft.update({ thumbnail: Buffer.from('png') }, { where: { id: draft.id }, silent: true });
    expect(others.published).toEqual([]);
    const saved = models.access.draftSaved();
    const renamed = models.Draft.update({ name: 'Renamed' }, { where: { id: draft.id } });
    expect(await published(others, 2)).toEqual([{ kind: 'library' }, { kind: 'library' }]);
    others.answer();
    await Promise.all([saved, renamed]);
  });

  it('drop their own copies when another process says so', async () => {
    const user = await server.createUser({ name: 'Cached name' });
    expect((await models.access.account(user.id))?.name).toBe('Cached name');
    // A write this process's hooks do not see, as if another process had made it.
    await sequelize.query('UPDATE users SET name = ? WHERE id = ?', { replacements: ['New name', user.id] });
    expect((await models.access.account(user.id))?.name).toBe('Cached name');
    others.deliver({ kind: 'library' });
    expect((await models.access.account(user.id))?.name).toBe('Cached name');
    others.deliver({ kind: 'access' });
    expect((await models.access.account(user.id))?.name).toBe('New name');
  });
});
