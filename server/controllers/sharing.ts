import type { AcceptInviteBody, InviteBody } from '../../shared/api';
import type { Ctx } from '../http/handler';
import { acceptInvitation, inviteToStudio } from '../services/invitations';
import { createShareLink, revokeShareLinks, sharedDraft, shareStatus } from '../services/sharing';

type Id = { id: number };

export async function share({ app, req, res, params }: Ctx<unknown, unknown, Id>) {
  res.status(201).json(await createShareLink(app.models, params.id, req.user!.id, app.config.publicUrl));
}

export async function status({ app, res, params }: Ctx<unknown, unknown, Id>) {
  res.json(await shareStatus(app.models, params.id));
}

export async function revoke({ app, res, params }: Ctx<unknown, unknown, Id>) {
  res.json(await revokeShareLinks(app.models, params.id));
}

export async function shared({ app, res, params }: Ctx<unknown, unknown, { token: string }>) {
  res.set('Cache-Control', 'no-store');
  res.json(await sharedDraft(app.models, params.token));
}

export async function invite({ app, req, res, params, body }: Ctx<InviteBody, unknown, Id>) {
  res.status(201).json(await inviteToStudio(app.models, app.mailer, app.config.publicUrl, params.id, req.user!.id, body));
}

export async function accept({ app, req, res, body }: Ctx<AcceptInviteBody, unknown, unknown>) {
  res.json(await acceptInvitation(app.models, req.user!, body.token));
}
