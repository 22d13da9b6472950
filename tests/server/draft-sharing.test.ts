import { once } from 'node:events';
import fc from 'fast-check';
import { createServer, request as httpRequest, type IncomingMessage } from 'node:http';
import type { AddressInfo } from 'node:net';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  acceptInviteResponseSchema, commentListResponseSchema, PHOTO_MAX_BYTES, photoListResponseSchema, sharedDraftResponseSchema,
  yarnListResponseSchema,
} from '../../shared/api';
import { parseDraft, toWif } from '../../shared/weave';
import { pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { encodePngRgb } from '../../server/print/png';
import { createDraft } from '../../server/services/drafts';
import { sniffImageType } from '../../server/services/photos';
import { wifParseEvents } from '../../server/services/wif-parse';
import { probeLiftPlan } from '../helpers/print-fixtures';
import { startTestServer, type TestClient, type TestServer } from '../helpers/server';
import { uniqueEmail } from '../helpers/test-db';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer({ publicUrl: 'http://weave.test' });
});
afterAll(async () => {
  await server.close();
});

async function scene() {
  const { client: owner, user, studioId } = await server.signInWithRole('owner');
  const viewerUser = await server.createUser({ name: 'Student' });
  await server.ctx.models.Membership.create({ studioId, userId: viewerUser.id, role: 'viewer' });
  const viewer = server.client();
  await viewer.signIn(viewerUser.email);
  const draft = await createDraft(server.ctx.models, { ownerId: user.id, studioId, document: pointTwillScarf(), tags: [] });
  return { owner, ownerUser: user, viewer, viewerUser, studioId, draftId: draft.id };
}

const upload = async (client: TestClient, path: string, bytes: Buffer, name: string, type?: string) =>
  client.agent.post(path).set('x-csrf-token', await client.csrf()).attach('file', bytes, type ? { filename: name, contentType: type } : name);

describe('public share links', () => {
  it('gives anyone with the link the draft read-only, until it is withdrawn; only a hash is stored', async () => {
    const s = await scene();
    const made = await s.owner.post(`/api/drafts/${s.draftId}/share`);
    expect(made.status).toBe(201);
    const { url, token } = made.body as { url: string; token: string };
    expect(url).toBe(`http://weave.test/shared/${token}`);
    // 32 random bytes in base64url.
    expect(Buffer.from(token, 'base64url')).toHaveLength(32);
    const rows = await server.ctx.models.ShareLink.findAll({ where: { draftId: s.draftId } });
    expect(rows.map((r) => r.tokenHash)).not.toContain(token);

    const anonymous = server.client();
    const shared = sharedDraftResponseSchema.parse((await anonymous.get(`/api/shared/${token}`)).body);
    expect(shared.draft).toMatchObject({ name: 'Point twill scarf', ownerName: 'Test owner', version: 1 });
    expect(parseDraft(shared.draft.document)).toEqual(pointTwillScarf());
    expect((await s.owner.get(`/api/drafts/${s.draftId}/share`)).body.shared).toBe(true);

    // A second link replaces the first.
    const second = (await s.owner.post(`/api/drafts/${s.draftId}/share`)).body.token as string;
    expect((await anonymous.get(`/api/shared/${token}`)).status).toBe(404);
    expect((await anonymous.get(`/api/shared/${second}`)).status).toBe(200);

    expect((await s.owner.delete(`/api/drafts/${s.draftId}/share`)).body).toEqual({ shared: false, createdAt: null });
    expect((await anonymous.get(`/api/shared/${second}`)).status).toBe(404);
    expect((await s.viewer.post(`/api/drafts/${s.draftId}/share`)).status).toBe(403);
  });

  it('answers 404 for any token that was never issued, and 400 for one that cannot be a token', async () => {
    const anonymous = server.client();
    await fc.assert(fc.asyncProperty(fc.uint8Array({ minLength: 32, maxLength: 32 }), async (bytes) => {
      expect((await anonymous.get(`/api/shared/${Buffer.from(bytes).toString('base64url')}`)).status).toBe(404);
    }), { numRuns: 10, seed: 8 });
    expect((await anonymous.get('/api/shared/short')).status).toBe(400);
  });
});

