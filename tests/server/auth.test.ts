import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { authResponseSchema, sessionResponseSchema } from '../../shared/api/auth';
import { apiErrorSchema } from '../../shared/api/errors';
import { SESSION_COOKIE } from '../../server/app';
import { startTestServer, TEST_PASSWORD, type TestServer } from '../helpers/server';
import { uniqueEmail } from '../helpers/test-db';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server.close(); });

const sessionCookie = (res: { headers: Record<string, unknown> }) =>
  ((res.headers['set-cookie'] as string[] | undefined) ?? []).find((c) => c.startsWith(`${SESSION_COOKIE}=`));
const sid = (cookie: string | undefined) => cookie?.split(';')[0];

describe('sign-up, sign-in, sign-out', () => {
  it('signs up through the mailed link, is signed in, signs out, signs back in', async () => {
    const client = server.client();
    const email = uniqueEmail('signup');
    const up = await server.signUp(client, { email: email.toUpperCase(), password: TEST_PASSWORD, name: 'Wren' });
    expect(up.status).toBe(201);
    const parsed = authResponseSchema.parse(up.body);
    expect(parsed.user).toMatchObject({ email, name: 'Wren', isAdmin: false, memberships: [] });

    const me = await client.get('/api/session');
    expect(sessionResponseSchema.parse(me.body).user?.email).toBe(email);

    const out = await client.post('/api/auth/sign-out');
    expect(out.status).toBe(200);
    expect(typeof out.body.csrfToken).toBe('string');
    expect((await client.get('/api/session')).body).toEqual({ user: null });

    const back = await client.post('/api/auth/sign-in', { email, password: TEST_PASSWORD });
    expect(back.status).toBe(200);
    expect(back.body.user.email).toBe(email);
  });

  it('makes one account from a sign-up link, once; refuses a made-up link and a short password', async () => {
    const email = uniqueEmail('once');
    const first = server.client();
    expect((await server.signUp(first, { email, name: 'Once' })).status).toBe(201);
    const token = decodeURIComponent(/token=([\w%-]+)/.exec((await server.mailTo(email, /Finish making/)).text)![1]);
    const again = await server.client().post('/api/auth/sign-up/confirm', { token });
    expect(again.status).toBe(400);
    expect(apiErrorSchema.parse(again.body).error.message).toMatch(/invalid, has been used or has expired/);
    expect((await server.client().post('/api/auth/sign-up/confirm', { token: 'made-up-token' })).status).toBe(400);
    expect(await server.ctx.models.User.count({ where: { email } })).toBe(1);
    const short = await server.client().post('/api/auth/sign-up', { email: uniqueEmail(), password: 'short', name: 'X' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toBeTruthy();
    const elsewhere = await server.client().post('/api/auth/sign-up', { email: uniqueEmail(), password: TEST_PASSWORD, name: 'X', next: '//evil.example/' });
    expect(elsewhere.status).toBe(400);
    expect(elsewhere.body.error.fields.next).toBeTruthy();
  });

  it('answers a wrong password and an unknown e-mail alike with 401', async () => {
    const user = await server.createUser();
    const wrong = await server.client().post('/api/auth/sign-in', { email: user.email, password: 'not-the-password' });
    const unknown = await server.client().post('/api/auth/sign-in', { email: uniqueEmail('nobody'), password: TEST_PASSWORD });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body).toEqual(unknown.body);
  });

  it('gives a new session id at sign-in (no session fixation)', async () => {
    const user = await server.createUser();
    const client = server.client();
    const before = sid(sessionCookie(await client.agent.get('/api/csrf')));
    expect(before).toBeDefined();
    const res = await client.signIn(user.email);
    const after = sid(sessionCookie(res));
    expect(after).toBeDefined();
    expect(after).not.toBe(before);
  });

  it('sets the session cookie httpOnly and SameSite=Lax, not Secure on http', async () => {
    const user = await server.createUser();
    const cookie = sessionCookie(await server.client().signIn(user.email))!;
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i);
  });

  it('keeps people signed in across a restart (a new app instance on the same database)', async () => {
    const user = await server.createUser();
    const client = server.client();
    const cookie = sid(sessionCookie(await client.signIn(user.email)))!;
    const restarted = await startTestServer();
    try {
      const res = await restarted.client().agent.get('/api/session').set('Cookie', cookie);
      expect(res.body.user?.id).toBe(user.id);
    } finally {
      await restarted.close();
    }
  });
});

