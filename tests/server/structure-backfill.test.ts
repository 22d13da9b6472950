// Migration 0005: drafts that 0003 left with no structure tags get them from their documents.
import { QueryTypes } from 'sequelize';
import { afterAll, beforeAll, expect, it } from 'vitest';
import { up } from '../../server/db/migrations/0005-structure-backfill';
import { doubleWeaveTableMat, pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { createDraft } from '../../server/services/drafts';
import { startTestServer, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => { server = await startTestServer(); });
afterAll(async () => { await server?.close(); });

it('works out the tags of drafts saved before there were any, and leaves their last change alone', async () => {
  const { ctx } = server;
  const user = await server.createUser();
  const twill = await createDraft(ctx.models, { ownerId: user.id, studioId: null, document: pointTwillScarf(), tags: [] });
  const doubleWeave = await createDraft(ctx.models, { ownerId: user.id, studioId: null, document: doubleWeaveTableMat(), tags: [] });
  const ids = [twill.id, doubleWeave.id];
  const read = () => ctx.sequelize.query<{ id: number; structure: unknown; updatedAt: Date }>(
    'SELECT `id`, `structure`, `updatedAt` FROM `drafts` WHERE `id` IN (?) ORDER BY `id`', { replacements: [ids], type: QueryTypes.SELECT },
  );
  const tagsOf = (value: unknown) => (typeof value === 'string' ? JSON.parse(value) : value);
  const saved = await read();
  // What 0003 did to drafts that were already there.
  await ctx.sequelize.query("UPDATE `drafts` SET `structure` = '[]' WHERE `id` IN (?)", { replacements: [ids] });

  await up({ context: ctx.sequelize.getQueryInterface() });
  const after = await read();
  expect(after.map((r) => tagsOf(r.structure))).toEqual([['twill'], ['double weave', 'block weave']]);
  expect(after.map((r) => r.updatedAt)).toEqual(saved.map((r) => r.updatedAt));
  expect(after.map((r) => tagsOf(r.structure))).toEqual(saved.map((r) => tagsOf(r.structure)));
});
