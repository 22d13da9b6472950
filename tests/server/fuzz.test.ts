import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { z } from 'zod';
import { apiErrorSchema, PHOTO_MAX_BYTES, WIF_MAX_BYTES } from '../../shared/api';
import { toWif } from '../../shared/weave';
import { straightTwillTrial } from '../../server/db/seeders/demo-drafts';
import { routeTable } from '../../server/routes';
import type { RouteSpec } from '../../server/http/handler';
import { createDraft } from '../../server/services/drafts';
import { startTestServer, type TestClient, type TestServer } from '../helpers/server';

/*
 * Junk through the API: every route in the table that takes a body gets generated bodies. A body its
 * schema refuses must be a 4xx with the error shape; a body it happens to accept may succeed; nothing
 * is ever a 500. Uploads that lie about their type, or are too large, are refused.
 */

let server: TestServer;
let owner: { client: TestClient; email: string; draftId: number; studioId: number; memberId: number };
const counts: Record<string, number> = {};


beforeAll(async () => {
  server = await startTestServer();
  const { client, user, studioId } = await server.signInWithRole('owner');
  const member = await server.createUser({ name: 'Fuzz member' });
  await server.ctx.models.Membership.create({ studioId, userId: member.id, role: 'viewer' });
  const draft = await createDraft(server.ctx.models, { ownerId: user.id, studioId, document: straightTwillTrial(), tags: [] });
  owner = { client, email: user.email, draftId: draft.id, studioId, memberId: member.id };
});

afterAll(async () => {
  const lines = Object.entries(counts).map(([route, n]) => `  ${String(n).padStart(5)}  ${route}`);
  console.log(`API fuzz, inputs per route (${Object.values(counts).reduce((a, b) => a + b, 0)} in all):\n${lines.join('\n')}`);
  await server.close();
});

/** The route's path with real ids: the caller's draft or studio, another member, version 1. */
function concretePath(spec: RouteSpec): string {
  const id = spec.path.startsWith('/api/studios/') ? owner.studioId : owner.draftId;
  return spec.path.replace(':id', String(id)).replace(':userId', String(owner.memberId)).replace(':token', 'not-a-token')
    .replace(/:(n|commentId|photoId)/, '1');
}

/** JSON values of every kind: wrong types, numbers beyond any range, long and odd text, deep nesting. */
const junkValue: fc.Arbitrary<unknown> = fc.oneof(
  fc.jsonValue({ maxDepth: 4 }),
  fc.constantFrom(null, true, '', ' ', '0', '-1', 'NaN', '1e999', 'null', '<script>', "'; DROP TABLE drafts; --", '../../etc/passwd', 'a@b', '\u0000'),
  fc.constantFrom(0, -1, -0, 0.5, 2 ** 31, 2 ** 53 + 2, 1e308, -1e308),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.integer({ min: 1000, max: 100_000 }).map((n) => 'w'.repeat(n)),
  fc.integer({ min: 2, max: 500 }).map((d) => JSON.parse(`${'['.repeat(d)}${']'.repeat(d)}`) as unknown),
);

/** Objects with the schema's own keys (so validation goes past the first field) mixed with others. */
function junkBody(schema: z.ZodType): fc.Arbitrary<unknown> {
  const keys = schema instanceof z.ZodObject ? Object.keys(schema.shape) : [];
  const key = keys.length > 0 ? fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...keys) }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }) }) : fc.string({ maxLength: 12 });
  return fc.oneof(
    { weight: 6, arbitrary: fc.dictionary(key, junkValue, { maxKeys: 8 }) },
    { weight: 1, arbitrary: fc.array(junkValue, { maxLength: 5 }) },
    { weight: 1, arbitrary: fc.constantFrom({}, [], { __proto__: null }, JSON.parse('{"__proto__": {"isAdmin": true}}') as unknown) },
  );
}

