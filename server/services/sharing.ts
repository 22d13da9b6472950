import { Op } from 'sequelize';
import type { ShareLinkResponse, SharedDraftResponse, ShareStatusResponse } from '../../shared/api';
import { notFound } from '../http/errors';
import type { Models } from '../models';
import { newToken, tokenHash } from './tokens';

/** A new public link to the draft; any earlier link stops working, since its token cannot be shown again. */
export async function createShareLink(models: Models, draftId: number, userId: number, publicUrl: string): Promise<ShareLinkResponse> {
  const token = newToken();
  await models.ShareLink.sequelize!.transaction(async (transaction) => {
    await models.ShareLink.update({ revokedAt: new Date() }, { where: { draftId, revokedAt: null }, transaction });
    await models.ShareLink.create({ draftId, createdById: userId, tokenHash: tokenHash(token) }, { transaction });
  });
  return { url: `${publicUrl}/shared/${token}`, token };
}

/** Whether the draft has a live link, and since when. */
export async function shareStatus(models: Models, draftId: number): Promise<ShareStatusResponse> {
  const link = await models.ShareLink.findOne({ where: { draftId, revokedAt: null }, order: [['createdAt', 'DESC']] });
  return { shared: link !== null, createdAt: link?.createdAt.toISOString() ?? null };
}

/** Stops every live link to the draft. */
export async function revokeShareLinks(models: Models, draftId: number): Promise<ShareStatusResponse> {
  await models.ShareLink.update({ revokedAt: new Date() }, { where: { draftId, revokedAt: null } });
  return { shared: false, createdAt: null };
}

/** The draft behind a live link, read-only; 404 for a wrong or revoked token alike. */
export async function sharedDraft(models: Models, token: string): Promise<SharedDraftResponse> {
  const link = await models.ShareLink.findOne({ where: { tokenHash: tokenHash(token), revokedAt: { [Op.is]: null } } });
  const draft = link && await models.Draft.findByPk(link.draftId, {
    attributes: ['name', 'version', 'updatedAt', 'document', 'binnedAt'],
    include: [{ model: models.User, as: 'owner', attributes: ['name'] }],
  });
  if (!draft || draft.binnedAt) throw notFound('This link does not exist or has been withdrawn');
  return {
    draft: { name: draft.name, ownerName: draft.owner?.name ?? '', version: draft.version, updatedAt: draft.updatedAt.toISOString(), document: draft.document },
  };
}
