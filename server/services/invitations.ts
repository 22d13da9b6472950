import { ROLE_NAMES } from '../../shared/words';
import { Op } from 'sequelize';
import { roleRank } from '../../shared/api/auth';
import type { AcceptInviteResponse, InviteBody } from '../../shared/api';
import type { Mailer } from '../mail/mailer';
import { forbidden, HttpError, notFound } from '../http/errors';
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
    text: `Hello,\n\n${inviter.name} invites you to join the studio “${studio.name}” on Shedwright as ${ROLE_NAMES[body.role].toLowerCase()}.\n`
      + `Open this link within 14 days to join (you can make an account there if you have none):\n\n${link}\n\n`
      + 'If you were not expecting this, ignore this mail.\n',
  });
  return { invitation: { email: body.email, role: body.role, expiresAt: expiresAt.toISOString() } };
}

/**
 * Joins the signed-in user to the invitation's studio. It works once, within its time, and only for
 * the account with the invited e-mail: a forwarded or leaked link admits nobody else, and a refusal
 * leaves the invitation open for the person it was meant for. A member keeps the higher of their
 * role and the invited one.
 */
export async function acceptInvitation(
  models: Models, user: { id: number; email: string }, token: string, now = new Date(),
): Promise<AcceptInviteResponse> {
  const invalid = new HttpError(400, 'bad_request', 'This invitation is invalid, used or expired; ask for a new one');
  const userId = user.id;
  return models.Invitation.sequelize!.transaction(async (transaction) => {
    const invite = await models.Invitation.findOne({ where: { tokenHash: tokenHash(token) }, transaction });
    if (!invite || invite.acceptedAt !== null || invite.expiresAt <= now) throw invalid;
    if (invite.email.toLowerCase() !== user.email.toLowerCase()) {
      throw forbidden('This invitation was sent to another e-mail address. Sign in with the account for that address, '
        + 'or sign up with it, and open the link again.');
    }
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
