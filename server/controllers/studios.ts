import type { CreateStudioBody, MemberRoleBody } from '../../shared/api/studios';
import type { Ctx } from '../http/handler';
import { createStudio, listStudios, removeMember, setMemberRole, studioDetail } from '../services/studios';

export interface StudioParams { id: number }
export interface MemberParams { id: number; userId: number }

export async function list({ app, req, res }: Ctx<unknown, unknown, unknown>) {
  res.json({ studios: await listStudios(app.models, req.user!.id) });
}

export async function create({ app, req, res, body }: Ctx<CreateStudioBody, unknown, unknown>) {
  res.status(201).json({ studio: await createStudio(app.models, req.user!.id, body.name) });
}

export async function detail({ app, res, params, role }: Ctx<unknown, unknown, StudioParams>) {
  res.json(await studioDetail(app.models, params.id, role!));
}

export async function changeRole({ app, res, params, body }: Ctx<MemberRoleBody, unknown, MemberParams>) {
  res.json({ members: await setMemberRole(app.models, params.id, params.userId, body.role) });
}

export async function remove({ app, res, params }: Ctx<unknown, unknown, MemberParams>) {
  res.json({ members: await removeMember(app.models, params.id, params.userId) });
}
