import { col, fn, literal, Op, where, type Order, type WhereOptions } from 'sequelize';
import type { StudioRole } from '../../shared/api/auth';
import type { DraftDetail, DraftListQuery, DraftListResponse, DraftSummary } from '../../shared/api/drafts';
import type { Draft } from '../../shared/weave/types';
import { notFound } from '../middleware/errors';
import type { DraftRow } from '../models/draft';
import type { Models } from '../models';
import { derivedColumns } from './draft-derived';

export { draftStats } from './draft-derived';

/** Saves a new draft with its first version, both in one transaction. */
export async function createDraft(
  models: Models,
  input: {
    ownerId: number;
    studioId: number | null;
    document: Draft;
    tags: string[];
    message?: string;
    /** Set when the draft is a fork. */
    parent?: { draftId: number; version: number };
  },
): Promise<DraftRow> {
  const derived = derivedColumns(input.document);
  return models.Draft.sequelize!.transaction(async (transaction) => {
    const row = await models.Draft.create({
      ownerId: input.ownerId,
      studioId: input.studioId,
      name: input.document.name,
      document: input.document,
      tags: input.tags,
      version: 1,
      parentDraftId: input.parent?.draftId ?? null,
      parentVersion: input.parent?.version ?? null,
      ...derived,
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

/** The condition for drafts a user can see: their own, and those of their studios. */
export async function visibleDraftsWhere(models: Models, userId: number): Promise<WhereOptions> {
  const studioIds = await memberStudioIds(models, userId);
  return studioIds.length > 0
    ? { [Op.or]: [{ ownerId: userId }, { studioId: { [Op.in]: studioIds } }] }
    : { ownerId: userId };
}

/** The library's view of a draft row (loaded without its document and thumbnail bytes). */
export function summary(row: DraftRow): DraftSummary {
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
    structure: row.structure ?? [],
    version: row.version,
    updatedAt: row.updatedAt.toISOString(),
    // The version in the address lets browsers cache each thumbnail for good.
    thumbnailUrl: row.ends > 0 && row.picks > 0 ? `/api/drafts/${row.id}/thumbnail.png?v=${row.version}` : null,
  };
}

/** Columns a list or a role check never needs. */
export const LARGE_COLUMNS = ['document', 'thumbnail'];

const escapeLike = (text: string) => text.replace(/[\\%_]/g, (c) => `\\${c}`);

/** The drafts a user owns or sees through a studio, filtered, sorted and paged. */
export async function listDrafts(models: Models, userId: number, query: DraftListQuery): Promise<DraftListResponse> {
  const filters: WhereOptions[] = [await visibleDraftsWhere(models, userId)];
  if (query.q) filters.push({ name: { [Op.like]: `%${escapeLike(query.q)}%` } });
  if (query.shafts) filters.push({ shafts: query.shafts });
  if (query.studio) filters.push({ studioId: query.studio });
  if (query.tag) filters.push(where(fn('JSON_CONTAINS', col('Draft.tags'), JSON.stringify(query.tag)), 1));
  if (query.structure) filters.push(where(fn('JSON_CONTAINS', col('Draft.structure'), JSON.stringify(query.structure)), 1));

  const dir = query.dir === 'asc' ? 'ASC' : 'DESC';
  const key = { updated: [['updatedAt', dir]], name: [['name', dir]], size: [[literal('`Draft`.`ends` * `Draft`.`picks`'), dir]] }[query.sort];
  const order = [...key, ['id', dir]] as Order;

  const matching = { [Op.and]: filters };
  // Counted apart from the page: the count needs no joins, and both run at once.
  const [rows, count] = await Promise.all([
    models.Draft.findAll({
      where: matching,
      attributes: { exclude: LARGE_COLUMNS },
      include: [
        { model: models.User, as: 'owner', attributes: ['name'] },
        { model: models.Studio, as: 'studio', attributes: ['name'] },
      ],
      order,
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
    }),
    models.Draft.count({ where: matching }),
  ]);
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
    attributes: { exclude: ['thumbnail'] },
    include: [
      { model: models.User, as: 'owner', attributes: ['name'] },
      { model: models.Studio, as: 'studio', attributes: ['name'] },
    ],
  });
  if (!row) throw notFound('No such draft');
  return { ...summary(row), document: row.document, role };
}
