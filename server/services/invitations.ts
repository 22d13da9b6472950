import { Op } from 'sequelize';
import { roleRank } from '../../shared/api/auth';
import type { AcceptInviteResponse, InviteBody } from '../../shared/api';
import type { Mailer } from '../mail/mailer';
import { HttpError, notFound } from '../http/errors';
import type { Models } from '../models';
import { newToken, tokenHash } from './tokens';

export const INVITATION_TTL_MS = 14 * 24 * 60 * 60 * 1000;

/** Mails a link that joins the studio in `role` (signing up first if need be); only its hash is kept. */
export async function inviteToStudio(
  models: Models, mailer: Mailer, publicUrl: string, studioId: number, invitedById: number, body: InviteBody, now = new Date(),
) {
  const [studio, inviter] = await Promise.all([models.Studio.findByPk(studioId), models.User.findByPk(invitedById)]);
  if (!studio || !inviter) throw notFound('No such studio');
  const token = newToken();
  const expiresAt = new Date(now.getTime() + INVITATION_TTL_MS);
  await models.Invitation.create({ studioId, invitedById, email: body.email, role: body.role, tokenHash: tokenHash(token), expiresAt });
  const link = `${publicUrl}/join?token=${encodeURIComponent(token)}`;
  await mailer.send({
    to: body.email,
    subject: `${inviter.name} invites you to ${studio.name} on Shedwright`,
    text: `Hello,\n\n${inviter.name} invites you to join the studio “${studio.name}” on Shedwright as ${body.role}.\n`
      + `Open this link within 14 days to join (you can make an account there if you have none):\n\n${link}\n\n`
      + 'If you were not expecting this, ignore this mail.\n',
  });
  return { invitation: { email: body.email, role: body.role, expiresAt: expiresAt.toISOString() } };
}

/**
 * Joins the signed-in user to the invitation's studio. The link is the proof: it works once, within
 * its time, for whoever holds it (the mailbox it was sent to). A member keeps the higher of their role
 * and the invited one.
 */
export async function acceptInvitation(models: Models, userId: number, token: string, now = new Date()): Promise<AcceptInviteResponse> {
  const invalid = new HttpError(400, 'bad_request', 'This invitation is invalid, used or expired; ask for a new one');
  return models.Invitation.sequelize!.transaction(async (transaction) => {
    const invite = await models.Invitation.findOne({ where: { tokenHash: tokenHash(token) }, transaction });
    if (!invite) throw invalid;
    // A conditional update claims the invitation, so two requests at once cannot both use it.
    const [claimed] = await models.Invitation.update(
      { acceptedAt: now, acceptedById: userId },
      { where: { id: invite.id, acceptedAt: null, expiresAt: { [Op.gt]: now } }, transaction },
    );
    if (claimed !== 1) throw invalid;
    const studio = await models.Studio.findByPk(invite.studioId, { transaction });
    if (!studio) throw invalid;
    const existing = await models.Membership.findOne({ where: { studioId: studio.id, userId }, transaction });
    let role = invite.role;
    if (!existing) await models.Membership.create({ studioId: studio.id, userId, role }, { transaction });
    else if (roleRank(existing.role) < roleRank(role)) await existing.update({ role }, { transaction });
    else role = existing.role;
    return { studio: { id: studio.id, name: studio.name, role } };
  });
}
