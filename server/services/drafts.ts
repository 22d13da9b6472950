import { Op, QueryTypes, type WhereOptions } from 'sequelize';
import type { StudioRole } from '../../shared/api/auth';
import type { DraftDetail, DraftListQuery, DraftListResponse, DraftSummary } from '../../shared/api/drafts';
import type { Draft } from '../../shared/weave/types';
import { notFound } from '../http/errors';
import type { DraftRow } from '../models/draft';
import type { Models } from '../models';
import { derivedColumns, type DerivedColumns } from './draft-derived';
import { requireCloth } from './draft-documents';
import { studioRole } from './studios';

export { draftStats } from './draft-derived';

/** Days a deleted draft stays in the Bin before it is gone for good. */
export const BIN_DAYS = 30;
/** Drafts put in the Bin before this moment are past restoring. */
export const binCutoff = (now = new Date()) => new Date(now.getTime() - BIN_DAYS * 86_400_000);

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
    /** The document's columns, when they were worked out (and the cloth checked) off the event loop. */
    derived?: DerivedColumns;
  },
): Promise<DraftRow> {
  let derived = input.derived;
  if (!derived) {
    requireCloth(input.document);
    derived = derivedColumns(input.document);
  }
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
      draftId: row.id, version: 1, firstVersion: 1, named: true, authorId: input.ownerId, message: input.message ?? 'First version', document: input.document,
    }, { transaction });
    return row;
  });
}

const memberStudioIds = async (models: Models, userId: number) => [...(await models.access.studioRoles(userId)).keys()];

/**
 * The condition for drafts a user can see: their personal drafts, and those of their studios. A
 * studio draft is the studio's: its author sees it only while a member.
 */
export async function visibleDraftsWhere(models: Models, userId: number): Promise<WhereOptions> {
  const studioIds = await memberStudioIds(models, userId);
  const personal = { ownerId: userId, studioId: null };
  const mine = studioIds.length > 0 ? { [Op.or]: [personal, { studioId: { [Op.in]: studioIds } }] } : personal;
  return { [Op.and]: [mine, { binnedAt: null }] };
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

const ORDER_KEYS = { updated: '`updatedAt`', name: '`name`', size: '`ends` * `picks`' } as const;
type ListRow = Omit<SummarySource, 'tags' | 'structure'> & { tags: string | string[]; structure: string | string[] | null };
const jsonList = (value: string | string[] | null): string[] => (typeof value === 'string' ? JSON.parse(value) as string[] : value ?? []);

/** The drafts a user owns or sees through a studio, filtered, sorted and paged, as the JSON text of a DraftListResponse. */
export async function listDraftsJson(models: Models, userId: number, query: DraftListQuery): Promise<string> {
  return JSON.stringify(await readLibraryPage(models, userId, query));
}

/**
 * NOTE: written as SQL rather than built by Sequelize: the library is the busiest read there is, and
 * building the query and its rows cost more than MariaDB's work. Every value goes in as a replacement.
 */
async function readLibraryPage(models: Models, userId: number, query: DraftListQuery): Promise<DraftListResponse> {
  // What visibleDraftsWhere says, in SQL.
  const studioIds = await memberStudioIds(models, userId);
  const personal = '(`ownerId` = ? AND `studioId` IS NULL)';
  const filters = [studioIds.length > 0 ? `(${personal} OR \`studioId\` IN (${studioIds.map(() => '?').join(', ')}))` : personal, '`binnedAt` IS NULL'];
  const values: unknown[] = [userId, ...studioIds];
  const filter = (sql: string, value: unknown) => {
    filters.push(sql);
    values.push(value);
  };
  if (query.q) filter('`name` LIKE ?', `%${escapeLike(query.q)}%`);
  if (query.shafts) filter('`shafts` = ?', query.shafts);
  if (query.studio) filter('`studioId` = ?', query.studio);
  if (query.tag) filter('JSON_CONTAINS(`tags`, ?) = 1', JSON.stringify(query.tag));
  if (query.structure) filter('JSON_CONTAINS(`structure`, ?) = 1', JSON.stringify(query.structure));
  const where = filters.join(' AND ');
  const dir = query.dir === 'asc' ? 'ASC' : 'DESC';

  const sequelize = models.Draft.sequelize!;
  // Counted apart from the page: the count needs no names, and both run at once.
  const [rows, [{ total }]] = await Promise.all([
    sequelize.query<ListRow>(
      `SELECT ${LIST_COLUMNS.map((c) => `\`${c}\``).join(', ')},
        (SELECT \`name\` FROM \`users\` WHERE \`users\`.\`id\` = \`drafts\`.\`ownerId\`) AS \`ownerName\`,
        (SELECT \`name\` FROM \`studios\` WHERE \`studios\`.\`id\` = \`drafts\`.\`studioId\`) AS \`studioName\`
       FROM \`drafts\` WHERE ${where}
       ORDER BY ${ORDER_KEYS[query.sort]} ${dir}, \`id\` ${dir} LIMIT ? OFFSET ?`,
      { replacements: [...values, query.pageSize, (query.page - 1) * query.pageSize], type: QueryTypes.SELECT },
    ),
    sequelize.query<{ total: number | bigint }>(`SELECT COUNT(*) AS \`total\` FROM \`drafts\` WHERE ${where}`, { replacements: values, type: QueryTypes.SELECT }),
  ]);
  return {
    items: rows.map((row) => summary({ ...row, tags: jsonList(row.tags), structure: jsonList(row.structure) })),
    total: Number(total),
    page: query.page,
    pageSize: query.pageSize,
  };
}

/**
 * The user's role on a draft: in a studio, their role in the studio, whoever made the draft (its
 * author keeps no rights of their own once removed or demoted); a personal draft is its owner's
 * alone. null when they cannot see it (which the routes answer with 404).
 */
export async function draftRole(models: Models, userId: number, draftId: number, { inBin = false } = {}): Promise<StudioRole | null> {
  const row = await models.access.draftOwnership(draftId);
  if (!row) return null;
  // A draft in the Bin exists only for the routes that act on the Bin, and only for BIN_DAYS.
  if ((row.binnedAt !== null) !== inBin) return null;
  if (row.binnedAt !== null && row.binnedAt.getTime() < binCutoff().getTime()) return null;
  if (row.studioId !== null) return studioRole(models, userId, row.studioId);
  return row.ownerId === userId ? 'owner' : null;
}

/** One draft with its document, for a user whose role the access check already found. */
export async function draftDetail(models: Models, draftId: number, role: StudioRole): Promise<DraftDetail> {
  const row = await detailRow(models, draftId, ['thumbnail']);
  return { ...summaryOfRow(row), document: row.document, role };
}

/** One draft's library entry, without reading its document (which may be a megabyte of JSON to decode). */
export async function draftSummary(models: Models, draftId: number): Promise<DraftSummary> {
  return summaryOfRow(await detailRow(models, draftId, LARGE_COLUMNS));
}

const summaryOfRow = (row: DraftRow) =>
  summary({ ...row.get(), ownerName: row.owner?.name ?? '', studioName: row.studio?.name ?? null });

async function detailRow(models: Models, draftId: number, exclude: string[]) {
  const row = await models.Draft.findByPk(draftId, {
    attributes: { exclude },
    include: [
      { model: models.User, as: 'owner', attributes: ['name'] },
      { model: models.Studio, as: 'studio', attributes: ['name'] },
    ],
  });
  if (!row) throw notFound('No such draft');
  return row;
}
