import fc from 'fast-check';
import { describe, expect, it, vi } from 'vitest';
import { api, ApiError, toApiError, withQuery } from '../../src/lib/api-client';
import { apiError, mockApi } from './support/mock-api';

describe('api client', () => {
  it('sends reads with the session cookie and no CSRF token', async () => {
    const server = mockApi({ 'GET /api/drafts': { body: { items: [], total: 0, page: 1, pageSize: 20 } } });
    const result = await api.get('/api/drafts', { query: { q: 'mat', page: 2, studio: null } });
    expect(result).toEqual({ items: [], total: 0, page: 1, pageSize: 20 });
    const [request] = server.requests;
    expect(request.credentials).toBe('same-origin');
    expect(request.headers.get('x-csrf-token')).toBeNull();
    expect(Object.fromEntries(request.query)).toEqual({ q: 'mat', page: '2' });
  });

  it('fetches the CSRF token once and sends it as x-csrf-token on every write', async () => {
    const server = mockApi({
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/studios': { status: 201, body: { studio: { id: 4, name: 'Loft' } } },
      'PATCH /api/studios/4/members/2': { body: {} },
    });
    await api.post('/api/studios', { name: 'Loft' });
    await api.patch('/api/studios/4/members/2', { role: 'viewer' });
    expect(server.to('GET /api/csrf')).toHaveLength(1);
    const post = server.to('POST /api/studios')[0];
    expect(post.headers.get('x-csrf-token')).toBe('tok-1');
    expect(post.headers.get('content-type')).toBe('application/json');
    expect(post.body).toEqual({ name: 'Loft' });
    expect(server.to('PATCH /api/studios/4/members/2')[0].headers.get('x-csrf-token')).toBe('tok-1');
  });

  it('shares one token request between writes sent at the same moment', async () => {
    const server = mockApi({ 'GET /api/csrf': { body: { token: 'tok-1' } }, 'POST /api/studios': { status: 201, body: {} } });
    await Promise.all([api.post('/api/studios', { name: 'A' }), api.post('/api/studios', { name: 'B' })]);
    expect(server.to('GET /api/csrf')).toHaveLength(1);
  });

  it('retries a write once with a fresh token after a 403 csrf', async () => {
    const server = mockApi({
      'GET /api/csrf': (_req, n) => ({ body: { token: `tok-${n}` } }),
      'POST /api/studios': (req) =>
        req.headers.get('x-csrf-token') === 'tok-2' ? { status: 201, body: { studio: { id: 1, name: 'Loft' } } } : apiError(403, 'csrf', 'Bad token'),
    });
    await expect(api.post('/api/studios', { name: 'Loft' })).resolves.toEqual({ studio: { id: 1, name: 'Loft' } });
    expect(server.to('POST /api/studios').map((r) => r.headers.get('x-csrf-token'))).toEqual(['tok-1', 'tok-2']);
    expect(server.to('GET /api/csrf')).toHaveLength(2);
  });

  it('gives up after the one retry when the token is still refused', async () => {
    const server = mockApi({
      'GET /api/csrf': (_req, n) => ({ body: { token: `tok-${n}` } }),
      'POST /api/studios': apiError(403, 'csrf', 'Bad token'),
    });
    const error = await api.post('/api/studios', { name: 'Loft' }).catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 403, code: 'csrf' });
    expect(server.to('POST /api/studios')).toHaveLength(2);
  });

  it('does not retry a 403 that is about the role, not the token', async () => {
    const server = mockApi({
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'PATCH /api/studios/1/members/2': apiError(403, 'forbidden', 'Only owners can change roles.'),
    });
    await expect(api.patch('/api/studios/1/members/2', { role: 'owner' })).rejects.toMatchObject({ status: 403, code: 'forbidden' });
    expect(server.to('PATCH /api/studios/1/members/2')).toHaveLength(1);
  });

  it('takes the new token from a sign-in answer instead of asking for one', async () => {
    const server = mockApi({
      'GET /api/csrf': { body: { token: 'anonymous' } },
      'POST /api/auth/sign-in': { body: { user: { id: 1 }, csrfToken: 'signed-in' } },
      'POST /api/studios': { status: 201, body: {} },
    });
    await api.post('/api/auth/sign-in', { email: 'a@b.test', password: 'x' });
    await api.post('/api/studios', { name: 'Loft' });
    expect(server.to('POST /api/auth/sign-in')[0].headers.get('x-csrf-token')).toBe('anonymous');
    expect(server.to('POST /api/studios')[0].headers.get('x-csrf-token')).toBe('signed-in');
    expect(server.to('GET /api/csrf')).toHaveLength(1);
  });

  it('turns the error shape into an ApiError with status, code, message and fields', async () => {
    mockApi({ 'GET /api/drafts': apiError(400, 'invalid', 'Check the search.', { pageSize: 'At most 100.' }) });
    const error = await api.get('/api/drafts').catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 400, code: 'invalid', message: 'Check the search.', fields: { pageSize: 'At most 100.' } });
  });

  it('reports a non-JSON failure and a network failure in the same typed way', async () => {
    mockApi({ 'GET /api/drafts': { status: 502, text: '<html>Bad gateway</html>' } });
    await expect(api.get('/api/drafts')).rejects.toMatchObject({ status: 502, code: 'http_502' });
    vi.stubGlobal('fetch', async () => {
      throw new TypeError('Failed to fetch');
    });
    await expect(api.get('/api/drafts')).rejects.toMatchObject({ status: 0, code: 'network' });
  });

  it('reads any contract error body back exactly (property)', () => {
    const fieldsArb = fc.option(fc.dictionary(fc.string({ minLength: 1 }), fc.string()), { nil: undefined });
    fc.assert(
      fc.property(fc.integer({ min: 400, max: 599 }), fc.string(), fc.string(), fieldsArb, (status, code, message, fields) => {
        const error = toApiError(status, { error: { code, message, fields } });
        expect(error).toMatchObject({ status, code, message, fields: fields ?? {} });
      }),
    );
  });

  it('never throws on an unexpected error body and keeps its status (property)', () => {
    fc.assert(
      fc.property(fc.integer({ min: 400, max: 599 }), fc.jsonValue(), (status, body) => {
        const error = toApiError(status, body);
        expect(error.status).toBe(status);
        expect(typeof error.message).toBe('string');
        expect(error.message.length).toBeGreaterThan(0);
      }),
    );
  });

  it('writes every non-empty query value and reads back the same (property)', () => {
    const value = fc.oneof(fc.string(), fc.integer(), fc.boolean(), fc.constant(null), fc.constant(undefined));
    fc.assert(
      fc.property(fc.dictionary(fc.string({ minLength: 1 }).filter((k) => k !== '__proto__'), value), (query) => {
        const url = withQuery('/api/x', query);
        const read = new URLSearchParams(url.includes('?') ? url.slice(url.indexOf('?') + 1) : '');
        const expected = Object.entries(query).filter(([, v]) => v !== null && v !== undefined && v !== '');
        expect([...read.entries()]).toEqual(expected.map(([k, v]) => [k, String(v)]));
      }),
    );
  });
});
