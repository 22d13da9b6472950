/**
 * Plans, loom-side progress and woven results of a draft: request bodies and response shapes.
 */
import { z } from 'zod';
import { planDocumentSchema, type PlanDocument } from '../plan/plan-schema';
import type { Allowances } from '../plan/warp';

/** PUT /api/drafts/:id/plan takes the plan document itself. */
export const planBodySchema = planDocumentSchema;

export interface PlanResponse {
  /** null until someone saves a plan for this draft. */
  plan: PlanDocument | null;
  updatedAt: string | null;
  updatedByName: string | null;
}

export const loomLists = ['threading', 'sleying', 'tieon', 'weaving'] as const;
export type LoomList = (typeof loomLists)[number];

/** The weaver's working order at the loom (see shared/plan/loom-lists.ts for the conventions). */
export const workingOrderSchema = z.object({
  side: z.enum(['front', 'back']),
  direction: z.enum(['right-to-left', 'left-to-right']),
  shaftNumbering: z.enum(['near', 'far']),
});
export type WorkingOrder = z.infer<typeof workingOrderSchema>;

// A warp of 20 000 ends woven 1000 picks long stays well under this.
const MAX_POSITION = 10_000_000;

export const progressBodySchema = z.object({
  list: z.enum(loomLists),
  /** 0-based group (or pick, for weaving) the place marker is on. */
  position: z.number().int().min(0).max(MAX_POSITION),
  settings: workingOrderSchema,
  /**
   * When the weaver moved the marker (ISO time). Saves queued offline arrive late: one older than
   * the saved position is not applied, so a second device's newer place is kept.
   */
  movedAt: z.iso.datetime().optional(),
});
export type ProgressBody = z.infer<typeof progressBodySchema>;

export interface Progress {
  list: LoomList;
  /** The place in each list, so switching lists keeps each one's place. */
  positions: Partial<Record<LoomList, number>>;
  settings: WorkingOrder;
  movedAt: string;
}
export interface ProgressResponse {
  progress: Progress | null;
}

const size = z.number().positive().max(100_000);

/** Sizes as measured, in `unit`. A size can only shrink from one stage to the next. */
export const resultBodySchema = z
  .object({
    unit: z.enum(['inch', 'cm']),
    widthInReed: size,
    lengthOnLoom: size,
    widthOffLoom: size,
    lengthOffLoom: size,
    widthFinished: size.optional(),
    lengthFinished: size.optional(),
    /** As the weaver writes them; taken from the saved plan when left out. */
    warpYarn: z.string().trim().max(100).optional(),
    weftYarn: z.string().trim().max(100).optional(),
    notes: z.string().max(5000).default(''),
  })
  .superRefine((r, ctx) => {
    const notMore = (field: keyof typeof r, after: number | undefined, before: number, what: string) => {
      if (after !== undefined && after > before) ctx.addIssue({ code: 'custom', path: [field], message: `Should not be more than ${what}.` });
    };
    notMore('widthOffLoom', r.widthOffLoom, r.widthInReed, 'the width in the reed');
    notMore('lengthOffLoom', r.lengthOffLoom, r.lengthOnLoom, 'the length on the loom');
    notMore('widthFinished', r.widthFinished, r.widthOffLoom, 'the width off the loom');
    notMore('lengthFinished', r.lengthFinished, r.lengthOffLoom, 'the length off the loom');
    if ((r.widthFinished === undefined) !== (r.lengthFinished === undefined)) {
      ctx.addIssue({ code: 'custom', path: [r.widthFinished === undefined ? 'widthFinished' : 'lengthFinished'], message: 'Give both finished sizes, or neither.' });
    }
  });
export type ResultBody = z.input<typeof resultBodySchema>;
export type ResultInput = z.output<typeof resultBodySchema>;

export interface WeavingResult {
  id: number;
  weaverName: string;
  mine: boolean;
  unit: 'inch' | 'cm';
  widthInReed: number;
  lengthOnLoom: number;
  widthOffLoom: number;
  lengthOffLoom: number;
  widthFinished: number | null;
  lengthFinished: number | null;
  warpYarn: string | null;
  weftYarn: string | null;
  notes: string;
  /** Computed by the server from the sizes (shrinkage only once finished sizes are known). */
  allowances: Partial<Allowances>;
  createdAt: string;
}
export interface ResultsResponse {
  results: WeavingResult[];
}

/** Averages of one weaver's measured allowances, over `results` results. */
export interface MeasuredAllowances {
  allowances: Partial<Allowances>;
  results: number;
}
export interface PlanDefaultsResponse {
  /** Over every result the weaver recorded; null before the first. */
  overall: MeasuredAllowances | null;
  /** Per pair of yarns, keyed by {@link yarnPairKey}. */
  byYarn: (MeasuredAllowances & { key: string; warpYarn: string | null; weftYarn: string | null })[];
}

/**
 * One key for a warp and weft yarn pair, so "8/2 Cotton" and "8/2 cotton " match. Counts are
 * compared as written (after trimming, lower case, single spaces): two notations of one count are
 * different yarns to a weaver anyway.
 */
export function yarnPairKey(warpYarn: string | null | undefined, weftYarn: string | null | undefined): string {
  const norm = (s: string | null | undefined) => (s ?? '').trim().toLowerCase().replace(/\s+/g, ' ');
  return `${norm(warpYarn)}|${norm(weftYarn)}`;
}
