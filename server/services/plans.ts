import type { LoomList, PlanDefaultsResponse, PlanResponse, Progress, ProgressBody, ResultInput, WeavingResult } from '../../shared/api/plans';
import { yarnPairKey } from '../../shared/api/plans';
import { computePlan } from '../../shared/plan/compute-plan';
import { planDocumentSchema, type PlanDocument } from '../../shared/plan/plan-schema';
import { measuredAllowances } from '../../shared/plan/results';
import type { Allowances } from '../../shared/plan/warp';
import { parseDraft } from '../../shared/weave/draft';
import { HttpError, notFound } from '../http/errors';
import type { Models } from '../models';
import type { LoomProgressRow } from '../models/loom-progress';
import type { WeavingResultRow } from '../models/weaving-result';

/** The saved plan of a draft, or nulls before the first save. */
export async function getPlan(models: Models, draftId: number): Promise<PlanResponse> {
  const row = await models.DraftPlan.findOne({ where: { draftId }, include: [{ model: models.User, as: 'updatedBy', attributes: ['name'] }] });
  if (!row) return { plan: null, updatedAt: null, updatedByName: null };
  // Re-read through the schema so plans saved before a default was added come back complete.
  return { plan: planDocumentSchema.parse(row.document), updatedAt: row.updatedAt.toISOString(), updatedByName: row.updatedBy?.name ?? null };
}

/**
 * Saves a draft's plan after checking that it can be worked out for the draft as it stands
 * (a colour yarn for a palette entry the draft lacks, or a plan that cannot be computed, is a 422).
 */
export async function savePlan(models: Models, draftId: number, userId: number, plan: PlanDocument): Promise<PlanResponse> {
  const draftRow = await models.Draft.findByPk(draftId, { attributes: ['id', 'document'] });
  if (!draftRow) throw notFound('No such draft');
  const draft = parseDraft(draftRow.document);
  const fields: Record<string, string> = {};
  for (const side of ['warpYarn', 'weftYarn'] as const) {
    for (const key of Object.keys(plan[side].byColor)) {
      if (Number(key) >= draft.palette.length) fields[`${side}.byColor.${key}`] = `The draft has no colour ${Number(key) + 1}.`;
    }
  }
  if (Object.keys(fields).length > 0) throw new HttpError(422, 'unprocessable', 'The plan names colours the draft does not have', fields);
  try {
    computePlan(draft, plan);
  } catch (err) {
    // The arithmetic throws RangeError for inputs it cannot work with (a zero sett, say).
    if (!(err instanceof RangeError)) throw err;
    throw new HttpError(422, 'unprocessable', `This plan cannot be worked out for the draft: ${err.message}`);
  }

  const existing = await models.DraftPlan.findOne({ where: { draftId } });
  if (existing) await existing.update({ document: plan, updatedById: userId });
  else await models.DraftPlan.create({ draftId, document: plan, updatedById: userId });
  return getPlan(models, draftId);
}

function progressOf(row: LoomProgressRow): Progress {
  return { list: row.list, positions: row.positions, settings: row.settings, movedAt: row.movedAt.toISOString() };
}

/** Where this weaver is in the draft's loom-side lists, or null before they start. */
export async function getProgress(models: Models, draftId: number, userId: number): Promise<Progress | null> {
  const row = await models.LoomProgress.findOne({ where: { draftId, userId } });
  return row ? progressOf(row) : null;
}

/**
 * Moves this weaver's place marker. A save whose `movedAt` is older than the stored one (a save
 * queued offline arriving after a newer one from another device) changes nothing, and the stored
 * place is returned so the client can follow it. A time ahead of the server's clock (a device set
 * wrong) counts as now: stored as it came, it would outrank every later move until that time came.
 */
export async function saveProgress(
  models: Models, draftId: number, userId: number, body: ProgressBody, now = new Date(),
): Promise<Progress> {
  const movedAt = body.movedAt && Date.parse(body.movedAt) < now.getTime() ? new Date(body.movedAt) : now;
  return models.LoomProgress.sequelize!.transaction(async (transaction) => {
    const row = await models.LoomProgress.findOne({ where: { draftId, userId }, transaction, lock: transaction.LOCK.UPDATE });
    if (!row) {
      const created = await models.LoomProgress.create(
        { draftId, userId, list: body.list, positions: { [body.list]: body.position }, settings: body.settings, movedAt },
        { transaction },
      );
      return progressOf(created);
    }
    if (movedAt < row.movedAt) return progressOf(row);
    const positions: Partial<Record<LoomList, number>> = { ...row.positions, [body.list]: body.position };
    await row.update({ list: body.list, positions, settings: body.settings, movedAt }, { transaction });
    return progressOf(row);
  });
}

