import { literal, Op } from 'sequelize';
import { SITTING_MINUTES, type CompareResponse, type SaveDraftBody, type VersionDetailResponse, type VersionSummary } from '../../shared/api';
import { alignDrafts, compareDrafts, comparisonImage, pickCount, type Draft, type ThreadAlignment } from '../../shared/weave';
import { encodePngRgb } from '../print/png';
import { HttpError, notFound } from '../http/errors';
import type { Models } from '../models';
import type { DraftVersionRow } from '../models/draft-version';
import { derivedColumns, thumbnailPng } from './draft-derived';
import { parseDocument, requireCloth, versionDocument, versionRow } from './draft-documents';

/** A save based on an old version: carries what the server holds now, for the 409 answer. */
export class VersionConflict extends HttpError {
  constructor(readonly current: { version: number; document: unknown }) {
    super(409, 'conflict', `Someone saved version ${current.version} first; your copy is based on an older version`);
  }
}

/** How often a restore, which is based on whatever version is current, tries again when a save slips in first. */
const RESTORE_ATTEMPTS = 3;
const SITTING_MS = SITTING_MINUTES * 60_000;

interface VersionWrite {
  authorId: number;
  /** A named version, which no autosave continues. */
  named: boolean;
  /**
   * Whether the save may carry the author's working version forward: a save of the weaver's edits
   * may; a restore, which replaces those edits, may not, so the working version stays as it was.
   */
  continues: boolean;
  /** Left as it was when an autosave continues a working version and gives none. */
  message?: string;
}

/**
 * Stores `document` as save number baseVersion + 1, provided the draft is still at `baseVersion`:
 * the conditional UPDATE of the draft row is what two saves from one base race for, and InnoDB holds
 * that row's lock to the commit, so exactly one of them moves it and the other gets null here (409).
 * The history row is then either the author's working version carried forward (when it is the newest
 * row, unnamed, theirs, and last saved within the sitting) or a new row.
 * Parsing and the derived columns are computed before the transaction, so the lock is held only for the writes.
 */
async function writeVersion(models: Models, draftId: number, document: Draft, baseVersion: number, write: VersionWrite): Promise<number | null> {
  requireCloth(document);
  const derived = derivedColumns(document);
  const version = baseVersion + 1;
  const savedAt = new Date();
  const message = write.message === undefined ? {} : { message: write.message };
  const written = await models.Draft.sequelize!.transaction(async (transaction) => {
    const [moved] = await models.Draft.update(
      { document, version, ...derived, thumbnail: null },
      { where: { id: draftId, version: baseVersion }, transaction },
    );
    if (moved !== 1) return false;
    const [continued] = !write.continues ? [0] : await models.DraftVersion.update({ version, document, savedAt, named: write.named, ...message }, {
      where: {
        draftId, version: baseVersion, named: false, authorId: write.authorId, savedAt: { [Op.gt]: new Date(savedAt.getTime() - SITTING_MS) },
      },
      transaction,
    });
    if (continued === 0) {
      await models.DraftVersion.create(
        { draftId, version, firstVersion: version, authorId: write.authorId, named: write.named, message: write.message ?? '', document, createdAt: savedAt, savedAt },
        { transaction },
      );
    }
    return true;
  });
  return written ? version : null;
}

/** The 409 for a save that lost to another (or 404 when the draft is gone meanwhile). */
async function conflict(models: Models, draftId: number): Promise<VersionConflict> {
  const current = await models.Draft.findByPk(draftId, { attributes: ['version', 'document'] });
  if (!current) throw notFound('No such draft');
  return new VersionConflict({ version: current.version, document: current.document });
}

/** PUT /api/drafts/:id: an autosave or a named version on top of the one the client started from. */
export async function saveDraft(models: Models, draftId: number, authorId: number, body: SaveDraftBody): Promise<{ version: number }> {
  const document = parseDocument(body.document);
  const version = await writeVersion(models, draftId, document, body.baseVersion, { authorId, named: body.named ?? false, continues: true, message: body.message });
  if (version === null) throw await conflict(models, draftId);
  return { version };
}

