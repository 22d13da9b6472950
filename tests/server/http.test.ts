import fc from 'fast-check';
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { apiErrorSchema } from '../../shared/api/errors';
import { startTestServer, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer({ bodyLimit: '10kb' }); });
afterAll(async () => { await server.close(); });

describe('bad input gets the contract error shape, never a stack trace', () => {
  it('answers malformed JSON with 400', async () => {
    const client = server.client();
    const token = await client.csrf();
    const res = await client.agent.post('/api/auth/sign-in').set('x-csrf-token', token)
      .set('content-type', 'application/json').send('{"email": "a@b.test", "password": ');
    expect(res.status).toBe(400);
    expect(apiErrorSchema.parse(res.body).error.code).toBe('bad_request');
    expect(res.text).not.toMatch(/at .*\.(js|ts):\d+/);
  });

  it('answers a body over the limit with 413', async () => {
    const client = server.client();
    const res = await client.post('/api/studios', { name: 'x'.repeat(20 * 1024) });
    expect(res.status).toBe(413);
    expect(apiErrorSchema.parse(res.body).error.code).toBe('too_large');
  });

  it('answers unknown routes with 404 JSON, inside and outside /api', async () => {
    for (const path of ['/api/no-such-thing', '/api/drafts/1/nope', '/not-here']) {
      const res = await server.client().get(path);
      expect(res.status).toBe(404);
      expect(res.headers['content-type']).toMatch(/json/);
      expect(apiErrorSchema.parse(res.body).error.code).toBe('not_found');
    }
  });

  it('answers a non-numeric id with 400 (for a member) and never with 500', async () => {
    const { client } = await server.signInWithRole('viewer');
    const res = await client.get('/api/studios/abc');
    expect(res.status).toBe(400);
    expect(res.body.error.fields.id).toBeTruthy();
  });

  it('turns any JSON body the sign-up schema rejects into a 400 with fields', async () => {
    const client = server.client();
    await client.csrf();
    await fc.assert(fc.asyncProperty(
      fc.oneof(
        fc.record({ email: fc.string(), password: fc.string({ maxLength: 9 }), name: fc.string() }),
        fc.dictionary(fc.string(), fc.jsonValue()),
        fc.array(fc.jsonValue()),
      ),
      async (body) => {
        const res = await client.post('/api/auth/sign-up', body);
        expect(res.status).toBe(400);
        expect(apiErrorSchema.parse(res.body).error.code).toBe('validation');
      },
    ), { numRuns: 30, seed: 42 });
  });
});

describe('security headers', () => {
  it('sends a CSP that allows only our origin, data: images and inline styles', async () => {
    const res = await server.client().get('/api/session');
    const csp = res.headers['content-security-policy'] as string;
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("img-src 'self' data: blob:");
    expect(csp).toContain("style-src 'self' 'unsafe-inline'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(csp).not.toContain('upgrade-insecure-requests');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    expect(res.headers['x-powered-by']).toBeUndefined();
  });
});

describe('database', () => {
  it('runs raw queries without a type (the mariadb "meta" trap is fixed)', async () => {
    const [rows] = await server.ctx.sequelize.query('SELECT 1 + 1 AS two');
    expect(rows).toEqual([{ two: 2 }]);
    const typed = await server.ctx.sequelize.query<{ two: number }>('SELECT 1 + 1 AS two', { type: QueryTypes.SELECT });
    expect(typed).toEqual([{ two: 2 }]);
  });

  it('removes a column and an index in a migration-style change (the other face of the trap)', async () => {
    const qi = server.ctx.sequelize.getQueryInterface();
    const table = `meta_trap_${Date.now().toString(36)}`;
    const { DataTypes } = await import('sequelize');
    await qi.createTable(table, { id: { type: DataTypes.INTEGER, primaryKey: true }, extra: DataTypes.STRING(10) });
    try {
      await qi.addIndex(table, ['extra'], { name: `${table}_extra` });
      await qi.removeIndex(table, `${table}_extra`);
      await qi.removeColumn(table, 'extra');
      expect(Object.keys(await qi.describeTable(table))).toEqual(['id']);
    } finally {
      await qi.dropTable(table);
    }
  });

  it('stores times in UTC and text as utf8mb4', async () => {
    const [row] = await server.ctx.sequelize.query<{ tz: string }>('SELECT @@session.time_zone AS tz', { type: QueryTypes.SELECT });
    expect(row.tz).toBe('+00:00');
    const user = await server.createUser({ name: 'Ørjan 🧶 Weaver' });
    const again = await server.ctx.models.User.findByPk(user.id);
    expect(again?.name).toBe('Ørjan 🧶 Weaver');
  });

  it('migrating again is a no-op', async () => {
    const { migrate } = await import('../../server/db/migrate');
    expect(await migrate(server.ctx.sequelize)).toEqual([]);
  });
});
