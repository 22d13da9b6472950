import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { mailsResponseSchema } from '../../shared/api/dev';
import { startTestServer, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer({ dev: true }); });
afterAll(async () => { await server.close(); });

describe('local fake SMTP', () => {
  it('gives back subject, text and HTML exactly as sent through nodemailer', async () => {
    // Text without trailing newlines or lone CRs: MIME normalises line ends, so those cannot round-trip.
    const text = fc.string({ unit: 'grapheme', minLength: 1, maxLength: 300 }).map((s) => s.replace(/\r/g, '').replace(/\n+$/, ''))
      .filter((s) => s.length > 0);
    await fc.assert(fc.asyncProperty(
      fc.string({ unit: 'grapheme', minLength: 1, maxLength: 60 }).map((s) => s.replace(/[\r\n]/g, ' ').trim()).filter((s) => s.length > 0),
      text,
      fc.boolean(),
      async (subject, body, withHtml) => {
        const to = `round-trip-${Math.random().toString(36).slice(2)}@test.shedwright.test`;
        await server.ctx.mailer.send({ to, subject, text: body, ...(withHtml ? { html: `<p>${body}</p>` } : {}) });
        const mail = server.smtp.mails().find((m) => m.to.includes(to));
        expect(mail).toBeDefined();
        expect(mail!.subject).toBe(subject);
        expect(mail!.text).toBe(body);
        expect(mail!.html).toBe(withHtml ? `<p>${body}</p>` : undefined);
      },
    ), { numRuns: 25, seed: 2024 });
  });

  it('is readable by anyone at /api/dev/mails in dev mode', async () => {
    await server.ctx.mailer.send({ to: 'dev-mode@test.shedwright.test', subject: 'Hello loom', text: 'Warp is on.' });
    const res = await server.client().get('/api/dev/mails');
    expect(res.status).toBe(200);
    const { mails } = mailsResponseSchema.parse(res.body);
    expect(mails[0]).toMatchObject({ to: 'dev-mode@test.shedwright.test', subject: 'Hello loom', text: 'Warp is on.' });
    expect(Number.isNaN(Date.parse(mails[0].date))).toBe(false);
  });

  it('finding 5: outside development mode nobody reads captured mail through the app, site admins included', async () => {
    const live = await startTestServer({ dev: false });
    try {
      const victim = await live.createUser({ name: 'Victim' });
      const admin = await live.createUser({ name: 'Site admin', isAdmin: true });
      expect((await live.client().post('/api/auth/forgot', { email: victim.email })).status).toBe(202);
      await live.mailTo(victim.email, /reset/i);
      const adminClient = live.client();
      await adminClient.signIn(admin.email);
      for (const client of [adminClient, live.client()]) {
        const res = await client.get('/api/dev/mails');
        expect(res.status).toBe(404);
        expect(JSON.stringify(res.body)).not.toContain('reset?token=');
      }
    } finally {
      await live.close();
    }
  });
});