describe('CSRF', () => {
  it('refuses a state-changing request without a token or with a wrong one', async () => {
    const user = await server.createUser();
    const client = server.client();
    await client.signIn(user.email);
    const none = await client.send('post', '/api/studios', { name: 'No token' }, { csrf: false });
    expect(none.status).toBe(403);
    expect(none.body.error.code).toBe('csrf');
    // What reaches the screen says what to do, in the weaver's words, with no protocol names.
    expect(none.body.error.message).toBe('This page was open too long to save from. Reload the page and try again; nothing was changed.');
    expect(none.body.error.message).not.toMatch(/csrf|token/i);
    const wrong = await client.agent.post('/api/studios').set('x-csrf-token', 'f'.repeat(256)).send({ name: 'Wrong' });
    expect(wrong.status).toBe(403);
    expect(wrong.body.error.code).toBe('csrf');
    const right = await client.post('/api/studios', { name: 'Right token' });
    expect(right.status).toBe(201);
  });

  it("does not accept another session's token", async () => {
    const a = server.client();
    const b = server.client();
    const tokenOfA = await a.csrf();
    await b.csrf();
    const res = await b.agent.post('/api/auth/sign-out').set('x-csrf-token', tokenOfA);
    expect(res.status).toBe(403);
  });

  it('changes the token at sign-in, so a token from before no longer works', async () => {
    const user = await server.createUser();
    const client = server.client();
    const before = await client.csrf();
    const res = await client.signIn(user.email);
    expect(res.body.csrfToken).not.toBe(before);
    const stale = await client.agent.post('/api/studios').set('x-csrf-token', before).send({ name: 'Stale' });
    expect(stale.status).toBe(403);
  });
});

describe('rate limits', () => {
  it('answers 429 after the configured number of sign-in attempts', async () => {
    const limited = await startTestServer({ rateLimit: { windowMs: 60_000, signIn: 3, passwordReset: 2, signUp: 10_000 } });
    try {
      const client = limited.client();
      const attempt = () => client.post('/api/auth/sign-in', { email: uniqueEmail('limit'), password: 'wrong-password' });
      for (let i = 0; i < 3; i++) expect((await attempt()).status).toBe(401);
      const blocked = await attempt();
      expect(blocked.status).toBe(429);
      expect(blocked.body.error.code).toBe('rate_limited');

      const forgot = () => client.post('/api/auth/forgot', { email: uniqueEmail('limit') });
      for (let i = 0; i < 2; i++) expect((await forgot()).status).toBe(202);
      expect((await forgot()).status).toBe(429);
    } finally {
      await limited.close();
    }
  });
});

