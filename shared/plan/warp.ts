/**
 * Warp and weft quantities. All lengths are in the plan's unit (inch or cm) unless a name says
 * otherwise; setts are per that unit. Formulas (allowances as fractions, 0.1 = 10 %):
 *
 *   off-loom length  = on-loom length × (1 − take-up)
 *   finished length  = off-loom length × (1 − shrinkage)
 *   so on-loom (woven) length per piece = (finished + hems) ÷ ((1 − take-up)(1 − shrinkage)),
 *   and width in reed = finished width ÷ ((1 − draw-in)(1 − width shrinkage)).
 *   warp length = pieces × (woven per piece + fringe) + samples + loom waste
 *   weft length = picks per unit × woven length × width in reed × (1 + weft allowance)
 *
 * Shrinkage divides rather than adds: 10" finished at 20 % needs 12.5" woven, not 12".
 */
import type { Draft, LengthUnit } from '../weave/types';
import { pickCount } from '../weave/drawdown';
import { GRAMS_PER_OUNCE, KG_PER_POUND, METRES_PER_YARD, convertDensity, convertLength, metresToYards, toMetres } from './units';
import { massKg } from './yarn';

export type LoomType = 'table' | 'floor';

/** Loom waste by loom type, in inches (common practice: about 18" on a table loom, 24–36" on a floor loom). */
export const LOOM_WASTE_INCHES: Record<LoomType, number> = { table: 18, floor: 27 };

/** Fractions lost along the warp (length) and across it (width). */
export interface Allowances {
  /** Length lost to interlacing, on the loom → off the loom. */
  takeUp: number;
  /** Width lost to interlacing, in the reed → off the loom. */
  drawIn: number;
  /** Length lost in wet finishing. */
  lengthShrinkage: number;
  /** Width lost in wet finishing. */
  widthShrinkage: number;
}

/** Common practice when the weaver has no sample yet: 10 % each (take-up 5–15 %, shrinkage 5–20 % by fibre). */
export const DEFAULT_ALLOWANCES: Allowances = { takeUp: 0.1, drawIn: 0.1, lengthShrinkage: 0.1, widthShrinkage: 0.1 };

/** Weft per pick ≈ width in reed + 10 % (common practice). */
export const DEFAULT_WEFT_ALLOWANCE = 0.1;

/** The loom waste default in the plan's unit. */
export function defaultLoomWaste(loom: LoomType, unit: LengthUnit): number {
  return convertLength(LOOM_WASTE_INCHES[loom], 'inch', unit);
}

/** Size before a loss of `rate`: finished ÷ (1 − rate). @example beforeLoss(10, 0.2) // 12.5 */
export function beforeLoss(after: number, rate: number): number {
  if (!(rate >= 0 && rate < 1)) throw new RangeError(`A loss rate must be at least 0 and below 1, got ${rate}.`);
  return after / (1 - rate);
}

/** Width to set in the reed for a finished width. */
export function widthInReedFor(finishedWidth: number, a: Allowances): number {
  return beforeLoss(beforeLoss(finishedWidth, a.widthShrinkage), a.drawIn);
}

/** Length to weave on the loom (measured under tension) for a finished length. */
export function wovenLengthFor(finishedLength: number, a: Allowances): number {
  return beforeLoss(beforeLoss(finishedLength, a.lengthShrinkage), a.takeUp);
}

/**
 * The finished size a cloth of this size on the loom gives: the other way round from
 * `widthInReedFor` and `wovenLengthFor`. @example finishedFromLoom(14, 24, a) // { width: 12, length: 19 } with a piece's measured allowances
 */
export function finishedFromLoom(widthInReed: number, wovenLength: number, a: Allowances): { width: number; length: number } {
  return {
    width: widthInReed * (1 - a.drawIn) * (1 - a.widthShrinkage),
    length: wovenLength * (1 - a.takeUp) * (1 - a.lengthShrinkage),
  };
}

