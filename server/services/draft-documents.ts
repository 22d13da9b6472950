import { DraftError, parseDraft, type Draft } from '../../shared/weave';
import { HttpError, notFound } from '../http/errors';
import type { Models } from '../models';

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

/** The document of one version of a draft (the newest when `version` is omitted); 404 when there is no such version. */
export async function versionDocument(models: Models, draftId: number, version?: number): Promise<{ version: number; document: Draft }> {
  const where = version === undefined ? { draftId } : { draftId, version };
  const row = await models.DraftVersion.findOne({ where, order: [['version', 'DESC']], attributes: ['version', 'document'] });
  if (!row) throw notFound(version === undefined ? 'No such draft' : `This draft has no version ${version}`);
  // Stored documents were parsed on the way in; parsing again fills defaults added since.
  return { version: row.version, document: parseDraft(row.document) };
}