describe('studio invitations', () => {
  const linkIn = (text: string) => /http:\/\/weave\.test\/join\?token=([A-Za-z0-9_-]+)/.exec(text)?.[1];

  it('mails a join link; a new weaver signs up and joins in the invited role, and the link works once', async () => {
    const s = await scene();
    const email = uniqueEmail('invitee');
    const res = await s.owner.post(`/api/studios/${s.studioId}/invitations`, { email, role: 'editor' });
    expect(res.status).toBe(201);
    const mail = server.smtp.mails().find((m) => m.to.includes(email));
    expect(mail?.subject).toMatch(/invites you to Test studio/);
    const token = linkIn(mail!.text);
    expect(token).toBeDefined();
    expect((await server.ctx.models.Invitation.findOne({ where: { email } }))!.tokenHash).not.toBe(token);

    const newcomer = server.client();
    expect((await newcomer.post('/api/invitations/accept', { token })).status).toBe(401);
    expect((await server.signUp(newcomer, { email, name: 'Newcomer' })).status).toBe(201);
    const joined = acceptInviteResponseSchema.parse((await newcomer.post('/api/invitations/accept', { token })).body);
    expect(joined.studio).toEqual({ id: s.studioId, name: 'Test studio', role: 'editor' });
    expect((await newcomer.get(`/api/drafts/${s.draftId}`)).body.draft.role).toBe('editor');
    expect((await newcomer.post('/api/invitations/accept', { token })).status).toBe(400);
  });

  it('keeps the higher role for someone already in the studio, refuses expired links, and only owners invite', async () => {
    const s = await scene();
    await s.owner.post(`/api/studios/${s.studioId}/invitations`, { email: s.viewerUser.email, role: 'editor' });
    const token = linkIn(server.smtp.mails().find((m) => m.to.includes(s.viewerUser.email))!.text)!;
    expect((await s.viewer.post('/api/invitations/accept', { token })).body.studio.role).toBe('editor');

    await s.owner.post(`/api/studios/${s.studioId}/invitations`, { email: s.ownerUser.email, role: 'viewer' });
    const ownToken = linkIn(server.smtp.mails().find((m) => m.to.includes(s.ownerUser.email))!.text)!;
    expect((await s.owner.post('/api/invitations/accept', { token: ownToken })).body.studio.role).toBe('owner');

    const late = uniqueEmail('late');
    await s.owner.post(`/api/studios/${s.studioId}/invitations`, { email: late, role: 'viewer' });
    await server.ctx.models.Invitation.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { email: late } });
    const lateToken = linkIn(server.smtp.mails().find((m) => m.to.includes(late))!.text)!;
    expect((await s.viewer.post('/api/invitations/accept', { token: lateToken })).status).toBe(400);

    expect((await s.viewer.post(`/api/studios/${s.studioId}/invitations`, { email: late, role: 'viewer' })).status).toBe(403);
    expect((await s.owner.post(`/api/studios/${s.studioId}/invitations`, { email: 'not an e-mail', role: 'viewer' })).status).toBe(400);
  });

  it('finding 3: an invitation is accepted only by the account with the invited e-mail, and stays open after a refusal', async () => {
    const s = await scene();
    const invited = uniqueEmail('invited');
    await s.owner.post(`/api/studios/${s.studioId}/invitations`, { email: invited, role: 'editor' });
    const token = linkIn(server.smtp.mails().find((m) => m.to.includes(invited))!.text)!;

    // A member of the studio with another address, and a stranger who signs up with their own.
    const wrongMember = await s.viewer.post('/api/invitations/accept', { token });
    expect(wrongMember.status).toBe(403);
    expect(wrongMember.body.error.message).toMatch(/sent to another e-mail address/);
    expect((await s.viewer.get(`/api/drafts/${s.draftId}`)).body.draft.role).toBe('viewer');
    const stranger = server.client();
    expect((await server.signUp(stranger, { email: uniqueEmail('stranger'), name: 'Stranger' })).status).toBe(201);
    expect((await stranger.post('/api/invitations/accept', { token })).status).toBe(403);
    expect((await stranger.get(`/api/studios/${s.studioId}`)).status).toBe(404);
    expect(await server.ctx.models.Invitation.findOne({ where: { email: invited } })).toMatchObject({ acceptedAt: null, acceptedById: null });

    // The person it was sent to signs up with that address (in another case) and joins.
    const meant = server.client();
    expect((await server.signUp(meant, { email: invited.toUpperCase(), name: 'Invited' })).status).toBe(201);
    expect((await meant.post('/api/invitations/accept', { token })).body.studio).toEqual({ id: s.studioId, name: 'Test studio', role: 'editor' });
  });
});

