import type { DraftListQuery } from '../../shared/api/drafts';
import type { Ctx } from '../routes/route';
import { draftDetail, listDrafts } from '../services/drafts';

export async function list({ app, req, res, query }: Ctx<unknown, DraftListQuery, unknown>) {
  res.json(await listDrafts(app.models, req.user!.id, query));
}

export async function detail({ app, res, params, role }: Ctx<unknown, unknown, { id: number }>) {
  res.json({ draft: await draftDetail(app.models, params.id, role!) });
}