/** What any answer may be: 2xx only for a body the schema accepts, never 5xx, errors in the contract's shape. */
function expectSafeAnswer(res: { status: number; body: unknown }, accepted: boolean, what: string) {
  expect(res.status, `${what}: ${JSON.stringify(res.body).slice(0, 300)}`).toBeLessThan(500);
  if (res.status >= 400) expect(apiErrorSchema.safeParse(res.body).success, `${what}: error shape`).toBe(true);
  else expect(accepted, `${what}: ${res.status} for a body the schema refuses`).toBe(true);
}

const bodyRoutes = routeTable.filter((r) => r.body);
const RUNS = 150;

describe('junk bodies on every route that takes one', () => {
  it('covers every route with a body schema', () => {
    expect(bodyRoutes.length).toBeGreaterThan(10);
  });

  for (const spec of bodyRoutes) {
    const name = `${spec.method.toUpperCase()} ${spec.path}`;
    it(`${name}: 4xx with the error shape, never 500`, async () => {
      // A client of its own: a junk sign-up or sign-in that happens to be valid changes who it is.
      const client = server.client();
      await client.signIn(owner.email);
      const path = concretePath(spec);
      await fc.assert(
        fc.asyncProperty(junkBody(spec.body!), async (body) => {
          counts[name] = (counts[name] ?? 0) + 1;
          const res = await client.send(spec.method, path, body);
          expectSafeAnswer(res, spec.body!.safeParse(body).success, name);
        }),
        { numRuns: RUNS },
      );

      // Bodies that are not JSON objects at all: broken JSON, a bare value, another type, too large, very deep.
      const raw: [string, string][] = [
        ['application/json', '{"unterminated": '],
        ['application/json', '"just a string"'],
        ['application/json', '12'],
        ['application/json', `{"a": ${'['.repeat(100_000)}${']'.repeat(100_000)}}`],
        ['application/json', `{"a": "${'x'.repeat(2.5 * 1024 * 1024)}"}`],
        ['text/plain', 'name=x'],
        ['application/x-www-form-urlencoded', 'name=x&tags=1'],
        ['application/json; charset=latin1', '{"name": "caf\u00e9"}'],
      ];
      const token = await client.csrf();
      for (const [type, text] of raw) {
        counts[name] += 1;
        const res = await client.agent[spec.method](path).set('x-csrf-token', token).set('content-type', type).send(text);
        expectSafeAnswer(res, false, `${name} with ${type} ${text.slice(0, 30)}`);
      }
    }, 120_000);
  }
});