describe('comments', () => {
  it('lets viewers comment on a version, an end and a pick; only the author deletes', async () => {
    const s = await scene();
    const posted = await s.viewer.post(`/api/drafts/${s.draftId}/comments`, { text: 'Is end 12 on shaft 3?', version: 1, end: 12, pick: 4 });
    expect(posted.status).toBe(201);
    expect(posted.body.comment).toMatchObject({ authorName: 'Student', version: 1, end: 12, pick: 4, text: 'Is end 12 on shaft 3?' });
    await s.owner.post(`/api/drafts/${s.draftId}/comments`, { text: 'Yes.' });
    const list = commentListResponseSchema.parse((await s.viewer.get(`/api/drafts/${s.draftId}/comments`)).body);
    expect(list.comments.map((c) => c.text)).toEqual(['Is end 12 on shaft 3?', 'Yes.']);
    expect((await s.owner.delete(`/api/drafts/${s.draftId}/comments/${posted.body.comment.id}`)).status).toBe(403);
    expect((await s.viewer.delete(`/api/drafts/${s.draftId}/comments/${posted.body.comment.id}`)).status).toBe(204);
    expect((await s.viewer.delete(`/api/drafts/${s.draftId}/comments/${posted.body.comment.id}`)).status).toBe(404);
    expect((await s.viewer.post(`/api/drafts/${s.draftId}/comments`, { text: 'On v9', version: 9 })).status).toBe(422);
    expect((await s.viewer.post(`/api/drafts/${s.draftId}/comments`, { text: '   ' })).status).toBe(400);
  });
});