describe('forgot and reset password', () => {
  const linkIn = (text: string) => text.match(/https?:\/\/\S+\/reset\?token=([\w%-]+)/);

  /** The token of the newest reset mail to `email`, once more than `after` of them have come. */
  async function mailedToken(email: string, after = 0): Promise<string> {
    const mail = await server.mailTo(email, /reset/i, after);
    const link = linkIn(mail.text);
    expect(link?.[0].startsWith('http://127.0.0.1:4780/reset?token=')).toBe(true);
    return decodeURIComponent(link![1]);
  }

  it('mails a link whose token sets a new password once, and signs the user in', async () => {
    const user = await server.createUser();
    const client = server.client();
    expect((await client.post('/api/auth/forgot', { email: user.email })).status).toBe(202);
    const token = await mailedToken(user.email);

    // The database holds only a hash of the token.
    const stored = await server.ctx.models.PasswordReset.findAll({ where: { userId: user.id } });
    expect(stored).toHaveLength(1);
    expect(stored[0].tokenHash).not.toContain(token);
    expect(stored[0].expiresAt.getTime() - stored[0].createdAt.getTime()).toBeGreaterThan(59 * 60 * 1000);
    expect(stored[0].expiresAt.getTime() - stored[0].createdAt.getTime()).toBeLessThanOrEqual(61 * 60 * 1000);

    const newPassword = 'a-brand-new-password';
    const reset = await client.post('/api/auth/reset', { token, password: newPassword });
    expect(reset.status).toBe(200);
    expect(reset.body.user.id).toBe(user.id);
    expect((await client.get('/api/session')).body.user.id).toBe(user.id);

    const again = await server.client().post('/api/auth/reset', { token, password: 'yet-another-password' });
    expect(again.status).toBe(400);

    expect((await server.client().post('/api/auth/sign-in', { email: user.email, password: TEST_PASSWORD })).status).toBe(401);
    expect((await server.client().post('/api/auth/sign-in', { email: user.email, password: newPassword })).status).toBe(200);
  });

  it('finding 4: a password reset ends other sessions and voids the other reset links', async () => {
    const user = await server.createUser();
    const laptop = server.client();
    const phone = server.client();
    await laptop.signIn(user.email);
    await phone.signIn(user.email);
    expect((await laptop.get('/api/drafts')).status).toBe(200);

    // Two links asked for; the newer one is used from a third browser.
    await server.client().post('/api/auth/forgot', { email: user.email });
    const older = await mailedToken(user.email);
    await server.client().post('/api/auth/forgot', { email: user.email });
    const newer = await mailedToken(user.email, 1);
    expect(newer).not.toBe(older);
    const resetter = server.client();
    expect((await resetter.post('/api/auth/reset', { token: newer, password: 'a-fresh-long-password' })).status).toBe(200);

    for (const other of [laptop, phone]) {
      expect((await other.get('/api/session')).body).toEqual({ user: null });
      expect((await other.get('/api/drafts')).status).toBe(401);
    }
    expect((await resetter.get('/api/session')).body.user.id).toBe(user.id);
    expect((await server.client().post('/api/auth/reset', { token: older, password: 'an-attackers-password' })).status).toBe(400);
    expect((await server.client().post('/api/auth/sign-in', { email: user.email, password: 'a-fresh-long-password' })).status).toBe(200);
  });

  it('refuses an expired token', async () => {
    const user = await server.createUser();
    await server.client().post('/api/auth/forgot', { email: user.email });
    const token = await mailedToken(user.email);
    await server.ctx.models.PasswordReset.update({ expiresAt: new Date(Date.now() - 1000) }, { where: { userId: user.id } });
    const res = await server.client().post('/api/auth/reset', { token, password: 'another-long-password' });
    expect(res.status).toBe(400);
  });

  it('answers 202 for an unknown e-mail and sends nothing', async () => {
    const email = uniqueEmail('ghost');
    const before = server.smtp.mails().length;
    expect((await server.client().post('/api/auth/forgot', { email })).status).toBe(202);
    expect(server.smtp.mails().length).toBe(before);
  });
});

describe('passwords stay secret', () => {
  it('never appear in responses or logs', async () => {
    const spies = (['log', 'info', 'warn', 'error', 'debug'] as const).map((m) => vi.spyOn(console, m));
    try {
      const email = uniqueEmail('secret');
      const password = 'very-secret-password-7731';
      const client = server.client();
      const bodies = [
        await client.post('/api/auth/sign-up', { email, password, name: 'Quiet' }),
        await server.signUp(client, { email, password, name: 'Quiet' }),
        await client.get('/api/session'),
        await client.post('/api/auth/sign-out'),
        await client.post('/api/auth/sign-in', { email, password }),
        await client.post('/api/auth/sign-in', { email, password: `${password}-wrong` }),
        await client.post('/api/auth/sign-up', { email, password, name: 'Again' }),
      ].map((r) => r.text);
      for (const text of bodies) {
        expect(text).not.toContain(password);
        expect(text).not.toMatch(/argon2|passwordHash/);
      }
      for (const spy of spies) {
        for (const call of spy.mock.calls) expect(JSON.stringify(call)).not.toContain(password);
      }
    } finally {
      for (const spy of spies) spy.mockRestore();
    }
  });
});

