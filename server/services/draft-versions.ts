import { QueryTypes } from 'sequelize';
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
 * Writes `document` as the next version, provided the draft is still at `baseVersion` (at whatever
 * version it is for `null`).
 * NOTE: the update names the base version in its WHERE, and InnoDB holds the row's lock from that
 * update to the commit, so of two saves from the same base exactly one changes the row; the other
 * waits, then changes nothing and gets the conflict. Parsing and the derived columns are computed
 * before the transaction so the lock is held only for the writes.
 * The two writes are plain SQL: saving is the busiest write there is, and Sequelize's instance
 * building and change tracking on a large JSON document cost more than MariaDB's work.
 */
async function writeVersion(
  models: Models, draftId: number, authorId: number, document: Draft, message: string, baseVersion: number | null,
): Promise<{ version: number }> {
  const { ends, picks, shafts, colors, structure } = derivedColumns(document);
  const text = JSON.stringify(document);
  const sequelize = models.Draft.sequelize!;
  return sequelize.transaction(async (transaction) => {
    let base = baseVersion;
    if (base === null) {
      const row = await models.Draft.findByPk(draftId, { attributes: ['version'], transaction, lock: transaction.LOCK.UPDATE });
      if (!row) throw notFound('No such draft');
      base = row.version;
    }
    const version = base + 1;
    const now = new Date();
    const [, changed] = await sequelize.query(
      'UPDATE `drafts` SET `document` = ?, `version` = ?, `ends` = ?, `picks` = ?, `shafts` = ?, `colors` = ?, '
        + '`structure` = ?, `thumbnail` = NULL, `updatedAt` = ? WHERE `id` = ? AND `version` = ?',
      { replacements: [text, version, ends, picks, shafts, colors, JSON.stringify(structure), now, draftId, base], type: QueryTypes.UPDATE, transaction },
    );
    if (changed === 0) {
      const current = await models.Draft.findByPk(draftId, { attributes: ['version', 'document'], transaction });
      if (!current) throw notFound('No such draft');
      throw new VersionConflict({ version: current.version, document: current.document });
    }
    models.access.draftSaved(transaction);
    await sequelize.query(
      'INSERT INTO `draft_versions` (`draftId`, `version`, `authorId`, `message`, `document`, `createdAt`) VALUES (?, ?, ?, ?, ?, ?)',
      { replacements: [draftId, version, authorId, message, text, now], type: QueryTypes.INSERT, transaction },
    );
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
