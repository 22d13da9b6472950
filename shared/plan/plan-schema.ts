/**
 * The saved plan of a draft: the weaver's inputs only. Every output (ends, lengths, yarn amounts,
 * loom-side lists) is recomputed from these and the draft, so a saved plan never goes stale.
 * Defaults are common practice and marked where they are set (warp.ts, sett.ts, reed.ts).
 */
import { z } from 'zod';
import type { Draft, LengthUnit } from '../weave/types';
import { DEFAULT_ALLOWANCES, DEFAULT_WEFT_ALLOWANCE, defaultLoomWaste, type PlanSize, type WarpPlanInput, type YarnChoice } from './warp';
import { parseYarn } from './yarn';
import { DEFAULT_ORIENTATION } from './loom-lists';
import { WEAVES } from './sett';

export const PLAN_SCHEMA_VERSION = 1;

const rate = z.number().min(0).lt(1);
const positive = z.number().positive();
const nonNegative = z.number().min(0);
const count = z.number().int().min(0);

/** A yarn as the weaver writes it ("8/2 cotton"); it must read as a count, not as wraps. */
const yarnText = z
  .string()
  .trim()
  .min(1)
  .superRefine((text, ctx) => {
    const r = parseYarn(text);
    if (!r.ok) ctx.addIssue({ code: 'custom', message: r.error });
    else if (r.yarn.kind !== 'count') ctx.addIssue({ code: 'custom', message: 'Give the yarn count; wraps per inch go in the sett guide.' });
  });

const yarnSchema = z.object({
  /** Yarn for colours not listed below. */
  text: yarnText.optional(),
  /** Palette index → yarn, for colours spun differently. */
  byColor: z.record(z.string().regex(/^\d+$/), yarnText).default({}),
});

const packageSchema = z.union([
  z.object({ length: positive, unit: z.enum(['m', 'yd']) }),
  z.object({ mass: positive, unit: z.enum(['g', 'oz', 'kg', 'lb']) }),
]);

export const planDocumentSchema = z.object({
  schemaVersion: z.literal(PLAN_SCHEMA_VERSION).default(PLAN_SCHEMA_VERSION),
  unit: z.enum(['inch', 'cm']).default('inch'),
  loom: z.enum(['table', 'floor']).default('floor'),
  /**
   * What the size starts from: the finished size, the size on the loom (`onLoom`), or the draft
   * itself as a whole design. Absent: the draft for a block design (its blocks are the cloth),
   * else the finished size.
   */
  sizeFrom: z.enum(['finished', 'loom', 'draft']).optional(),
  /** Used when the finished size is what the weaver gives; kept when the plan starts elsewhere. */
  finishedWidth: positive,
  finishedLength: positive,
  /** Width in the reed and length to weave per piece, when the plan starts from the loom. */
  onLoom: z.object({ widthInReed: positive, wovenLength: positive }).optional(),
  pieces: z.number().int().min(1).default(1),
  hems: nonNegative.default(0),
  fringe: nonNegative.default(0),
  samples: nonNegative.default(0),
  allowances: z
    .object({
      takeUp: rate.default(DEFAULT_ALLOWANCES.takeUp),
      drawIn: rate.default(DEFAULT_ALLOWANCES.drawIn),
      lengthShrinkage: rate.default(DEFAULT_ALLOWANCES.lengthShrinkage),
      widthShrinkage: rate.default(DEFAULT_ALLOWANCES.widthShrinkage),
    })
    .prefault({}),
  /** In the plan's unit; the loom type's default when absent. */
  loomWaste: nonNegative.optional(),
  weftAllowance: nonNegative.default(DEFAULT_WEFT_ALLOWANCE),
  /** Sett guide inputs: the weave the yarn is set for and the number of layers. */
  weave: z.enum(Object.keys(WEAVES) as [keyof typeof WEAVES, ...(keyof typeof WEAVES)[]]).default('plain'),
  layers: z.number().int().min(1).max(4).default(1),
  wrapsPerInch: positive.optional(),
  /** Ends and picks per unit; the draft's when absent. */
  sett: positive.optional(),
  picksPerUnit: positive.optional(),
  // A 12-dent reed is a common first reed (common practice).
  reed: z.object({ dents: positive, per: z.enum(['inch', 'cm', '10cm']) }).default({ dents: 12, per: 'inch' }),
  /** Width of the reed's dented part, in the plan's unit: with it the sleying starts where the warp sits centred. */
  reedWidth: positive.optional(),
  /** Ends per dent, repeating; planned from the sett when absent. */
  denting: z.array(count).min(1).refine((p) => p.some((n) => n > 0), 'A denting needs at least one end.').optional(),
  repeatEnds: z.number().int().min(1).optional(),
  rounding: z.enum(['nearest', 'up', 'down']).default('nearest'),
  balanceEnds: count.default(0),
  // No extra selvedge ends unless the weaver asks; they continue the threading when added.
  selvedgeEndsPerSide: count.default(0),
  warpYarn: yarnSchema.prefault({}),
  weftYarn: yarnSchema.prefault({}),
  packageSize: packageSchema.optional(),
  boutEnds: z.number().int().min(1).optional(),
  lists: z
    .object({
      side: z.enum(['front', 'back']).default(DEFAULT_ORIENTATION.side),
      direction: z.enum(['right-to-left', 'left-to-right']).default(DEFAULT_ORIENTATION.direction),
      shaftNumbering: z.enum(['near', 'far']).default(DEFAULT_ORIENTATION.shaftNumbering),
      /** Kept so stored plans still read; end 1's side now comes from the draft's arrangement. */
      endOneAt: z.enum(['right', 'left']).default(DEFAULT_ORIENTATION.endOneAt),
      /** Ends per threading group; about an inch (2.5 cm) of ends when absent. */
      groupSize: z.number().int().min(1).optional(),
      dentsPerGroup: z.number().int().min(1).optional(),
      /** Ends per tie-on bundle; TIE_ON_ENDS when absent. */
      tieOnEnds: z.number().int().min(1).optional(),
      layerRule: z.boolean().default(false),
      layerOrder: z.array(z.number().int().min(1)).min(1).optional(),
      flipEvery: z.number().int().min(1).optional(),
    })
    .prefault({}),
  notes: z.string().max(20_000).default(''),
}).superRefine((doc, ctx) => {
  if (doc.sizeFrom === 'loom' && !doc.onLoom) ctx.addIssue({ code: 'custom', path: ['onLoom'], message: 'Give the width in the reed and the length to weave.' });
});