/**
 * Where a plan's size comes from: the finished size wanted, the size on the loom (width in the
 * reed and length to weave, per piece), or the draft itself when it is a whole design (a mat, a
 * panel) whose ends and picks are the cloth.
 */
export type PlanSize = { from: 'finished' } | { from: 'loom'; widthInReed: number; wovenLength: number } | { from: 'draft' };

export type EndRounding = 'nearest' | 'up' | 'down';

export interface EndCountInput {
  widthInReed: number;
  sett: number;
  /** Ends in one repeat of the threading; the body is a whole number of repeats. */
  repeatEnds: number;
  rounding: EndRounding;
  /** Ends from the start of the repeat added after the last repeat so the pattern ends as it began. */
  balanceEnds: number;
  selvedgeEndsPerSide: number;
}

export interface EndCount {
  repeats: number;
  bodyEnds: number;
  totalEnds: number;
}

/** Ends for a width: whole repeats (at least one) + balancing ends + selvedges. */
export function endCount(input: EndCountInput): EndCount {
  const exact = (input.widthInReed * input.sett - input.balanceEnds) / input.repeatEnds;
  const round = input.rounding === 'up' ? Math.ceil : input.rounding === 'down' ? Math.floor : Math.round;
  // Snap 47.999999 (from unit conversions) to 48 so rounding down does not lose a repeat.
  const snapped = Math.abs(exact - Math.round(exact)) < 1e-9 ? Math.round(exact) : exact;
  const repeats = Math.max(1, round(snapped));
  const bodyEnds = repeats * input.repeatEnds + input.balanceEnds;
  return { repeats, bodyEnds, totalEnds: bodyEnds + 2 * input.selvedgeEndsPerSide };
}

export interface WarpEnd {
  /** 1-based number across the whole warp, from the side where the draft's end 1 is. */
  end: number;
  /** 0-based index into the draft's threading this end repeats. */
  draftIndex: number;
  shafts: readonly number[];
  color: number;
  layer: number;
  selvedge: boolean;
}

/**
 * Every end of the warp: the draft's threading and colour order repeated over the body, with the
 * selvedge ends continuing the same order outwards on both sides.
 */
export function expandWarp(draft: Draft, ends: EndCount, selvedgeEndsPerSide: number): WarpEnd[] {
  const n = draft.threading.length;
  if (n === 0) return [];
  const out: WarpEnd[] = [];
  for (let i = -selvedgeEndsPerSide; i < ends.bodyEnds + selvedgeEndsPerSide; i++) {
    const draftIndex = ((i % n) + n) % n;
    out.push({
      end: out.length + 1,
      draftIndex,
      shafts: draft.threading[draftIndex],
      color: draft.warpColors[draftIndex] ?? 0,
      layer: draft.warpLayers[draftIndex] ?? 1,
      selvedge: i < 0 || i >= ends.bodyEnds,
    });
  }
  return out;
}

/** How yarn is bought: skeins or cones of a length or a weight. */
export type PackageSize = { length: number; unit: 'm' | 'yd' } | { mass: number; unit: 'g' | 'oz' | 'kg' | 'lb' };

/** Yarn length per mass (m/kg) by palette colour, with a default for colours not listed. */
export interface YarnChoice {
  metresPerKg: number;
  byColor?: Record<number, number>;
}

export interface YarnAmount {
  color: number;
  /** Ends (warp) or picks in one repeat of the pick order (weft) of this colour. */
  threads: number;
  metres: number;
  yards: number;
  /** Weights are left out until the yarn's count is known. */
  grams?: number;
  pounds?: number;
  /** Whole skeins or cones, when a package size was given (and the count, for packages sold by weight). */
  packages?: number;
}

/** Whole packages for a length of yarn. */
export function packagesFor(metres: number, metresPerKg: number, size: PackageSize): number {
  const need =
    'length' in size
      ? metres / (size.unit === 'm' ? size.length : size.length * METRES_PER_YARD)
      : (massKg(metres, metresPerKg) * 1000) /
        (size.mass * { g: 1, oz: GRAMS_PER_OUNCE, kg: 1000, lb: KG_PER_POUND * 1000 }[size.unit]);
  // Tolerate float noise so exactly two skeins' worth is not three.
  return Math.ceil(need - 1e-9);
}

