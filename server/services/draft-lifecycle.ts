import { Op, type WhereOptions } from 'sequelize';
import { roleRank } from '../../shared/api/auth';
import type { BinResponse, CreateDraftBody, DraftSummary, ForkBody, LineageDraft, LineageResponse, UpdateDraftBody } from '../../shared/api';
import { startingDraft, StartingDraftError, type Draft } from '../../shared/weave';
import { forbidden, HttpError, notFound } from '../http/errors';
import type { Models } from '../models';
import type { DraftRow } from '../models/draft';
import { parseDocument, versionDocument } from './draft-documents';
import type { DerivedColumns } from './draft-derived';
import { BIN_DAYS, binCutoff, createDraft, draftSummary, LARGE_COLUMNS, visibleDraftsWhere } from './drafts';
import { studioRole } from './studios';

/** Adding a draft to a studio takes the editor role there; a studio the user is not in does not exist for them. */
export async function checkStudioWriter(models: Models, userId: number, studioId: number | undefined): Promise<number | null> {
  if (studioId === undefined) return null;
  const role = await studioRole(models, userId, studioId);
  if (!role) throw notFound('No such studio');
  if (roleRank(role) < roleRank('editor')) throw forbidden('Only editors and owners can add drafts to this studio');
  return studioId;
}

/** The first version from the New draft form's choices; a choice the loom cannot take is a 422 naming its field. */
function startingDocument(name: string, start: NonNullable<CreateDraftBody['start']>): Draft {
  try {
    return startingDraft({ name, ...start });
  } catch (err) {
    if (!(err instanceof StartingDraftError)) throw err;
    throw new HttpError(422, 'unprocessable', err.message, { [`start.${err.field}`]: err.message });
  }
}

/**
 * POST /api/drafts: a draft from the document given (with at least one end and pick) or built from
 * the starting choices; the name given wins over the document's.
 */
export async function createFromBody(models: Models, userId: number, body: CreateDraftBody): Promise<DraftSummary> {
  const studioId = await checkStudioWriter(models, userId, body.studioId);
  if (body.document === undefined && body.start === undefined) {
    throw new HttpError(422, 'unprocessable', 'A new draft needs its document, with at least one end and one pick',
      { document: 'is missing: give the draft to start with, with at least one end and one pick' });
  }
  const base = body.document === undefined ? startingDocument(body.name, body.start!) : parseDocument(body.document);
  const document: Draft = { ...base, name: body.name };
  const row = await createDraft(models, { ownerId: userId, studioId, document, tags: body.tags ?? [] });
  return draftSummary(models, row.id);
}

/** A draft read from a file: same checks as a new draft. */
export async function createFromDocument(
  models: Models, userId: number, document: Draft, studioId: number | undefined, message: string, derived?: DerivedColumns,
) {
  const target = await checkStudioWriter(models, userId, studioId);
  const row = await createDraft(models, { ownerId: userId, studioId: target, document, tags: [], message, derived });
  return draftSummary(models, row.id);
}

/**
 * A draft's details. A new name goes into the stored document too (same version: only the name
 * changed), so exports and the next opening agree with the library. A move into a studio needs the
 * editor role there; a move back into personal drafts is for the draft's author, who must still be an
 * editor or owner where it is (the route checked that).
 */
export async function updateDraft(models: Models, userId: number, draftId: number, body: UpdateDraftBody): Promise<void> {
  const row = await models.Draft.findByPk(draftId, { attributes: ['id', 'ownerId', 'studioId', 'document'] });
  if (!row) throw notFound('No such draft');
  const changes: Partial<Pick<DraftRow, 'name' | 'tags' | 'document' | 'studioId'>> = {};
  if (body.name !== undefined) {
    changes.name = body.name;
    const stored = typeof row.document === 'string' ? JSON.parse(row.document) as Draft : row.document as Draft;
    changes.document = { ...stored, name: body.name };
  }
  if (body.tags !== undefined) changes.tags = [...new Set(body.tags)];
  if (body.studioId !== undefined && body.studioId !== row.studioId) {
    if (body.studioId === null) {
      if (row.ownerId !== userId) throw forbidden('Only the weaver who made this draft can take it into her own drafts');
      changes.studioId = null;
    } else {
      changes.studioId = await checkStudioWriter(models, userId, body.studioId);
    }
  }
  await models.Draft.sequelize!.transaction(async (transaction) => {
    await models.Draft.update(changes, { where: { id: draftId }, transaction });
    if (body.name === undefined) return;
    // The newest version holds the same document: it takes the name too, so its exports agree.
    const latest = await models.DraftVersion.findOne({ where: { draftId }, order: [['version', 'DESC']], attributes: ['id', 'document'], transaction });
    if (!latest) return;
    const doc = typeof latest.document === 'string' ? JSON.parse(latest.document) as Draft : latest.document as Draft;
    await models.DraftVersion.update({ document: { ...doc, name: body.name } }, { where: { id: latest.id }, transaction });
  });
}

/** DELETE /api/drafts/:id: into the Bin, from which its owner can restore it for BIN_DAYS. */
export async function binDraft(models: Models, draftId: number): Promise<void> {
  await models.Draft.update({ binnedAt: new Date() }, { where: { id: draftId } });
}