/** A saved plan with every default filled in. */
export type PlanDocument = z.output<typeof planDocumentSchema>;
/** A plan as sent or stored, defaults optional. */
export type PlanDocumentInput = z.input<typeof planDocumentSchema>;

/** A new plan for a scarf-sized cloth in the chosen unit (10" × 72", or 25 × 180 cm). */
export function defaultPlan(unit: LengthUnit = 'inch'): PlanDocument {
  return planDocumentSchema.parse(
    unit === 'inch' ? { unit, finishedWidth: 10, finishedLength: 72 } : { unit, finishedWidth: 25, finishedLength: 180 },
  );
}

function yarnChoice(y: PlanDocument['warpYarn']): YarnChoice | undefined {
  const perKg = (text: string) => {
    const r = parseYarn(text);
    return r.ok && r.yarn.kind === 'count' ? r.yarn.metresPerKg : undefined;
  };
  const base = y.text === undefined ? undefined : perKg(y.text);
  if (base === undefined) return undefined;
  const byColor: Record<number, number> = {};
  for (const [k, text] of Object.entries(y.byColor)) {
    const v = perKg(text);
    if (v !== undefined) byColor[Number(k)] = v;
  }
  return { metresPerKg: base, byColor };
}

/** Where the plan's size comes from for this draft (see `sizeFrom`). */
export function planSize(doc: PlanDocument, draft: Draft): PlanSize {
  const from = doc.sizeFrom ?? (draft.blocks ? 'draft' : 'finished');
  if (from === 'loom' && doc.onLoom) return { from, ...doc.onLoom };
  return { from: from === 'draft' ? 'draft' : 'finished' };
}

/** The warp-plan inputs a saved plan stands for, with its draft's threading as the repeat. */
export function warpPlanInput(doc: PlanDocument, draft: Draft): WarpPlanInput {
  return {
    size: planSize(doc, draft),
    unit: doc.unit,
    finishedWidth: doc.finishedWidth,
    finishedLength: doc.finishedLength,
    pieces: doc.pieces,
    hems: doc.hems,
    fringe: doc.fringe,
    samples: doc.samples,
    allowances: doc.allowances,
    loomWaste: doc.loomWaste ?? defaultLoomWaste(doc.loom, doc.unit),
    rounding: doc.rounding,
    balanceEnds: doc.balanceEnds,
    selvedgeEndsPerSide: doc.selvedgeEndsPerSide,
    weftAllowance: doc.weftAllowance,
    repeatEnds: doc.repeatEnds ?? Math.max(1, draft.threading.length),
    sett: doc.sett,
    picksPerUnit: doc.picksPerUnit,
    warpYarn: yarnChoice(doc.warpYarn),
    weftYarn: yarnChoice(doc.weftYarn),
    packageSize: doc.packageSize,
    boutEnds: doc.boutEnds,
  };
}
