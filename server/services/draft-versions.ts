import type { CompareResponse, SaveDraftBody, VersionDetailResponse, VersionSummary } from '../../shared/api';
import { compareDrafts, comparisonImage, type Draft } from '../../shared/weave';
import { encodePngRgb } from '../print/png';
import { HttpError, notFound } from '../http/errors';
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

/** How often a restore, which is based on whatever version is current, tries again when a save slips in first. */
const RESTORE_ATTEMPTS = 3;

/**
 * Writes `document` as the next version, provided the draft is still at `baseVersion`, in one call
 * of the save_draft_version procedure (migration 0006 says why and how). Parsing and the derived
 * columns are computed before it, so the row's lock is held only for the writes.
 * Returns the new version, or null when the draft was no longer at `baseVersion`.
 */
async function writeVersion(
  models: Models, draftId: number, authorId: number, document: Draft, message: string, baseVersion: number,
): Promise<number | null> {
  const { ends, picks, shafts, colors, structure } = derivedColumns(document);
  // For a CALL, Sequelize answers with the rows of the procedure's first result set.
  const rows = await models.Draft.sequelize!.query(
    'CALL save_draft_version(?, ?, ?, ?, ?, ?, ?, ?, ?, ?, ?)',
    { replacements: [draftId, baseVersion, JSON.stringify(document), ends, picks, shafts, colors, JSON.stringify(structure), authorId, message, new Date()] },
  ) as unknown as [{ version: number }];
  const { version } = rows[0];
  // Plain SQL runs no model hooks; the procedure has committed by the time it answers.
  await models.access.draftSaved();
  return version === 0 ? null : version;
}

/** The 409 for a save that lost to another (or 404 when the draft is gone meanwhile). */
async function conflict(models: Models, draftId: number): Promise<VersionConflict> {
  const current = await models.Draft.findByPk(draftId, { attributes: ['version', 'document'] });
  if (!current) throw notFound('No such draft');
  return new VersionConflict({ version: current.version, document: current.document });
}

/** PUT /api/drafts/:id: a new version on top of the one the client started from. */
export async function saveDraft(models: Models, draftId: number, authorId: number, body: SaveDraftBody): Promise<{ version: number }> {
  const document = parseDocument(body.document);
  const version = await writeVersion(models, draftId, authorId, document, body.message ?? '', body.baseVersion);
  if (version === null) throw await conflict(models, draftId);
  return { version };
}

/** A new version holding an older version's document; history is never rewritten. */
export async function restoreVersion(models: Models, draftId: number, authorId: number, n: number): Promise<{ version: number }> {
  const { document } = await versionDocument(models, draftId, n);
  for (let attempt = 1; ; attempt++) {
    const current = await models.Draft.findByPk(draftId, { attributes: ['version'] });
    if (!current) throw notFound('No such draft');
    const version = await writeVersion(models, draftId, authorId, document, `Restored version ${n}`, current.version);
    if (version !== null) return { version };
    if (attempt === RESTORE_ATTEMPTS) throw await conflict(models, draftId);
  }
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