/** POST /api/drafts/:id/restore: out of the Bin, just as it was. */
export async function restoreDraft(models: Models, draftId: number): Promise<void> {
  await models.Draft.update({ binnedAt: null }, { where: { id: draftId } });
}

/**
 * The Bin of one weaver: her own drafts and those of studios she owns (who may delete them), put
 * there within BIN_DAYS. Drafts past that are deleted for good first, whoever's they are.
 */
export async function binContents(models: Models, storage: { delete(key: string): Promise<void> }, userId: number): Promise<BinResponse> {
  const cutoff = binCutoff();
  const expired = await models.Draft.findAll({ where: { binnedAt: { [Op.lt]: cutoff } }, attributes: ['id'] });
  for (const row of expired) await deleteDraft(models, storage, row.id);
  const owned = [...(await models.access.studioRoles(userId))].filter(([, role]) => role === 'owner').map(([id]) => id);
  const rows = await models.Draft.findAll({
    where: {
      binnedAt: { [Op.gte]: cutoff },
      [Op.or]: [{ ownerId: userId, studioId: null }, ...(owned.length > 0 ? [{ studioId: { [Op.in]: owned } }] : [])],
    },
    attributes: ['id', 'name', 'binnedAt'],
    include: [{ model: models.Studio, as: 'studio', attributes: ['name'] }],
    order: [['binnedAt', 'DESC'], ['id', 'DESC']],
  });
  return {
    drafts: rows.map((r) => ({
      id: r.id,
      name: r.name,
      studioName: r.studio?.name ?? null,
      binnedAt: r.binnedAt!.toISOString(),
      purgeAt: new Date(r.binnedAt!.getTime() + BIN_DAYS * 86_400_000).toISOString(),
    })),
  };
}

/** Deletes a draft with its history, comments and links; its photos are removed from storage afterwards. */
export async function deleteDraft(models: Models, storage: { delete(key: string): Promise<void> }, draftId: number): Promise<void> {
  const photos = await models.Attachment.findAll({ where: { draftId }, attributes: ['storageKey'] });
  await models.Draft.destroy({ where: { id: draftId } });
  for (const p of photos) await storage.delete(p.storageKey);
}

/**
 * POST /api/drafts/:id/fork: a new draft (own history, version 1) from one version of another,
 * optionally in a new colourway: `palette` replaces the colours entry for entry, so every end and
 * pick keeps its place in the colour order.
 */
export async function forkDraft(models: Models, userId: number, sourceId: number, body: ForkBody): Promise<DraftSummary> {
  const studioId = await checkStudioWriter(models, userId, body.studioId);
  const source = await versionDocument(models, sourceId, body.version);
  if (body.palette && body.palette.length !== source.document.palette.length) {
    throw new HttpError(422, 'unprocessable', `The new colourway has ${body.palette.length} colours; the draft has ${source.document.palette.length}`,
      { palette: `give exactly ${source.document.palette.length} colours, one for each colour of the draft` });
  }
  const document: Draft = { ...source.document, name: body.name, palette: body.palette ?? source.document.palette };
  const from = await models.Draft.findByPk(sourceId, { attributes: ['name', 'tags'] });
  const row = await createDraft(models, {
    ownerId: userId,
    studioId,
    document,
    // A colourway is the same cloth: the weaver's words for it still apply.
    tags: from?.tags ?? [],
    message: `New colourway of “${from?.name ?? 'a draft'}” version ${source.version}`,
    parent: { draftId: sourceId, version: source.version },
  });
  return draftSummary(models, row.id);
}

const MAX_ANCESTORS = 100;

function lineageDraft(row: DraftRow): LineageDraft {
  return { id: row.id, name: row.name, ownerName: row.owner?.name ?? '', parentVersion: row.parentVersion };
}

/** Where a draft came from (parents, nearest first) and the drafts forked from it, as far as the user can see. */
export async function lineage(models: Models, userId: number, draftId: number): Promise<LineageResponse> {
  const visible = await visibleDraftsWhere(models, userId);
  const load = (where: WhereOptions<DraftRow>) => models.Draft.findAll({
    where,
    attributes: { exclude: LARGE_COLUMNS },
    include: [{ model: models.User, as: 'owner', attributes: ['name'] }],
    order: [['createdAt', 'ASC'], ['id', 'ASC']],
  });
  const [self] = await load({ id: draftId });
  if (!self) throw notFound('No such draft');

  const ancestors: LineageDraft[] = [];
  let hiddenAncestors = 0;
  let parentId = self.parentDraftId;
  const seen = new Set([draftId]);
  while (parentId !== null && !seen.has(parentId) && seen.size <= MAX_ANCESTORS) {
    seen.add(parentId);
    const [parent] = await load({ id: parentId });
    if (!parent) break;
    const [shown] = await load({ [Op.and]: [{ id: parentId }, visible] });
    if (shown) ancestors.push(lineageDraft(shown));
    else hiddenAncestors++;
    parentId = parent.parentDraftId;
  }
  const children = await load({ [Op.and]: [{ parentDraftId: draftId }, visible] });
  return { draft: lineageDraft(self), ancestors, hiddenAncestors, children: children.map(lineageDraft) };
}