function resultOf(row: WeavingResultRow, userId: number): WeavingResult {
  return {
    id: row.id,
    weaverName: row.weaver?.name ?? '',
    mine: row.userId === userId,
    unit: row.unit,
    widthInReed: row.widthInReed,
    lengthOnLoom: row.lengthOnLoom,
    widthOffLoom: row.widthOffLoom,
    lengthOffLoom: row.lengthOffLoom,
    widthFinished: row.widthFinished,
    lengthFinished: row.lengthFinished,
    warpYarn: row.warpYarn,
    weftYarn: row.weftYarn,
    notes: row.notes,
    allowances: row.allowances,
    createdAt: row.createdAt.toISOString(),
  };
}

/** Every result recorded for a draft, newest first, with who wove it. */
export async function listResults(models: Models, draftId: number, userId: number): Promise<WeavingResult[]> {
  const rows = await models.WeavingResult.findAll({
    where: { draftId },
    include: [{ model: models.User, as: 'weaver', attributes: ['name'] }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
  });
  return rows.map((r) => resultOf(r, userId));
}

/**
 * Records what came off the loom and the take-up, draw-in and shrinkage they give (shared/plan
 * results). Yarns not given are taken from the draft's saved plan, so results can be matched to
 * the next plan that uses the same yarns.
 */
export async function addResult(models: Models, draftId: number, userId: number, body: ResultInput): Promise<WeavingResult> {
  const plan = (await getPlan(models, draftId)).plan;
  const warpYarn = body.warpYarn || plan?.warpYarn.text || null;
  const weftYarn = body.weftYarn || plan?.weftYarn.text || null;
  const allowances = measuredAllowances(body);
  const row = await models.WeavingResult.create({
    draftId,
    userId,
    unit: body.unit,
    widthInReed: body.widthInReed,
    lengthOnLoom: body.lengthOnLoom,
    widthOffLoom: body.widthOffLoom,
    lengthOffLoom: body.lengthOffLoom,
    widthFinished: body.widthFinished ?? null,
    lengthFinished: body.lengthFinished ?? null,
    warpYarn,
    weftYarn,
    yarnKey: yarnPairKey(warpYarn, weftYarn),
    allowances,
    notes: body.notes,
  });
  const weaver = await models.User.findByPk(userId, { attributes: ['name'] });
  return { ...resultOf(row, userId), weaverName: weaver?.name ?? '' };
}

const ALLOWANCE_KEYS = ['takeUp', 'drawIn', 'lengthShrinkage', 'widthShrinkage'] as const satisfies readonly (keyof Allowances)[];

/** The mean of each allowance over the results that measured it. */
export function averageAllowances(list: readonly Partial<Allowances>[]): Partial<Allowances> {
  const out: Partial<Allowances> = {};
  for (const key of ALLOWANCE_KEYS) {
    const values = list.map((a) => a[key]).filter((v): v is number => typeof v === 'number');
    if (values.length > 0) out[key] = values.reduce((a, b) => a + b, 0) / values.length;
  }
  return out;
}

/** This weaver's measured allowances over all their results, and per pair of yarns. */
export async function planDefaults(models: Models, userId: number): Promise<PlanDefaultsResponse> {
  const rows = await models.WeavingResult.findAll({ where: { userId }, attributes: ['warpYarn', 'weftYarn', 'yarnKey', 'allowances'] });
  if (rows.length === 0) return { overall: null, byYarn: [] };
  const groups = new Map<string, WeavingResultRow[]>();
  for (const r of rows) groups.set(r.yarnKey, [...(groups.get(r.yarnKey) ?? []), r]);
  return {
    overall: { allowances: averageAllowances(rows.map((r) => r.allowances)), results: rows.length },
    byYarn: [...groups].map(([key, list]) => ({
      key,
      warpYarn: list[0].warpYarn,
      weftYarn: list[0].weftYarn,
      allowances: averageAllowances(list.map((r) => r.allowances)),
      results: list.length,
    })),
  };
}
