import type { Yarn, YarnBody, YarnPatch } from '../../shared/api';
import { notFound } from '../http/errors';
import type { Models } from '../models';
import type { YarnRow } from '../models/yarn';

const toYarn = (row: YarnRow): Yarn => ({
  id: row.id, name: row.name, fibre: row.fibre, colour: row.colour, count: row.count, yardsPerPound: row.yardsPerPound,
});

/** The user's stash, by name. */
export async function listYarns(models: Models, ownerId: number): Promise<Yarn[]> {
  const rows = await models.Yarn.findAll({ where: { ownerId }, order: [['name', 'ASC'], ['id', 'ASC']] });
  return rows.map(toYarn);
}

export async function createYarn(models: Models, ownerId: number, body: YarnBody): Promise<Yarn> {
  return toYarn(await models.Yarn.create({ ownerId, ...body, colour: body.colour.toLowerCase() }));
}

/** Another weaver's yarn is not found, rather than forbidden: the stash is private. */
async function ownYarn(models: Models, ownerId: number, id: number): Promise<YarnRow> {
  const row = await models.Yarn.findOne({ where: { id, ownerId } });
  if (!row) throw notFound('No such yarn');
  return row;
}

export async function updateYarn(models: Models, ownerId: number, id: number, patch: YarnPatch): Promise<Yarn> {
  const row = await ownYarn(models, ownerId, id);
  await row.update({ ...patch, ...(patch.colour ? { colour: patch.colour.toLowerCase() } : {}) });
  return toYarn(row);
}

export async function deleteYarn(models: Models, ownerId: number, id: number): Promise<void> {
  await (await ownYarn(models, ownerId, id)).destroy();
}