function amount(color: number, threads: number, metres: number, yarn?: YarnChoice, size?: PackageSize): YarnAmount {
  const perKg = yarn ? (yarn.byColor?.[color] ?? yarn.metresPerKg) : undefined;
  const out: YarnAmount = { color, threads, metres, yards: metresToYards(metres) };
  if (perKg !== undefined) {
    const kg = massKg(metres, perKg);
    out.grams = kg * 1000;
    out.pounds = kg / KG_PER_POUND;
  }
  if (size && (perKg !== undefined || 'length' in size)) out.packages = packagesFor(metres, perKg ?? NaN, size);
  return out;
}

/** Sizes of the bouts when the warp is wound `boutEnds` ends at a time (the last may be smaller). */
export function boutSizes(totalEnds: number, boutEnds: number): number[] {
  if (!(boutEnds >= 1)) throw new RangeError('A bout needs at least one end.');
  const sizes: number[] = [];
  for (let left = totalEnds; left > 0; left -= boutEnds) sizes.push(Math.min(boutEnds, left));
  return sizes;
}

export interface WarpPlanInput {
  unit: LengthUnit;
  finishedWidth: number;
  /** Per piece. */
  finishedLength: number;
  pieces: number;
  /** Hem allowance per piece (both ends together), woven, in finished size. */
  hems: number;
  /** Unwoven warp per piece for fringe or the gap between pieces (both ends together). */
  fringe: number;
  /** Extra length woven for samples, measured on the loom. */
  samples: number;
  allowances: Allowances;
  loomWaste: number;
  /** Ends per unit; the draft's sett when omitted. */
  sett?: number;
  /** Picks per unit; the draft's when omitted. */
  picksPerUnit?: number;
  /** Ends in one threading repeat; the draft's threading length when omitted. */
  repeatEnds?: number;
  rounding: EndRounding;
  balanceEnds: number;
  selvedgeEndsPerSide: number;
  weftAllowance: number;
  warpYarn?: YarnChoice;
  weftYarn?: YarnChoice;
  packageSize?: PackageSize;
  boutEnds?: number;
  /** The finished size by default. */
  size?: PlanSize;
}

/**
 * How the picks to weave come about, so every count shown can say why it differs from the draft's:
 * `total` = `pieces` × `perPiece` + `samplePicks`.
 */
export interface PickCount {
  /** Picks in the draft. */
  draft: number;
  /** True when the draft is a whole design: each piece weaves the draft's picks (and its hems). */
  whole: boolean;
  /** Picks woven for one piece. */
  perPiece: number;
  /** In a whole design, picks each piece adds for its hems. */
  hemPicks: number;
  pieces: number;
  samplePicks: number;
  total: number;
}

export interface WarpPlan {
  unit: LengthUnit;
  sett: number;
  picksPerUnit: number;
  /** Width the finished size asks for. */
  targetWidthInReed: number;
  /** Width the rounded end count really fills. */
  widthInReed: number;
  ends: EndCount;
  wovenLengthPerPiece: number;
  /** Woven length of all pieces and samples, on the loom. */
  wovenLength: number;
  warpLength: number;
  /** The finished size these give: the weaver's own when the plan starts from it. */
  finished: { width: number; length: number };
  totalPicks: number;
  picks: PickCount;
  weftLength: number;
  warpByColor: YarnAmount[];
  weftByColor: YarnAmount[];
  bouts?: number[];
}

/**
 * The whole warp and weft plan for a draft. Weft colours are shared out in the proportion of the
 * draft's pick colour order.
 *
 * @example computeWarpPlan(draft, { ...inputs, finishedWidth: 48 }).ends.totalEnds
 */