describe('nobody learns who has an account', () => {
  /**
   * Holds every mail until `release` is called: an answer that comes while its mail is held did
   * not wait for the mail (nor for whatever the server does before sending it).
   */
  function holdMails() {
    let release!: () => void;
    const held = new Promise<void>((resolve) => { release = resolve; });
    const send = server.ctx.mailer.send.bind(server.ctx.mailer);
    const spy = vi.spyOn(server.ctx.mailer, 'send').mockImplementation(async (mail) => { await held; await send(mail); });
    return { spy, release: () => { release(); spy.mockRestore(); } };
  }
  /**
   * A POST from its own client, giving up after 20 s only to tell a hung request from an answer
   * (the answers that pass wait for nothing): the error instead of a response when it hangs.
   */
  async function post(path: string, body: object, client = server.client()) {
    const token = await client.csrf();
    return client.agent.post(path).set('x-csrf-token', token).send(body).timeout(20_000).then((r) => r, (err: Error) => err);
  }

  it('finding 6: forgot password answers a known and an unknown address in the same words, before any mail is sent', async () => {
    const user = await server.createUser();
    const unknown = uniqueEmail('nobody');
    const hold = holdMails();
    const [k, u] = await Promise.all([user.email, unknown].map((email) => post('/api/auth/forgot', { email })));
    const sentWhileAnswering = server.smtp.mails().filter((m) => m.to.includes(user.email)).length;
    hold.release();
    expect(k).not.toBeInstanceOf(Error);
    expect(u).not.toBeInstanceOf(Error);
    if (k instanceof Error || u instanceof Error) return;
    expect(k.status).toBe(202);
    expect(u.status).toBe(202);
    expect(k.text).toBe(u.text);
    expect(sentWhileAnswering).toBe(0);
    // The mail still goes, after the answer.
    expect((await server.mailTo(user.email, /reset/i)).text).toMatch(/reset\?token=/);
  });

  it('finding 6: sign-up answers a taken address in the same words as a new one, before any mail, and mails the owner instead', async () => {
    const owner = await server.createUser({ name: 'Owner of the address' });
    const fresh = uniqueEmail('fresh');
    const hold = holdMails();
    const attacker = server.client();
    const newcomer = server.client();
    const body = (email: string) => ({ email, password: 'an-attackers-password', name: 'Somebody' });
    const [taken, free] = await Promise.all([post('/api/auth/sign-up', body(owner.email), attacker), post('/api/auth/sign-up', body(fresh), newcomer)]);
    const sentWhileAnswering = server.smtp.mails().filter((m) => m.to.includes(owner.email) || m.to.includes(fresh)).length;
    hold.release();
    expect(taken).not.toBeInstanceOf(Error);
    expect(free).not.toBeInstanceOf(Error);
    if (taken instanceof Error || free instanceof Error) return;
    expect([taken.status, free.status]).toEqual([202, 202]);
    expect(taken.text).toBe(free.text);
    expect(sentWhileAnswering).toBe(0);
    // Nobody is signed in by asking.
    expect((await attacker.get('/api/session')).body).toEqual({ user: null });
    expect((await newcomer.get('/api/session')).body).toEqual({ user: null });

    // The owner hears of it and keeps the account as it was; the new address gets its link.
    const note = await server.mailTo(owner.email, /tried to make a Shedwright account/);
    expect(note.text).toMatch(/Nothing has changed on your account/);
    expect(note.text).not.toMatch(/token=/);
    expect((await server.client().post('/api/auth/sign-in', { email: owner.email, password: 'an-attackers-password' })).status).toBe(401);
    expect((await server.client().post('/api/auth/sign-in', { email: owner.email, password: TEST_PASSWORD })).status).toBe(200);
    expect(await server.ctx.models.User.count({ where: { email: owner.email } })).toBe(1);
    expect((await server.mailTo(fresh, /Finish making/)).text).toMatch(/\/welcome\?token=/);
  });

  it('finding 6: sign-ups are limited per client address', async () => {
    const limited = await startTestServer({ rateLimit: { windowMs: 60_000, signIn: 10_000, passwordReset: 10_000, signUp: 3 } });
    try {
      const client = limited.client();
      const signUp = () => client.post('/api/auth/sign-up', { email: uniqueEmail('many'), password: TEST_PASSWORD, name: 'Many' });
      for (let i = 0; i < 3; i++) expect((await signUp()).status).not.toBe(429);
      const blocked = await signUp();
      expect(blocked.status).toBe(429);
      expect(blocked.body.error).toMatchObject({ code: 'rate_limited', message: expect.stringMatching(/sign-ups/) });
      // A taken address counts like any other: the limit says nothing about who has an account.
      expect((await client.post('/api/auth/sign-up', { email: (await limited.createUser()).email, password: TEST_PASSWORD, name: 'Taken' })).status).toBe(429);
    } finally {
      await limited.close();
    }
  });
});
