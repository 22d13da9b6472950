import type { ProgressBody, ResultInput } from '../../shared/api/plans';
import type { PlanDocument } from '../../shared/plan/plan-schema';
import type { Ctx } from '../http/handler';
import * as plans from '../services/plans';

type Id = { id: number };

export async function getPlan({ app, res, params }: Ctx<unknown, unknown, Id>) {
  res.json(await plans.getPlan(app.models, params.id));
}

export async function savePlan({ app, req, res, params, body }: Ctx<PlanDocument, unknown, Id>) {
  res.json(await plans.savePlan(app.models, params.id, req.user!.id, body));
}

export async function getProgress({ app, req, res, params }: Ctx<unknown, unknown, Id>) {
  res.json({ progress: await plans.getProgress(app.models, params.id, req.user!.id) });
}

export async function saveProgress({ app, req, res, params, body }: Ctx<ProgressBody, unknown, Id>) {
  res.json({ progress: await plans.saveProgress(app.models, params.id, req.user!.id, body) });
}

export async function listResults({ app, req, res, params }: Ctx<unknown, unknown, Id>) {
  res.json({ results: await plans.listResults(app.models, params.id, req.user!.id) });
}

export async function addResult({ app, req, res, params, body }: Ctx<ResultInput, unknown, Id>) {
  res.status(201).json({ result: await plans.addResult(app.models, params.id, req.user!.id, body) });
}

export async function planDefaults({ app, req, res }: Ctx<unknown, unknown, unknown>) {
  res.json(await plans.planDefaults(app.models, req.user!.id));
}