/** A new named version holding an older version's document; history is never rewritten. */
export async function restoreVersion(models: Models, draftId: number, authorId: number, n: number): Promise<{ version: number }> {
  const { document, version: restored } = await versionDocument(models, draftId, n);
  for (let attempt = 1; ; attempt++) {
    const current = await models.Draft.findByPk(draftId, { attributes: ['version'] });
    if (!current) throw notFound('No such draft');
    const version = await writeVersion(models, draftId, document, current.version, { authorId, named: true, continues: false, message: `Restored version ${restored}` });
    if (version !== null) return { version };
    if (attempt === RESTORE_ATTEMPTS) throw await conflict(models, draftId);
  }
}

type SummaryRow = Pick<DraftVersionRow, 'draftId' | 'version' | 'firstVersion' | 'named' | 'message' | 'createdAt' | 'savedAt'>
  & { author?: { name: string } | null; hasCloth: boolean };

function versionSummary(row: SummaryRow): VersionSummary {
  return {
    version: row.version,
    firstVersion: row.firstVersion,
    named: row.named,
    authorName: row.author?.name ?? '',
    message: row.message,
    createdAt: row.createdAt.toISOString(),
    savedAt: row.savedAt.toISOString(),
    thumbnailUrl: row.hasCloth ? `/api/drafts/${row.draftId}/versions/${row.version}/thumbnail.png` : null,
  };
}

const HAS_CLOTH_SQL = "JSON_LENGTH(document, '$.threading') > 0 AND "
  + "JSON_LENGTH(document, IF(JSON_VALUE(document, '$.control') = 'liftplan', '$.liftplan', '$.treadling')) > 0";
const SUMMARY_COLUMNS = ['draftId', 'version', 'firstVersion', 'named', 'message', 'createdAt', 'savedAt'];

/** Every version of a draft, newest first, without documents. */
export async function listVersions(models: Models, draftId: number): Promise<VersionSummary[]> {
  const rows = await models.DraftVersion.findAll({
    where: { draftId },
    // Whether there is cloth to picture (ends, and picks in the list that controls them), without sending every document.
    attributes: [...SUMMARY_COLUMNS, [literal(HAS_CLOTH_SQL), 'hasCloth']],
    include: [{ model: models.User, as: 'author', attributes: ['name'] }],
    order: [['version', 'DESC']],
  });
  return rows.map((row) => versionSummary({ ...row.get(), author: row.author, hasCloth: Boolean(row.get('hasCloth')) }));
}

/** One version with its document: the version holding save number `n`. */
export async function getVersion(models: Models, draftId: number, n: number): Promise<VersionDetailResponse> {
  const found = await versionRow(models, draftId, n, ['id']);
  const row = found && await models.DraftVersion.findByPk(found.id, { include: [{ model: models.User, as: 'author', attributes: ['name'] }] });
  if (!row) throw notFound(`This draft has no version ${n}`);
  // Stored documents were whole drafts when saved.
  const stored = row.document as Draft;
  const hasCloth = stored.threading.length > 0 && pickCount(stored) > 0;
  return { version: { ...versionSummary({ ...row.get(), author: row.author, hasCloth }), document: row.document } };
}

/** The cloth of the version holding save number `n`, as a small PNG (as the library's thumbnails). */
export async function versionThumbnail(models: Models, draftId: number, n: number): Promise<{ png: Buffer; version: number }> {
  const { document, version } = await versionDocument(models, draftId, n);
  const png = thumbnailPng(document);
  if (!png) throw notFound('This version has no cloth to show');
  return { png, version };
}

/** What changed from version a to version b (ends and picks 1-based). */
export async function compareVersions(models: Models, draftId: number, a: number, b: number): Promise<CompareResponse> {
  const [va, vb] = await Promise.all([versionDocument(models, draftId, a), versionDocument(models, draftId, b)]);
  const result = compareDrafts(va.document, vb.document);
  const aligned = alignDrafts(va.document, vb.document);
  const counted = (t: ThreadAlignment): ThreadAlignment => ({
    inserted: t.inserted.map((i) => i + 1), removed: t.removed.map((i) => i + 1), changed: t.changed.map((i) => i + 1),
  });
  return {
    a,
    b,
    ends: result.ends.map((e) => e + 1),
    picks: result.picks.map((p) => p + 1),
    aligned: { ends: counted(aligned.ends), picks: counted(aligned.picks) },
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
