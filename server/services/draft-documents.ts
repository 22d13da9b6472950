import { Op } from 'sequelize';
import { DraftError, parseDraft, pickCount, type Draft } from '../../shared/weave';
import { HttpError, notFound } from '../http/errors';
import type { Models } from '../models';
import type { DraftVersionAttributes, DraftVersionRow } from '../models/draft-version';

/**
 * Reads a draft document sent by a client; a document the engine refuses is a 422 whose fields name
 * every problem by its JSON path ("threading[36]": "threading end 37: shaft 9 but the draft has 8 shafts").
 * The engine's limits (32 shafts and treadles, 20 000 ends and picks) are among those problems.
 */
export function parseDocument(json: unknown): Draft {
  try {
    return parseDraft(json);
  } catch (err) {
    if (!(err instanceof DraftError)) throw err;
    const fields: Record<string, string> = {};
    for (const p of err.problems) fields[p.path || '_'] ??= p.message;
    throw new HttpError(422, 'unprocessable', err.message, fields);
  }
}

/**
 * A draft is stored only with cloth in it: 422 naming what is missing when it has no ends or no
 * picks. (An edit that empties the draft by mistake must not become its newest version.)
 */
export function requireCloth(document: Draft): void {
  const fields: Record<string, string> = {};
  if (document.threading.length === 0) fields.threading = 'the draft has no ends: it needs at least one';
  if (pickCount(document) === 0) fields[document.control] = 'the draft has no picks: it needs at least one';
  const missing = Object.values(fields);
  if (missing.length > 0) {
    throw new HttpError(422, 'unprocessable', `A draft is kept only with at least one end and one pick; ${missing.join(', and ')}`, fields);
  }
}

/**
 * The history row holding save number `n` of a draft (a working version holds a run of them), or
 * null. Rows never overlap, so it is the first row numbered `n` or above, if that row starts at `n`
 * or before.
 */
export async function versionRow<A extends keyof DraftVersionAttributes>(
  models: Models, draftId: number, n: number, attributes: A[],
): Promise<Pick<DraftVersionRow, A | 'firstVersion' | 'version'> | null> {
  const row = await models.DraftVersion.findOne({
    where: { draftId, version: { [Op.gte]: n } },
    order: [['version', 'ASC']],
    attributes: [...new Set<keyof DraftVersionAttributes>([...attributes, 'firstVersion', 'version'])],
  });
  return row && row.firstVersion <= n ? row : null;
}

/** The document of one version of a draft (the newest when `version` is omitted); 404 when there is no such version. */
export async function versionDocument(models: Models, draftId: number, version?: number): Promise<{ version: number; document: Draft }> {
  const row = version === undefined
    ? await models.DraftVersion.findOne({ where: { draftId }, order: [['version', 'DESC']], attributes: ['version', 'document'] })
    : await versionRow(models, draftId, version, ['document']);
  if (!row) throw notFound(version === undefined ? 'No such draft' : `This draft has no version ${version}`);
  // Stored documents were parsed on the way in; parsing again upgrades older formats and fills defaults added since.
  return { version: row.version, document: parseDraft(row.document) };
}