describe('photos of the cloth', () => {
  const png = encodePngRgb(2, 2, new Uint8Array(12).fill(90));
  // The smallest headers each format starts with; the rest of the file does not matter to the check.
  const jpeg = Buffer.from([0xff, 0xd8, 0xff, 0xe0, 0, 16, 0x4a, 0x46, 0x49, 0x46, 0]);
  const webp = Buffer.concat([Buffer.from('RIFF'), Buffer.from([4, 0, 0, 0]), Buffer.from('WEBPVP8 ')]);

  it('knows JPEG, PNG and WebP by their first bytes and nothing else', () => {
    expect(sniffImageType(png)).toBe('image/png');
    expect(sniffImageType(jpeg)).toBe('image/jpeg');
    expect(sniffImageType(webp)).toBe('image/webp');
    fc.assert(fc.property(fc.uint8Array({ maxLength: 64 }), (bytes) => {
      const looksLike = (bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) || bytes[0] === 0x89
        || (bytes[0] === 0x52 && bytes[1] === 0x49);
      fc.pre(!looksLike);
      expect(sniffImageType(bytes)).toBeNull();
    }), { seed: 3, numRuns: 300 });
  });

  it('stores photos outside the web root, serves them with the type found in the bytes, to members only', async () => {
    const s = await scene();
    const path = `/api/drafts/${s.draftId}/versions/1/photos`;
    // The browser's claimed type is ignored: a PNG sent as "image/jpeg" is stored as PNG.
    const res = await upload(s.owner, path, png, 'cloth.jpg', 'image/jpeg');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.photo).toMatchObject({ version: 1, contentType: 'image/png', bytes: png.length, uploaderName: 'Test owner' });
    // Kept in the object store's bucket (nothing the web server serves), under the draft's prefix.
    const stored = await server.ctx.storage.keys(`drafts/${s.draftId}/`);
    expect(stored).toHaveLength(1);
    expect(await server.ctx.storage.get(stored[0])).toEqual(png);

    const list = photoListResponseSchema.parse((await s.viewer.get(`/api/drafts/${s.draftId}/photos`)).body);
    expect(list.photos).toHaveLength(1);
    const got = await s.viewer.agent.get(list.photos[0].url).buffer(true);
    expect(got.status).toBe(200);
    expect(got.headers['content-type']).toBe('image/png');
    expect(got.headers['x-content-type-options']).toBe('nosniff');
    expect(got.body).toEqual(png);

    const outsider = server.client();
    await outsider.signIn((await server.createUser()).email);
    expect((await outsider.get(list.photos[0].url)).status).toBe(404);
    expect((await server.client().get(list.photos[0].url)).status).toBe(401);
    // The photo belongs to this draft only.
    const other = await createDraft(server.ctx.models, { ownerId: s.ownerUser.id, studioId: null, document: pointTwillScarf(), tags: [] });
    expect((await s.owner.get(`/api/drafts/${other.id}/photos/${list.photos[0].id}`)).status).toBe(404);
  });

  it('refuses files that are not images (422), photos over 5 MB (413), missing versions (404) and viewers (403)', async () => {
    const s = await scene();
    const path = `/api/drafts/${s.draftId}/versions/1/photos`;
    const html = await upload(s.owner, path, Buffer.from('<html><script>alert(1)</script></html>'), 'cloth.png', 'image/png');
    expect(html.status).toBe(422);
    expect(html.body.error.message).toMatch(/not a JPEG, PNG or WebP/);
    const big = Buffer.concat([png, Buffer.alloc(PHOTO_MAX_BYTES)]);
    expect((await upload(s.owner, path, big, 'big.png')).status).toBe(413);
    expect((await upload(s.owner, `/api/drafts/${s.draftId}/versions/7/photos`, jpeg, 'a.jpg')).status).toBe(404);
    expect((await upload(s.viewer, path, jpeg, 'a.jpg')).status).toBe(403);
    expect((await s.owner.post(path)).status).toBe(400);
    // Nothing refused was kept.
    expect(await server.ctx.storage.keys(`drafts/${s.draftId}/`)).toEqual([]);
  });

  it('finding 9: an upload is refused on access before its file is read', async () => {
    const s = await scene();
    const path = `/api/drafts/${s.draftId}/versions/1/photos`;
    const outsider = server.client();
    await outsider.signIn((await server.createUser()).email);
    // Too big to store: had the file been read first, the answer would be 413, not the access refusal.
    const big = Buffer.concat([png, Buffer.alloc(PHOTO_MAX_BYTES)]);
    expect((await upload(s.viewer, path, big, 'big.png')).status).toBe(403);
    expect((await upload(outsider, path, big, 'big.png')).status).toBe(404);
    expect((await upload(s.owner, path, big, 'big.png')).status).toBe(413);

    // The refusal comes while the file is still on its way: the server does not wait to read it.
    const listening = createServer(server.app).listen(0, '127.0.0.1');
    await once(listening, 'listening');
    try {
      const { port } = listening.address() as AddressInfo;
      const cookie = (outsider.agent as unknown as { jar: { getCookies(a: unknown): { toValueString(): string }[] } }).jar
        .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }).map((c) => c.toValueString()).join('; ');
      const boundary = 'shedwright-finding-9';
      const head = `--${boundary}\r\nContent-Disposition: form-data; name="file"; filename="cloth.png"\r\nContent-Type: image/png\r\n\r\n`;
      const sending = httpRequest({
        host: '127.0.0.1', port, method: 'POST', path,
        headers: {
          cookie, 'x-csrf-token': await outsider.csrf(),
          'content-type': `multipart/form-data; boundary=${boundary}`, 'content-length': String(head.length + 4 * 1024 * 1024),
        },
      });
      sending.on('error', () => undefined);
      sending.write(head);
      sending.write(png);
      const [answer] = (await once(sending, 'response')) as [IncomingMessage];
      expect(answer.statusCode).toBe(404);
      sending.destroy();
    } finally {
      listening.closeAllConnections();
      listening.close();
    }
  });
});

