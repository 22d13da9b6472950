import { col, fn, literal, Op, where, type Order, type WhereOptions } from 'sequelize';
import type { StudioRole } from '../../shared/api/auth';
import type { DraftDetail, DraftListQuery, DraftListResponse, DraftSummary } from '../../shared/api/drafts';
import type { Draft } from '../../shared/weave/types';
import { notFound } from '../middleware/errors';
import type { DraftAttributes, DraftRow } from '../models/draft';
import type { Models } from '../models';

/** The small columns kept beside the document so the library can filter and sort without parsing it. */
export function draftStats(draft: Draft): Pick<DraftAttributes, 'ends' | 'picks' | 'shafts' | 'colors'> {
  const picks = draft.control === 'liftplan' ? draft.liftplan.length : draft.treadling.length;
  return {
    ends: draft.threading.length,
    picks,
    shafts: draft.shafts,
    colors: new Set([...draft.warpColors, ...draft.weftColors]).size,
  };
}

/** Saves a new draft with its first version, both in one transaction. */
export async function createDraft(
  models: Models,
  input: { ownerId: number; studioId: number | null; document: Draft; tags: string[]; message?: string },
): Promise<DraftRow> {
  return models.Draft.sequelize!.transaction(async (transaction) => {
    const row = await models.Draft.create({
      ownerId: input.ownerId,
      studioId: input.studioId,
      name: input.document.name,
      document: input.document,
      tags: input.tags,
      version: 1,
      ...draftStats(input.document),
    }, { transaction });
    await models.DraftVersion.create({
      draftId: row.id, version: 1, authorId: input.ownerId, message: input.message ?? 'First version', document: input.document,
    }, { transaction });
    return row;
  });
}

async function memberStudioIds(models: Models, userId: number): Promise<number[]> {
  const rows = await models.Membership.findAll({ where: { userId }, attributes: ['studioId'] });
  return rows.map((r) => r.studioId);
}

function summary(row: DraftRow): DraftSummary {
  return {
    id: row.id,
    name: row.name,
    ownerName: row.owner?.name ?? '',
    studioId: row.studioId,
    studioName: row.studio?.name ?? null,
    ends: row.ends,
    picks: row.picks,
    shafts: row.shafts,
    colors: row.colors,
    tags: row.tags,
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    thumbnailUrl: null,
  };
}

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** The drafts a user owns or sees through a studio, filtered, sorted and paged. */
export async function listDrafts(models: Models, userId: number, query: DraftListQuery): Promise<DraftListResponse> {
  const studioIds = await memberStudioIds(models, userId);
  const visible: WhereOptions = studioIds.length > 0
    ? { [Op.or]: [{ ownerId: userId }, { studioId: { [Op.in]: studioIds } }] }
    : { ownerId: userId };
  const filters: WhereOptions[] = [visible];
  if (query.q) filters.push({ name: { [Op.like]: `%${escapeLike(query.q)}%` } });
  if (query.shafts) filters.push({ shafts: query.shafts });
  if (query.studio) filters.push({ studioId: query.studio });
  if (query.tag) filters.push(where(fn('JSON_CONTAINS', col('Draft.tags'), JSON.stringify(query.tag)), 1));

  const dir = query.dir === 'asc' ? 'ASC' : 'DESC';
  const key = { updated: [['updatedAt', dir]], name: [['name', dir]], size: [[literal('`Draft`.`ends` * `Draft`.`picks`'), dir]] }[query.sort];
  const order = [...key, ['id', dir]] as Order;

  const { rows, count } = await models.Draft.findAndCountAll({
    where: { [Op.and]: filters },
    attributes: { exclude: ['document'] },
    include: [
      { model: models.User, as: 'owner', attributes: ['name'] },
      { model: models.Studio, as: 'studio', attributes: ['name'] },
    ],
    order,
    limit: query.pageSize,
    offset: (query.page - 1) * query.pageSize,
  });
  return { items: rows.map(summary), total: count, page: query.page, pageSize: query.pageSize };
}

/**
 * The user's role on a draft: 'owner' for its owner, else their role in the draft's studio;
 * null when they cannot see it (which the routes answer with 404).
 */
export async function draftRole(models: Models, userId: number, draftId: number): Promise<StudioRole | null> {
  const row = await models.Draft.findByPk(draftId, { attributes: ['ownerId', 'studioId'] });
  if (!row) return null;
  if (row.ownerId === userId) return 'owner';
  if (row.studioId === null) return null;
  const m = await models.Membership.findOne({ where: { userId, studioId: row.studioId }, attributes: ['role'] });
  return m?.role ?? null;
}

/** One draft with its document, for a user whose role the access check already found. */
export async function draftDetail(models: Models, draftId: number, role: StudioRole): Promise<DraftDetail> {
  const row = await models.Draft.findByPk(draftId, {
    include: [
      { model: models.User, as: 'owner', attributes: ['name'] },
      { model: models.Studio, as: 'studio', attributes: ['name'] },
    ],
  });
  if (!row) throw notFound('No such draft');
  return { ...summary(row), document: row.document, role };
}
