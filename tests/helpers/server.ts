import type { Express } from 'express';
import request from 'supertest';
import type { StudioRole } from '../../shared/api/auth';
import type { CapturedMail } from '../../shared/api/dev';
import { createApp } from '../../server/app';
import { createContext, type AppContext } from '../../server/context';
import { migrate } from '../../server/db/migrate';
import { startFakeSmtp, type FakeSmtp } from '../../server/mail/fake-smtp';
import type { UserRow } from '../../server/models';
import { createAccount } from '../../server/services/auth';
import { createStudio } from '../../server/services/studios';
import { testConfig, uniqueEmail, type TestConfigOverrides } from './test-db';

export const TEST_PASSWORD = 'correct-horse-loom-42';

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/**
 * A signed-cookie browser stand-in: keeps cookies, and sends the CSRF token on state-changing
 * requests (fetching one when it has none, and taking the new one that sign-in/out responses carry).
 */
export class TestClient {
  readonly agent: ReturnType<typeof request.agent>;
  private token: string | null = null;

  constructor(app: Express) {
    this.agent = request.agent(app);
  }

  async csrf(): Promise<string> {
    if (!this.token) {
      const res = await this.agent.get('/api/csrf').expect(200);
      this.token = res.body.token as string;
    }
    return this.token;
  }

  /** Sends a request; mutating ones carry the CSRF token unless `csrf: false`. */
  async send(method: Method, path: string, body?: unknown, options: { csrf?: boolean } = {}) {
    // Fetch the token first: the agent attaches its cookies when a request is created.
    const token = method !== 'get' && options.csrf !== false ? await this.csrf() : null;
    let req = this.agent[method](path);
    if (token) req = req.set('x-csrf-token', token);
    const res = await (body === undefined ? req : req.send(body as object));
    if (typeof res.body?.csrfToken === 'string') this.token = res.body.csrfToken;
    return res;
  }

  get(path: string) { return this.send('get', path); }
  post(path: string, body?: unknown) { return this.send('post', path, body); }
  patch(path: string, body?: unknown) { return this.send('patch', path, body); }
  delete(path: string, body?: unknown) { return this.send('delete', path, body); }

  /** Signs in through the API, as a person would. */
  async signIn(email: string, password = TEST_PASSWORD) {
    const res = await this.post('/api/auth/sign-in', { email, password });
    if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
    return res;
  }
}

export interface TestServer {
  app: Express;
  ctx: AppContext;
  smtp: FakeSmtp;
  /** A fresh client with its own cookie jar. */
  client(): TestClient;
  /** Creates an account directly (no HTTP), with a unique e-mail. */
  createUser(options?: { name?: string; isAdmin?: boolean; email?: string; password?: string }): Promise<UserRow>;
  /**
   * The newest mail to `email` (whose subject matches `subject`, if given), waiting for it: mails
   * are sent after the request that causes them has been answered. With `after`, waits until more
   * than that many such mails have come.
   */
  mailTo(email: string, subject?: RegExp, after?: number): Promise<CapturedMail>;
  /**
   * Signs up through the API as a person does: the sign-up, then the link from its mail opened by
   * the same client, which signs it in. Answers with the link's response (201 with the session).
   */
  signUp(client: TestClient, body: { email: string; name: string; password?: string; next?: string }): ReturnType<TestClient['post']>;
  /** A fresh user signed in, holding `role` in a fresh studio (owned by another fresh user unless role is owner). */
  signInWithRole(role: StudioRole): Promise<{ client: TestClient; user: UserRow; studioId: number; ownerId: number }>;
  close(): Promise<void>;
}

let migrated: Promise<unknown> | undefined;

/** An app on the real test database with its own fake SMTP server; call close() in afterAll. */
export async function startTestServer(overrides: TestConfigOverrides = {}): Promise<TestServer> {
  const smtp = await startFakeSmtp(0);
  const ctx = createContext(testConfig(overrides), smtp);
  migrated ??= migrate(ctx.sequelize);
  await migrated;
  await ctx.storage.ensureBucket();
  const app = createApp(ctx);

  const createUser: TestServer['createUser'] = async (options = {}) => {
    const user = await createAccount(ctx.models, {
      email: options.email ?? uniqueEmail(),
      name: options.name ?? 'Test Weaver',
      password: options.password ?? TEST_PASSWORD,
    });
    if (options.isAdmin) await user.update({ isAdmin: true });
    return user;
  };

  const mailTo: TestServer['mailTo'] = async (email, subject, after = 0) => {
    const started = Date.now();
    for (;;) {
      const mails = smtp.mails().filter((m) => m.to.includes(email) && (!subject || subject.test(m.subject)));
      if (mails.length > after) return mails[0];
      if (Date.now() - started > 10_000) throw new Error(`no mail to ${email} arrived`);
      await new Promise((resolve) => setTimeout(resolve, 20));
    }
  };

  return {
    app,
    ctx,
    smtp,
    client: () => new TestClient(app),
    createUser,
    mailTo,
    async signUp(client, body) {
      const asked = await client.post('/api/auth/sign-up', { password: TEST_PASSWORD, ...body });
      if (asked.status !== 202) throw new Error(`sign-up as ${body.email} failed: ${asked.status} ${JSON.stringify(asked.body)}`);
      const mail = await mailTo(body.email.toLowerCase(), /Finish making/);
      const token = decodeURIComponent(/\/welcome\?token=([\w%-]+)/.exec(mail.text)![1]);
      return client.post('/api/auth/sign-up/confirm', { token });
    },
    async signInWithRole(role) {
      const user = await createUser({ name: `Test ${role}` });
      const owner = role === 'owner' ? user : await createUser({ name: 'Test studio owner' });
      const studio = await createStudio(ctx.models, owner.id, 'Test studio');
      if (role !== 'owner') await ctx.models.Membership.create({ studioId: studio.id, userId: user.id, role });
      const client = new TestClient(app);
      await client.signIn(user.email);
      return { client, user, studioId: studio.id, ownerId: owner.id };
    },
    async close() {
      await ctx.close();
      await smtp.close();
    },
  };
}