describe('uploads', () => {
  const wifPath = '/api/drafts/import-wif';
  const photoPath = () => `/api/drafts/${owner.draftId}/versions/1/photos`;
  const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);

  async function upload(path: string, bytes: Buffer, filename: string, contentType: string, fields: Record<string, string> = {}) {
    const token = await owner.client.csrf();
    let req = owner.client.agent.post(path).set('x-csrf-token', token);
    for (const [k, v] of Object.entries(fields)) req = req.field(k, v);
    return req.attach('file', bytes, { filename, contentType });
  }

  it('refuses photos whose bytes are not the image type they claim, and photos over the limit', async () => {
    const lies: [Buffer, string, string][] = [
      [Buffer.from('<svg xmlns="http://www.w3.org/2000/svg"><script>alert(1)</script></svg>'), 'cloth.png', 'image/png'],
      [Buffer.from('<html><body>hello</body></html>'), 'cloth.jpg', 'image/jpeg'],
      [Buffer.from('GIF89a\x01\x00\x01\x00'), 'cloth.webp', 'image/webp'],
      [Buffer.from('%PDF-1.7\n'), 'cloth.png', 'image/png'],
      [Buffer.from('MZ\x90\x00'), 'cloth.jpeg', 'image/jpeg'],
      [Buffer.from([0x89, 0x50, 0x4e]), 'short.png', 'image/png'],
      [Buffer.alloc(0), 'empty.png', 'image/png'],
    ];
    for (const [bytes, filename, type] of lies) {
      counts['POST photos (lying type)'] = (counts['POST photos (lying type)'] ?? 0) + 1;
      const res = await upload(photoPath(), bytes, filename, type);
      expect([400, 422], `${filename}: ${res.status}`).toContain(res.status);
      expect(apiErrorSchema.safeParse(res.body).success).toBe(true);
    }
    // A real PNG signature sent as text/plain is judged by its bytes, so it is taken as a PNG.
    const honest = await upload(photoPath(), Buffer.concat([png, Buffer.alloc(100)]), 'notes.txt', 'text/plain');
    expect(honest.status).toBe(201);
    expect(honest.body.photo.contentType).toBe('image/png');

    const big = await upload(photoPath(), Buffer.concat([png, Buffer.alloc(PHOTO_MAX_BYTES)]), 'huge.png', 'image/png');
    counts['POST photos (oversized)'] = 1;
    expect(big.status).toBe(413);
    expect(big.body.error.code).toBe('too_large');
  });

  it('refuses WIF uploads that are not WIF, whatever they claim, and files over the limit', async () => {
    const lies: [Buffer, string, string][] = [
      [Buffer.concat([png, Buffer.alloc(200)]), 'draft.wif', 'text/plain'],
      [Buffer.from('{"schemaVersion": 1}'), 'draft.wif', 'application/octet-stream'],
      [Buffer.from([0xff, 0xfe, 0x5b, 0x00, 0x57, 0x00]), 'utf16.wif', 'text/plain'],
      [Buffer.from('[WIF]\n[WEAVING]\nShafts=99\n'), 'draft.png', 'image/png'],
      [Buffer.alloc(0), 'empty.wif', 'text/plain'],
    ];
    for (const [bytes, filename, type] of lies) {
      counts['POST import-wif (lying type)'] = (counts['POST import-wif (lying type)'] ?? 0) + 1;
      const res = await upload(wifPath, bytes, filename, type);
      expect([400, 422], `${filename}: ${res.status}`).toContain(res.status);
      expect(apiErrorSchema.safeParse(res.body).success).toBe(true);
    }
    const big = await upload(wifPath, Buffer.alloc(WIF_MAX_BYTES + 1, 0x41), 'huge.wif', 'text/plain');
    counts['POST import-wif (oversized)'] = 1;
    expect(big.status).toBe(413);
    // Two files where one is allowed, and junk form fields.
    const two = await owner.client.agent.post(wifPath).set('x-csrf-token', await owner.client.csrf())
      .attach('file', Buffer.from('[WIF]'), 'a.wif').attach('file', Buffer.from('[WIF]'), 'b.wif');
    expect(two.status).toBe(400);
    const fields = await upload(wifPath, Buffer.from(toWif(straightTwillTrial())), 'ok.wif', 'text/plain', { studioId: 'twelve' });
    expect(fields.status).toBe(400);
  });

  it('answers generated WIF files with 201 or a 4xx, never a 500', async () => {
    const name = 'POST /api/drafts/import-wif (generated files)';
    const line = fc.oneof(
      fc.constantFrom('[WIF]', '[WEAVING]', '[THREADING]', '[TREADLING]', '[LIFTPLAN]', '[TIEUP]', '[COLOR TABLE]', '[WARP]', '[WEFT]',
        'Shafts=4', 'Treadles=4', 'Threads=4', '1=1', '2=9', '3=1,2,3', '99999999999999999999=1', '=', 'x'),
      fc.string({ unit: 'binary', maxLength: 12 }),
    );
    await fc.assert(
      fc.asyncProperty(fc.array(line, { maxLength: 20 }), async (lines) => {
        counts[name] = (counts[name] ?? 0) + 1;
        const text = lines.join('\n');
        const res = await upload(wifPath, Buffer.from(text), 'generated.wif', 'text/plain');
        expectSafeAnswer(res, res.status === 201, name);
      }),
      { numRuns: 300 },
    );
  }, 120_000);

  // A regression found by this fuzzing: the end number once sized an array and answered 500.
  it('answers a WIF file with an end number beyond any limit with a 4xx', async () => {
    const res = await upload(wifPath, Buffer.from('[WIF]\nVersion=1.1\n[THREADING]\n99999999999999999999=1\n'), 'far.wif', 'text/plain');
    expect(res.status).toBe(422);
  });
});