describe('WIF import', () => {
  it('makes a new draft from a good file, named by its title or else the file name', async () => {
    const s = await scene();
    const res = await upload(s.viewer, '/api/drafts/import-wif', Buffer.from(toWif(pointTwillScarf())), 'scarf.wif');
    expect(res.status, JSON.stringify(res.body)).toBe(201);
    expect(res.body.draft).toMatchObject({ name: 'Point twill scarf', studioId: null, ends: 60, picks: 60, shafts: 4, version: 1 });
    const doc = parseDraft((await s.viewer.get(`/api/drafts/${res.body.draft.id}`)).body.draft.document);
    expect(doc.threading).toEqual(pointTwillScarf().threading);
    const versions = (await s.viewer.get(`/api/drafts/${res.body.draft.id}/versions`)).body.versions;
    expect(versions[0].message).toBe('Imported from scarf.wif');

    const untitled = toWif({ ...pointTwillScarf(), name: '' });
    const named = await upload(s.owner, '/api/drafts/import-wif', Buffer.from(untitled), 'Spring mat.wif');
    expect(named.body.draft.name).toBe('Spring mat');
  });

  it('finding 2: other requests are answered while a large WIF file is read', async () => {
    const s = await scene();
    // The probe's file: 20 000 ends × 20 000 picks on 32 shafts, about 1.3 MB.
    const wif = Buffer.from(toWif(probeLiftPlan()));
    expect(wif.length).toBeGreaterThan(1_000_000);
    // From the moment the reading starts to the moment it ends, ask for the session again and
    // again: a read that held the event loop would let none of them be answered in between.
    let reading = false;
    let answeredWhileReading = 0;
    const pinging: Promise<void>[] = [];
    const onStart = () => {
      reading = true;
      pinging.push((async () => {
        while (reading) {
          const res = await s.viewer.get('/api/session');
          if (reading && res.status === 200) answeredWhileReading++;
        }
      })());
    };
    const onEnd = () => { reading = false; };
    wifParseEvents.on('start', onStart);
    wifParseEvents.on('end', onEnd);
    const delay = monitorEventLoopDelay({ resolution: 5 });
    try {
      delay.enable();
      const res = await upload(s.owner, '/api/drafts/import-wif', wif, 'probe.wif');
      delay.disable();
      expect(res.status, res.text).toBe(201);
      expect(res.body.draft).toMatchObject({ ends: 20_000, picks: 20_000, shafts: 32 });
      await Promise.all(pinging);
      expect(pinging).toHaveLength(1);
      expect(answeredWhileReading).toBeGreaterThan(0);
      console.log(`WIF import of ${wif.length} bytes: ${answeredWhileReading} other requests answered while it was read; longest event-loop block ${(delay.max / 1e6).toFixed(0)} ms`);
    } finally {
      wifParseEvents.off('start', onStart);
      wifParseEvents.off('end', onEnd);
    }
  }, 60_000);

  it('finding 11: a WIF without a [TEXT] title is named after its file', async () => {
    const s = await scene();
    const noText = toWif(pointTwillScarf()).replace(/\[TEXT\]\n[^[]*/, '').replace(/^TEXT=true\n/m, '');
    expect(noText).not.toMatch(/TEXT|Title/);
    const res = await upload(s.owner, '/api/drafts/import-wif', Buffer.from(noText), 'Harbour table mat.WIF');
    expect(res.status, res.text).toBe(201);
    expect(res.body.draft.name).toBe('Harbour table mat');
  });

  it('says what it had to guess, in words, and nothing when the file was read whole', async () => {
    const s = await scene();
    const clean = await upload(s.owner, '/api/drafts/import-wif', Buffer.from(toWif(pointTwillScarf())), 'scarf.wif');
    expect(clean.body.warnings).toEqual([]);
    const noVersion = toWif(pointTwillScarf()).replace(/^Version=.*\n/m, '');
    const guessed = await upload(s.owner, '/api/drafts/import-wif', Buffer.from(noVersion), 'old.wif');
    expect(guessed.status, guessed.text).toBe(201);
    expect(guessed.body.warnings).toEqual(['[WIF] gives no Version; read as 1.1.']);
  });

  it('answers a bad file with 422 saying what is wrong, an empty form with 400, a huge file with 413', async () => {
    const s = await scene();
    const notWif = await upload(s.owner, '/api/drafts/import-wif', Buffer.from('hello, loom'), 'note.wif');
    expect(notWif.status).toBe(422);
    expect(notWif.body.error.message.length).toBeGreaterThan(10);
    const badShaft = toWif(pointTwillScarf()).replace(/\[THREADING\]\n1=1/, '[THREADING]\n1=9');
    const wrong = await upload(s.owner, '/api/drafts/import-wif', Buffer.from(badShaft), 'bad.wif');
    expect(wrong.status).toBe(422);
    expect(wrong.body.error.message).toMatch(/shaft 9/);
    expect((await s.owner.post('/api/drafts/import-wif')).status).toBe(400);
    const empty = await upload(s.owner, '/api/drafts/import-wif', Buffer.alloc(0), 'empty.wif');
    expect(empty.status).toBe(400);
    expect(empty.body.error.message).toBe('Choose a WIF file to import.');
    expect((await upload(s.owner, '/api/drafts/import-wif', Buffer.alloc(5 * 1024 * 1024, 65), 'big.wif')).status).toBe(413);
    expect((await upload(s.viewer, '/api/drafts/import-wif', Buffer.from(toWif(pointTwillScarf())), 'x.wif')).status).toBe(201);
  });
});

describe('yarns', () => {
  it('keeps each weaver\'s stash private: list, add, change, remove', async () => {
    const a = server.client();
    await a.signIn((await server.createUser()).email);
    const b = server.client();
    await b.signIn((await server.createUser()).email);
    const made = await a.post('/api/yarns', { name: 'Cottolin', fibre: 'cotton/linen', colour: '#AABBCC', count: '22/2', yardsPerPound: 3300 });
    expect(made.status).toBe(201);
    expect(made.body.yarn).toMatchObject({ name: 'Cottolin', colour: '#aabbcc', count: '22/2', yardsPerPound: 3300 });
    const id = made.body.yarn.id as number;
    await a.post('/api/yarns', { name: 'Alpaca', colour: '#332211' });
    expect(yarnListResponseSchema.parse((await a.get('/api/yarns')).body).yarns.map((y) => y.name)).toEqual(['Alpaca', 'Cottolin']);
    expect(yarnListResponseSchema.parse((await b.get('/api/yarns')).body).yarns).toEqual([]);
    expect((await b.patch(`/api/yarns/${id}`, { name: 'Mine now' })).status).toBe(404);
    expect((await b.delete(`/api/yarns/${id}`)).status).toBe(404);
    expect((await a.patch(`/api/yarns/${id}`, { yardsPerPound: null, colour: '#000000' })).body.yarn).toMatchObject({ yardsPerPound: null, colour: '#000000' });
    expect((await a.post('/api/yarns', { name: 'Bad', colour: 'red' })).status).toBe(400);
    expect((await a.delete(`/api/yarns/${id}`)).status).toBe(204);
    expect((await a.get('/api/yarns')).body.yarns).toHaveLength(1);
  });
});
