import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { once } from 'node:events';
import { createServer } from 'node:net';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { createApp } from '../../server/app';
import { createContext } from '../../server/context';
import { startFakeSmtp } from '../../server/mail/fake-smtp';
import { freePort } from '../helpers/e2e';
import { startTestServer, type TestServer } from '../helpers/server';
import { testConfig } from '../helpers/test-db';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server.close(); });

describe('health checks for load balancers', () => {
  it('answers /healthz and /readyz without a session, and sets no cookie', async () => {
    const health = await server.client().agent.get('/healthz');
    expect(health.status).toBe(200);
    expect(health.body).toEqual({ ok: true });
    expect(health.headers['set-cookie']).toBeUndefined();
    const ready = await server.client().agent.get('/readyz');
    expect(ready.status).toBe(200);
    expect(ready.headers['set-cookie']).toBeUndefined();
  });

  it('says not ready, naming why, when the database cannot be reached; healthz still answers', async () => {
    const other = await startTestServer();
    await other.ctx.sequelize.close();
    try {
      const ready = await other.client().agent.get('/readyz');
      expect(ready.status).toBe(503);
      expect(ready.body).toEqual({ ok: false, problem: 'the database cannot be reached' });
      expect((await other.client().agent.get('/healthz')).status).toBe(200);
    } finally {
      await other.close().catch(() => undefined);
    }
  });

  it('says not ready, naming the object store, when its port is closed or it does not answer within 1 s', async () => {
    const smtp = await startFakeSmtp(0);
    // A listener that takes connections and never answers: the store is there but silent.
    const silent = createServer(() => undefined).listen(0, '127.0.0.1');
    await once(silent, 'listening');
    const endpoints = {
      'the object store cannot be reached': `http://127.0.0.1:${await freePort()}`,
      'the database or the object store did not answer within 1 s': `http://127.0.0.1:${(silent.address() as AddressInfo).port}`,
    };
    try {
      for (const [problem, endpoint] of Object.entries(endpoints)) {
        const ctx = createContext(testConfig({ s3: { ...testConfig().s3, endpoint } }), smtp);
        try {
          const ready = await request(createApp(ctx)).get('/readyz');
          expect(ready.status).toBe(503);
          expect(ready.body).toEqual({ ok: false, problem });
        } finally {
          await ctx.close();
        }
      }
    } finally {
      silent.close();
      await smtp.close();
    }
  });
});
