import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { studioDetailResponseSchema, studioListResponseSchema } from '../../shared/api/studios';
import { startTestServer, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server.close(); });

describe('studios', () => {
  it('makes the creator owner, lists it with its member count, shows its members', async () => {
    const user = await server.createUser({ name: 'Founder' });
    const client = server.client();
    await client.signIn(user.email);
    const created = await client.post('/api/studios', { name: '  Loft Weavers  ' });
    expect(created.status).toBe(201);
    expect(created.body.studio).toMatchObject({ name: 'Loft Weavers', role: 'owner' });

    const list = studioListResponseSchema.parse((await client.get('/api/studios')).body);
    expect(list.studios).toEqual([{ id: created.body.studio.id, name: 'Loft Weavers', role: 'owner', memberCount: 1 }]);

    const detail = studioDetailResponseSchema.parse((await client.get(`/api/studios/${created.body.studio.id}`)).body);
    expect(detail.members).toEqual([{ userId: user.id, name: 'Founder', email: user.email, role: 'owner' }]);
    const session = await client.get('/api/session');
    expect(session.body.user.memberships).toEqual([{ studioId: created.body.studio.id, studioName: 'Loft Weavers', role: 'owner' }]);
  });

  it('lets an owner change roles, and the new role takes effect at once', async () => {
    const { client: viewer, user, studioId, ownerId } = await server.signInWithRole('viewer');
    const owner = await server.ctx.models.User.findByPk(ownerId);
    const ownerClient = server.client();
    await ownerClient.signIn(owner!.email);
    expect((await viewer.patch(`/api/studios/${studioId}/members/${ownerId}`, { role: 'viewer' })).status).toBe(403);
    const res = await ownerClient.patch(`/api/studios/${studioId}/members/${user.id}`, { role: 'owner' });
    expect(res.status).toBe(200);
    expect(res.body.members.find((m: { userId: number }) => m.userId === user.id).role).toBe('owner');
    // Promoted: the former viewer may now demote the first owner.
    expect((await viewer.patch(`/api/studios/${studioId}/members/${ownerId}`, { role: 'editor' })).status).toBe(200);
  });

  it('keeps at least one owner: the last owner can neither step down nor leave', async () => {
    const { client, user, studioId } = await server.signInWithRole('owner');
    const demote = await client.patch(`/api/studios/${studioId}/members/${user.id}`, { role: 'editor' });
    expect(demote.status).toBe(409);
    const leave = await client.delete(`/api/studios/${studioId}/members/${user.id}`);
    expect(leave.status).toBe(409);
  });

  it('lets any member leave, after which the studio is hidden from them', async () => {
    const { client, user, studioId } = await server.signInWithRole('viewer');
    const res = await client.delete(`/api/studios/${studioId}/members/${user.id}`);
    expect(res.status).toBe(200);
    expect(res.body.members.some((m: { userId: number }) => m.userId === user.id)).toBe(false);
    expect((await client.get(`/api/studios/${studioId}`)).status).toBe(404);
  });

  it('answers 404 for a member that is not in the studio and for a studio that does not exist', async () => {
    const { client, studioId } = await server.signInWithRole('owner');
    const stranger = await server.createUser();
    expect((await client.patch(`/api/studios/${studioId}/members/${stranger.id}`, { role: 'editor' })).status).toBe(404);
    expect((await client.get('/api/studios/2147483647')).status).toBe(404);
  });

  it('rejects an unknown role with 400', async () => {
    const { client, user, studioId } = await server.signInWithRole('owner');
    const res = await client.patch(`/api/studios/${studioId}/members/${user.id}`, { role: 'admin' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.role).toBeTruthy();
  });
});

describe('drafts made in a studio belong to the studio', () => {
  /** An editor who made a draft in the studio, and the studio's owner, both signed in. */
  async function authorAndOwner() {
    const { client: author, user, studioId, ownerId } = await server.signInWithRole('editor');
    const owner = server.client();
    await owner.signIn((await server.ctx.models.User.findByPk(ownerId))!.email);
    const made = await author.post('/api/drafts', { name: 'Studio scarf', document: pointTwillScarf(), studioId });
    expect(made.status).toBe(201);
    const draftId = made.body.draft.id as number;
    expect((await author.post(`/api/drafts/${draftId}/comments`, { text: 'Sley 2 per dent' })).status).toBe(201);
    return { author, user, owner, studioId, draftId };
  }
  const libraryIds = async (client: ReturnType<TestServer['client']>) =>
    ((await client.get('/api/drafts?pageSize=100')).body.items as { id: number }[]).map((d) => d.id);

  it('finding 1: a removed member loses every right on the studio drafts they created, and the drafts stay with the studio', async () => {
    const { author, user, owner, studioId, draftId } = await authorAndOwner();
    expect((await owner.delete(`/api/studios/${studioId}/members/${user.id}`)).status).toBe(200);

    expect((await author.get(`/api/drafts/${draftId}`)).status).toBe(404);
    expect((await author.get(`/api/drafts/${draftId}/comments`)).status).toBe(404);
    expect((await author.post(`/api/drafts/${draftId}/share`)).status).toBe(404);
    expect((await author.delete(`/api/drafts/${draftId}`)).status).toBe(404);
    expect(await libraryIds(author)).not.toContain(draftId);

    // Still the studio's, with its history, and still naming who made it.
    const kept = await owner.get(`/api/drafts/${draftId}`);
    expect(kept.status).toBe(200);
    expect(kept.body.draft).toMatchObject({ studioId, ownerName: 'Test editor' });
    expect((await owner.get(`/api/drafts/${draftId}/versions`)).status).toBe(200);
    expect(await libraryIds(owner)).toContain(draftId);
  });

  it('finding 1: a demoted author has the studio role they hold now, not owner rights on their own drafts', async () => {
    const { author, user, owner, studioId, draftId } = await authorAndOwner();
    // As an editor the author edits but, like every editor, may not delete the studio's draft.
    expect((await author.patch(`/api/drafts/${draftId}`, { tags: ['wool'] })).status).toBe(200);
    expect((await author.delete(`/api/drafts/${draftId}`)).status).toBe(403);
    expect((await author.get(`/api/drafts/${draftId}`)).body.draft.role).toBe('editor');

    expect((await owner.patch(`/api/studios/${studioId}/members/${user.id}`, { role: 'viewer' })).status).toBe(200);
    expect((await author.get(`/api/drafts/${draftId}`)).body.draft.role).toBe('viewer');
    expect((await author.post(`/api/drafts/${draftId}/share`)).status).toBe(403);
    expect((await author.patch(`/api/drafts/${draftId}`, { name: 'Mine now' })).status).toBe(403);
    expect((await author.delete(`/api/drafts/${draftId}`)).status).toBe(403);
    expect((await owner.get(`/api/drafts/${draftId}`)).status).toBe(200);
  });
});
