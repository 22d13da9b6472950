import { parseDraft } from '../../shared/weave';
import { notFound } from '../http/errors';
import type { Models } from '../models';
import { thumbnailPng } from './draft-derived';

const noCloth = () => notFound('This draft has no cloth to show yet');

/**
 * The PNG at a draft's thumbnailUrl. Saves do not render it (a weaver saves far more often than the
 * library shows a new version), so the first request after a save renders it from the stored
 * document and keeps it on the row until the next save clears it.
 */
export async function draftThumbnail(models: Models, draftId: number): Promise<Buffer> {
  const row = await models.Draft.findByPk(draftId, { attributes: ['ends', 'picks', 'thumbnail'] });
  if (row?.thumbnail) return row.thumbnail;
  if (!row || row.ends === 0 || row.picks === 0) throw noCloth();
  const current = await models.Draft.findByPk(draftId, { attributes: ['version', 'document'] });
  // Stored documents were parsed on the way in; parsing again fills defaults added since.
  const png = current && thumbnailPng(parseDraft(current.document));
  if (!current || !png) throw noCloth();
  // Kept only if no save came in between; `silent` leaves updatedAt, the library's sort key, alone.
  await models.Draft.update({ thumbnail: png }, { where: { id: draftId, version: current.version }, silent: true });
  return png;
}
