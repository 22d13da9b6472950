import type { CompareResponse, SaveDraftBody, VersionDetailResponse, VersionSummary } from '../../shared/api';
import { compareDrafts, comparisonImage, type Draft } from '../../shared/weave';
import { encodePngRgb } from '../print/png';
import { HttpError, notFound } from '../middleware/errors';
import type { Models } from '../models';
import type { DraftVersionRow } from '../models/draft-version';
import { derivedColumns } from './draft-derived';
import { parseDocument, versionDocument } from './draft-documents';

/** A save based on an old version: carries what the server holds now, for the 409 answer. */
export class VersionConflict extends HttpError {
  constructor(readonly current: { version: number; document: unknown }) {
    super(409, 'conflict', `Someone saved version ${current.version} first; your copy is based on an older version`);
  }
}

/**
 * Writes `document` as the next version, provided the draft is still at `baseVersion`.
 * NOTE: the draft row is locked (SELECT … FOR UPDATE) for the whole transaction, so of two saves from
 * the same base exactly one sees its base as current; the other waits, then gets the conflict.
 * Parsing and rendering happen before the lock so it is held only for the writes.
 */
async function writeVersion(
  models: Models, draftId: number, authorId: number, document: Draft, message: string, baseVersion: number | null,
): Promise<{ version: number }> {
  const derived = derivedColumns(document);
  return models.Draft.sequelize!.transaction(async (transaction) => {
    const row = await models.Draft.findByPk(draftId, { attributes: ['id', 'version'], transaction, lock: transaction.LOCK.UPDATE });
    if (!row) throw notFound('No such draft');
    if (baseVersion !== null && row.version !== baseVersion) {
      const current = await models.Draft.findByPk(draftId, { attributes: ['document'], transaction });
      throw new VersionConflict({ version: row.version, document: current!.document });
    }
    const version = row.version + 1;
    await models.DraftVersion.create({ draftId, version, authorId, message, document }, { transaction });
    await models.Draft.update({ document, version, ...derived }, { where: { id: draftId }, transaction });
    return { version };
  });
}

/** PUT /api/drafts/:id: a new version on top of the one the client started from. */
export async function saveDraft(models: Models, draftId: number, authorId: number, body: SaveDraftBody): Promise<{ version: number }> {
  const document = parseDocument(body.document);
  return writeVersion(models, draftId, authorId, document, body.message ?? '', body.baseVersion);
}

/** A new version holding an older version's document; history is never rewritten. */
export async function restoreVersion(models: Models, draftId: number, authorId: number, n: number): Promise<{ version: number }> {
  const { document } = await versionDocument(models, draftId, n);
  return writeVersion(models, draftId, authorId, document, `Restored version ${n}`, null);
}

function versionSummary(row: DraftVersionRow & { author?: { name: string } }): VersionSummary {
  return { version: row.version, authorName: row.author?.name ?? '', message: row.message, createdAt: row.createdAt.toISOString() };
}

/** Every version of a draft, newest first, without documents. */
export async function listVersions(models: Models, draftId: number): Promise<VersionSummary[]> {
  const rows = await models.DraftVersion.findAll({
    where: { draftId },
    attributes: { exclude: ['document'] },
    include: [{ model: models.User, as: 'author', attributes: ['name'] }],
    order: [['version', 'DESC']],
  });
  return rows.map(versionSummary);
}

/** One version with its document. */
export async function getVersion(models: Models, draftId: number, n: number): Promise<VersionDetailResponse> {
  const row = await models.DraftVersion.findOne({
    where: { draftId, version: n },
    include: [{ model: models.User, as: 'author', attributes: ['name'] }],
  });
  if (!row) throw notFound(`This draft has no version ${n}`);
  return { version: { ...versionSummary(row), document: row.document } };
}

/** What changed from version a to version b (ends and picks 1-based). */
export async function compareVersions(models: Models, draftId: number, a: number, b: number): Promise<CompareResponse> {
  const [va, vb] = await Promise.all([versionDocument(models, draftId, a), versionDocument(models, draftId, b)]);
  const result = compareDrafts(va.document, vb.document);
  return {
    a,
    b,
    ends: result.ends.map((e) => e + 1),
    picks: result.picks.map((p) => p + 1),
    tieup: result.tieup,
    cells: result.cells,
    imageUrl: `/api/drafts/${draftId}/compare.png?a=${a}&b=${b}`,
  };
}

/** The drawdown difference of two versions as a PNG, one pixel per cell (cropped to 2000 × 2000). */
export async function comparePng(models: Models, draftId: number, a: number, b: number): Promise<Buffer> {
  const [va, vb] = await Promise.all([versionDocument(models, draftId, a), versionDocument(models, draftId, b)]);
  const image = comparisonImage(va.document, vb.document);
  return encodePngRgb(image.width, image.height, image.rgb);
}
