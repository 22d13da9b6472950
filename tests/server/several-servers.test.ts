import { randomBytes } from 'node:crypto';
import type { Server } from 'node:http';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { draftListResponseSchema } from '../../shared/api';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { encodePngRgb } from '../../server/print/png';
import { HttpClient } from '../helpers/http-client';
import { startTestServer, TEST_PASSWORD, type TestServer } from '../helpers/server';

/**
 * Two app servers on two ports over one MariaDB and one S3 fake, as behind a load balancer: they
 * share nothing but the database and the bucket (and the settings every server is given alike).
 */
const namespace = `several-${randomBytes(4).toString('hex')}:`;
const shared = {
  // Behind a proxy on this machine: the client address is taken from X-Forwarded-For.
  trustProxy: 'loopback',
  rateLimit: { namespace, signIn: 3, signInPerAccount: 3 },
};
const servers: { app: TestServer; http: Server; url: string }[] = [];
let a = '';
let b = '';

beforeAll(async () => {
  for (let i = 0; i < 2; i++) {
    const app = await startTestServer(shared);
    const http = app.app.listen(0, '127.0.0.1');
    await new Promise((resolve) => http.once('listening', resolve));
    servers.push({ app, http, url: `http://127.0.0.1:${(http.address() as AddressInfo).port}` });
  }
  [a, b] = servers.map((s) => s.url);
  expect(a).not.toBe(b);
});
afterAll(async () => {
  for (const s of servers) {
    await new Promise((resolve) => s.http.close(resolve));
    await s.app.close();
  }
});

/** A fresh address from the documentation range (RFC 5737), so each test counts on its own. */
let addresses = 0;
const address = () => `198.51.100.${++addresses}`;

async function signedIn(base: string, email: string): Promise<HttpClient> {
  const client = new HttpClient(address());
  const res = await client.post(base, '/api/auth/sign-in', { email, password: TEST_PASSWORD });
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  return client;
}

describe('two app servers over one database and one object store', () => {
  it('accepts a cookie from one on the other, and refuses a member removed through one at the other\'s next request', async () => {
    const owner = await servers[0].app.createUser({ name: 'Owner on A' });
    const member = await servers[0].app.createUser({ name: 'Member on B' });
    const ownerClient = await signedIn(a, owner.email);
    const onB = await ownerClient.get(b, '/api/session');
    expect(onB.body.user).toMatchObject({ email: owner.email });

    const studio = await ownerClient.post(a, '/api/studios', { name: 'Shared loom room' });
    expect(studio.status, JSON.stringify(studio.body)).toBe(201);
    const studioId = (studio.body.studio as { id: number }).id;
    await servers[0].app.ctx.models.Membership.create({ studioId, userId: member.id, role: 'editor' });
    const draft = await ownerClient.post(a, '/api/drafts', { name: 'Studio scarf', document: pointTwillScarf(), studioId });
    expect(draft.status).toBe(201);
    const draftId = (draft.body.draft as { id: number }).id;

    const memberClient = await signedIn(b, member.email);
    expect((await memberClient.get(b, `/api/drafts/${draftId}`)).status).toBe(200);
    expect((await ownerClient.delete(a, `/api/studios/${studioId}/members/${member.id}`)).status).toBe(200);
    // The very next request on the other server: nothing there remembers the old role.
    expect((await memberClient.get(b, `/api/drafts/${draftId}`)).status).toBe(404);
    expect((await memberClient.put(b, `/api/drafts/${draftId}`, { document: pointTwillScarf(), baseVersion: 1 })).status).toBe(404);
  });

  it('shows a save made through one in the other\'s library at once', async () => {
    const owner = await servers[0].app.createUser();
    const client = await signedIn(a, owner.email);
    const created = await client.post(a, '/api/drafts', { name: 'Before', document: pointTwillScarf() });
    const id = (created.body.draft as { id: number }).id;
    for (let version = 1; version <= 3; version++) {
      const name = `Saved through A, version ${version + 1}`;
      const saved = await client.put(a, `/api/drafts/${id}`, { document: { ...pointTwillScarf(), name }, baseVersion: version });
      expect(saved.status, JSON.stringify(saved.body)).toBe(200);
      const library = draftListResponseSchema.parse((await client.get(b, '/api/drafts')).body);
      expect(library.items.find((d) => d.id === id)?.version).toBe(version + 1);
      const opened = await client.get(b, `/api/drafts/${id}`);
      expect(opened.body.draft).toMatchObject({ version: version + 1, document: { name } });
    }
  });

  it('counts sign-in failures across both, per address and per account', async () => {
    const user = await servers[0].app.createUser();
    // One address, three different accounts guessed, alternating servers: the fourth try is refused.
    const guesser = new HttpClient(address());
    for (const [i, base] of [a, b, a].entries()) {
      const res = await guesser.post(base, '/api/auth/sign-in', { email: `nobody-${i}-${randomBytes(3).toString('hex')}@test.shedwright.test`, password: 'wrong-guess-1' });
      expect(res.status).toBe(401);
    }
    expect((await guesser.post(b, '/api/auth/sign-in', { email: user.email, password: TEST_PASSWORD })).status).toBe(429);

    // One account, guessed from four addresses over both servers: refused at the fourth even with the right password.
    for (const base of [b, a, b]) {
      expect((await new HttpClient(address()).post(base, '/api/auth/sign-in', { email: user.email, password: 'wrong-guess-2' })).status).toBe(401);
    }
    const right = await new HttpClient(address()).post(a, '/api/auth/sign-in', { email: user.email, password: TEST_PASSWORD });
    expect(right.status).toBe(429);
    expect(right.body.error?.code).toBe('rate_limited');
  });

  it('serves a photo uploaded through one from the other, byte for byte', async () => {
    const owner = await servers[0].app.createUser();
    const client = await signedIn(a, owner.email);
    const created = await client.post(a, '/api/drafts', { name: 'With a photo', document: pointTwillScarf() });
    const id = (created.body.draft as { id: number }).id;
    const rgb = Buffer.alloc(8 * 8 * 3);
    for (let i = 0; i < rgb.length; i++) rgb[i] = (i * 37) % 256;
    const png = encodePngRgb(8, 8, rgb);
    const form = new FormData();
    form.append('file', new Blob([new Uint8Array(png)], { type: 'image/png' }), 'cloth.png');
    const uploaded = await client.request(a, 'POST', `/api/drafts/${id}/versions/1/photos`, form);
    expect(uploaded.status, JSON.stringify(uploaded.body)).toBe(201);
    const list = await client.get(b, `/api/drafts/${id}/photos`);
    const photos = list.body.photos as { url: string }[];
    expect(photos).toHaveLength(1);
    const served = await client.get(b, photos[0].url);
    expect(served.status).toBe(200);
    expect(served.headers.get('content-type')).toBe('image/png');
    expect(served.bytes.equals(png)).toBe(true);
  });
});
