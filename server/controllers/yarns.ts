import type { YarnBody, YarnPatch } from '../../shared/api';
import type { Ctx } from '../http/handler';
import { createYarn, deleteYarn, listYarns, updateYarn } from '../services/yarns';

export async function list({ app, req, res }: Ctx<unknown, unknown, unknown>) {
  res.json({ yarns: await listYarns(app.models, req.user!.id) });
}

export async function create({ app, req, res, body }: Ctx<YarnBody, unknown, unknown>) {
  res.status(201).json({ yarn: await createYarn(app.models, req.user!.id, body) });
}

export async function update({ app, req, res, params, body }: Ctx<YarnPatch, unknown, { id: number }>) {
  res.json({ yarn: await updateYarn(app.models, req.user!.id, params.id, body) });
}

export async function remove({ app, req, res, params }: Ctx<unknown, unknown, { id: number }>) {
  await deleteYarn(app.models, req.user!.id, params.id);
  res.status(204).end();
}
