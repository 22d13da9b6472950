import { col, fn, literal, Op, where, type Order, type WhereOptions } from 'sequelize';
import type { StudioRole } from '../../shared/api/auth';
import type { DraftDetail, DraftListQuery, DraftListResponse, DraftSummary } from '../../shared/api/drafts';
import type { Draft } from '../../shared/weave/types';
import { notFound } from '../middleware/errors';
import type { DraftRow } from '../models/draft';
import type { Models } from '../models';
import { derivedColumns } from './draft-derived';
import { studioRole } from './studios';

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

/** The columns a library entry shows, with the names of the draft's owner and studio. */
type SummarySource = Pick<DraftRow, 'id' | 'name' | 'studioId' | 'ends' | 'picks' | 'shafts' | 'colors' | 'tags' | 'structure' | 'version' | 'updatedAt'>
  & { ownerName: string; studioName: string | null };

/** The library's view of a draft row (loaded without its document and thumbnail bytes). */
export function summary(row: SummarySource): DraftSummary {
  return {
    id: row.id,
    name: row.name,
    ownerName: row.ownerName,
    studioId: row.studioId,
    studioName: row.studioName,
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
const LIST_COLUMNS = ['id', 'name', 'studioId', 'ends', 'picks', 'shafts', 'colors', 'tags', 'structure', 'version', 'updatedAt'];

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
  // Counted apart from the page: the count needs no names, and both run at once. The page is read
  // as plain rows with the two names as subqueries: building model instances and joined includes
  // cost more than the query itself.
  const [rows, count] = await Promise.all([
    models.Draft.findAll({
      where: matching,
      attributes: [
        ...LIST_COLUMNS,
        [literal('(SELECT `name` FROM `users` WHERE `users`.`id` = `Draft`.`ownerId`)'), 'ownerName'],
        [literal('(SELECT `name` FROM `studios` WHERE `studios`.`id` = `Draft`.`studioId`)'), 'studioName'],
      ],
      order,
      limit: query.pageSize,
      offset: (query.page - 1) * query.pageSize,
      raw: true,
    }) as unknown as Promise<SummarySource[]>,
    models.Draft.count({ where: matching }),
  ]);
  return { items: rows.map(summary), total: count, page: query.page, pageSize: query.pageSize };
}

/**
 * The user's role on a draft: 'owner' for its owner, else their role in the draft's studio;
 * null when they cannot see it (which the routes answer with 404).
 */
export async function draftRole(models: Models, userId: number, draftId: number): Promise<StudioRole | null> {
  // Runs before every draft route: plain rows, as building model instances costs more than the query.
  const row = await models.Draft.findByPk(draftId, { attributes: ['ownerId', 'studioId'], raw: true });
  if (!row) return null;
  if (row.ownerId === userId) return 'owner';
  if (row.studioId === null) return null;
  return studioRole(models, userId, row.studioId);
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
  return { ...summary({ ...row.get(), ownerName: row.owner?.name ?? '', studioName: row.studio?.name ?? null }), document: row.document, role };
}
