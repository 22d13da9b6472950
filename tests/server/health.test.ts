import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startTestServer, type TestServer } from '../helpers/server';

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
});
