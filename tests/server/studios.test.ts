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