export function computeWarpPlan(draft: Draft, input: WarpPlanInput): WarpPlan {
  const { unit } = input;
  const sett = input.sett ?? convertDensity(draft.sett.warp, draft.sett.unit, unit);
  const picksPerUnit = input.picksPerUnit ?? convertDensity(draft.sett.weft, draft.sett.unit, unit);
  if (!(sett > 0)) throw new RangeError('The sett must be above zero.');
  const repeatEnds = input.repeatEnds ?? Math.max(1, draft.threading.length);

  const size = input.size ?? { from: 'finished' };
  const draftPicks = pickCount(draft);
  const whole = size.from === 'draft';
  const targetWidthInReed = whole
    ? (draft.threading.length + 2 * input.selvedgeEndsPerSide) / sett
    : size.from === 'loom'
      ? size.widthInReed
      : widthInReedFor(input.finishedWidth, input.allowances);
  const ends = whole
    ? { repeats: 1, bodyEnds: draft.threading.length, totalEnds: draft.threading.length + 2 * input.selvedgeEndsPerSide }
    : endCount({
        widthInReed: targetWidthInReed,
        sett,
        repeatEnds,
        rounding: input.rounding,
        balanceEnds: input.balanceEnds,
        selvedgeEndsPerSide: input.selvedgeEndsPerSide,
      });
  const widthInReed = ends.totalEnds / sett;
  // Whole numbers of picks, tolerating float noise so 24.000000001 picks is not 25.
  const picksFor = (length: number) => Math.ceil(picksPerUnit * length - 1e-9);
  const hemPicks = whole ? picksFor(wovenLengthFor(input.hems, input.allowances)) : 0;
  const wovenLengthPerPiece = whole
    ? (draftPicks + hemPicks) / picksPerUnit
    : size.from === 'loom'
      ? size.wovenLength
      : wovenLengthFor(input.finishedLength + input.hems, input.allowances);
  const wovenLength = input.pieces * wovenLengthPerPiece + input.samples;
  const warpLength = input.pieces * (wovenLengthPerPiece + input.fringe) + input.samples + input.loomWaste;
  const perPiece = whole ? draftPicks + hemPicks : picksFor(wovenLengthPerPiece);
  const samplePicks = picksFor(input.samples);
  const picks: PickCount = { draft: draftPicks, whole, perPiece, hemPicks, pieces: input.pieces, samplePicks, total: input.pieces * perPiece + samplePicks };
  const totalPicks = picks.total;
  const weftLength = picksPerUnit * wovenLength * widthInReed * (1 + input.weftAllowance);
  const finished =
    size.from === 'finished'
      ? { width: input.finishedWidth, length: input.finishedLength }
      : finishedFromLoom(targetWidthInReed, wovenLengthPerPiece, input.allowances);

  const warpCounts = new Map<number, number>();
  for (const e of expandWarp(draft, ends, input.selvedgeEndsPerSide)) {
    warpCounts.set(e.color, (warpCounts.get(e.color) ?? 0) + 1);
  }
  const warpMetresPerEnd = toMetres(warpLength, unit);
  const warpByColor = [...warpCounts]
    .sort((a, b) => a[0] - b[0])
    .map(([color, n]) => amount(color, n, n * warpMetresPerEnd, input.warpYarn, input.packageSize));

  const weftCounts = new Map<number, number>();
  for (let p = 0; p < draftPicks; p++) {
    const c = draft.weftColors[p] ?? 0;
    weftCounts.set(c, (weftCounts.get(c) ?? 0) + 1);
  }
  const weftMetres = toMetres(weftLength, unit);
  const weftByColor = [...weftCounts]
    .sort((a, b) => a[0] - b[0])
    .map(([color, n]) => amount(color, n, (weftMetres * n) / draftPicks, input.weftYarn, input.packageSize));

  return {
    unit,
    sett,
    picksPerUnit,
    targetWidthInReed,
    widthInReed,
    ends,
    wovenLengthPerPiece,
    wovenLength,
    warpLength,
    finished,
    totalPicks,
    picks,
    weftLength,
    warpByColor,
    weftByColor,
    ...(input.boutEnds ? { bouts: boutSizes(ends.totalEnds, input.boutEnds) } : {}),
  };
}
