/**
 * Yarn count systems. Every count is normalised to metres per kilogram (m/kg), the length-per-mass
 * from which all the others follow. Definitions: ASTM D2260 Table 1 and ISO 1144 (tex).
 */
import { CM_PER_INCH, KG_PER_POUND, METRES_PER_YARD } from './units';

export type CountSystem = 'tex' | 'denier' | 'nm' | 'ne' | 'lea' | 'worsted' | 'run' | 'ydPerLb' | 'mPerKg';

export const COUNT_SYSTEMS: readonly CountSystem[] = [
  'tex',
  'denier',
  'nm',
  'ne',
  'lea',
  'worsted',
  'run',
  'ydPerLb',
  'mPerKg',
];

/** yd/lb expressed in m/kg: 1 yd/lb = 0.9144 / 0.45359237 m/kg. */
const M_PER_KG_PER_YD_PER_LB = METRES_PER_YARD / KG_PER_POUND;

/**
 * Direct systems give mass per length (bigger = thicker), indirect ones length per mass
 * (bigger = finer). For indirect systems `perUnit` is the m/kg of count 1; for direct systems
 * it is the m/kg of count 1 too, but the count divides it instead of multiplying.
 */
const SYSTEMS: Record<CountSystem, { direct: boolean; perUnit: number; label: string }> = {
  tex: { direct: true, perUnit: 1e6, label: 'tex' }, // g per 1000 m
  denier: { direct: true, perUnit: 9e6, label: 'denier' }, // g per 9000 m
  nm: { direct: false, perUnit: 1000, label: 'Nm' }, // km per kg
  ne: { direct: false, perUnit: 840 * M_PER_KG_PER_YD_PER_LB, label: 'cotton count (Ne)' }, // 840-yd hanks per lb
  lea: { direct: false, perUnit: 300 * M_PER_KG_PER_YD_PER_LB, label: 'linen lea' }, // 300-yd leas per lb
  worsted: { direct: false, perUnit: 560 * M_PER_KG_PER_YD_PER_LB, label: 'worsted count' }, // 560-yd hanks per lb
  run: { direct: false, perUnit: 1600 * M_PER_KG_PER_YD_PER_LB, label: 'woollen run' }, // 1600-yd runs per lb
  ydPerLb: { direct: false, perUnit: M_PER_KG_PER_YD_PER_LB, label: 'yd/lb' },
  mPerKg: { direct: false, perUnit: 1, label: 'm/kg' },
};

/** The plain-English name of a count system. */
export function countSystemLabel(system: CountSystem): string {
  return SYSTEMS[system].label;
}

/** True for systems where a bigger number means a thicker yarn (tex, denier). */
export function isDirectSystem(system: CountSystem): boolean {
  return SYSTEMS[system].direct;
}

/** A count in `system` → metres per kilogram. @example toMetresPerKg('nm', 28) // 28000 */
export function toMetresPerKg(system: CountSystem, count: number): number {
  const { direct, perUnit } = SYSTEMS[system];
  return direct ? perUnit / count : perUnit * count;
}

/** Metres per kilogram → a count in `system`. */
export function fromMetresPerKg(system: CountSystem, metresPerKg: number): number {
  const { direct, perUnit } = SYSTEMS[system];
  return direct ? perUnit / metresPerKg : metresPerKg / perUnit;
}

/** Converts a count between systems. @example convertCount(10, 'ne', 'worsted') // 15 */
export function convertCount(count: number, from: CountSystem, to: CountSystem): number {
  return fromMetresPerKg(to, toMetresPerKg(from, count));
}

/** The same yarn in every system, for showing side by side. */
export function allCounts(metresPerKg: number): Record<CountSystem, number> {
  const out = {} as Record<CountSystem, number>;
  for (const s of COUNT_SYSTEMS) out[s] = fromMetresPerKg(s, metresPerKg);
  return out;
}

/**
 * The resultant count of `plies` singles of count `size` twisted together, in the same system.
 * Twist contraction is ignored, as the trade's nominal counts do: 8/2 cotton is quoted as Ne 4.
 */
export function pliedCount(system: CountSystem, size: number, plies: number): number {
  return isDirectSystem(system) ? size * plies : size / plies;
}

/** Kilograms of yarn for a length in metres. */
export function massKg(metres: number, metresPerKg: number): number {
  return metres / metresPerKg;
}

export type PlyOrder = 'size-first' | 'plies-first';

export type ParsedYarn =
  | {
      kind: 'count';
      system: CountSystem;
      /** The singles count as written. */
      size: number;
      plies: number;
      /** The resultant count in `system`. */
      count: number;
      metresPerKg: number;
    }
  | { kind: 'wraps'; wrapsPerInch: number };

export type ParseYarnResult = { ok: true; yarn: ParsedYarn } | { ok: false; error: string };

type Keyword = CountSystem | 'wpi' | 'wpcm' | 'mPerG';

// Words a weaver writes beside the number. Keys are lower case with single spaces.
const KEYWORDS: Record<string, Keyword> = {
  tex: 'tex',
  denier: 'denier',
  den: 'denier',
  d: 'denier',
  nm: 'nm',
  metric: 'nm',
  'metric count': 'nm',
  ne: 'ne',
  nec: 'ne',
  cc: 'ne',
  cotton: 'ne',
  'cotton count': 'ne',
  linen: 'lea',
  lea: 'lea',
  'linen lea': 'lea',
  worsted: 'worsted',
  'worsted count': 'worsted',
  run: 'run',
  runs: 'run',
  'woollen run': 'run',
  'woolen run': 'run',
  'yd/lb': 'ydPerLb',
  'yds/lb': 'ydPerLb',
  ypp: 'ydPerLb',
  'yards per pound': 'ydPerLb',
  'yards/lb': 'ydPerLb',
  'm/kg': 'mPerKg',
  'metres per kilogram': 'mPerKg',
  'meters per kilogram': 'mPerKg',
  'metres per kg': 'mPerKg',
  'meters per kg': 'mPerKg',
  'm/g': 'mPerG',
  wpi: 'wpi',
  'wraps per inch': 'wpi',
  'wraps/inch': 'wpi',
  'wraps per cm': 'wpcm',
  'wraps/cm': 'wpcm',
};

// Trade notation per system. Cotton and linen put the size first (8/2, 20/2); worsted puts the
// plies first (2/10) (ASTM D2260, Table 1). Metric count is written both ways
// (Nm 2/28, Nm 8/2), so the smaller number is taken as the ply count (common practice, from memory).
// Woollen runs are rarely plied; size first is assumed (from memory).
const DEFAULT_ORDER: Partial<Record<CountSystem, PlyOrder | 'smaller-is-plies'>> = {
  ne: 'size-first',
  lea: 'size-first',
  run: 'size-first',
  worsted: 'plies-first',
  nm: 'smaller-is-plies',
};

const NUMBER = String.raw`(\d+(?:\.\d+)?|\.\d+)`;
const NUMBER_PART = new RegExp(String.raw`${NUMBER}(?:\s*([/x×*])\s*${NUMBER})?`);

/**
 * Reads a weaver's yarn description such as "8/2 cotton", "20/2 linen", "2/10 worsted", "30 tex",
 * "30x2 tex", "Nm 2/28", "150 denier", "3360 yd/lb" or "12 wpi".
 * `order` overrides the system's usual ply notation.
 *
 * @example parseYarn('8/2 cotton') // { ok: true, yarn: { kind: 'count', system: 'ne', count: 4, … } }
 */
export function parseYarn(text: string, order?: PlyOrder): ParseYarnResult {
  const lower = text.trim().toLowerCase();
  const m = NUMBER_PART.exec(lower);
  if (!m) return { ok: false, error: 'No number found: write the count, e.g. "8/2 cotton" or "30 tex".' };
  const rest = (lower.slice(0, m.index) + ' ' + lower.slice(m.index + m[0].length))
    .replace(/[.,;:]+$/g, '')
    .replace(/\s+/g, ' ')
    .trim();
  const keyword = KEYWORDS[rest];
  if (!keyword) {
    return {
      ok: false,
      error: rest
        ? `Unknown count system "${rest}": use cotton, linen, worsted, run, Nm, tex, denier, yd/lb, m/kg or wpi.`
        : 'Say which count system the number is in, e.g. "8/2 cotton", "2/10 worsted" or "Nm 2/28".',
    };
  }
  const a = Number(m[1]);
  const sep = m[2];
  const b = m[3] === undefined ? undefined : Number(m[3]);
  if (!(a > 0) || (b !== undefined && !(b > 0))) return { ok: false, error: 'Counts must be greater than zero.' };

  if (keyword === 'wpi' || keyword === 'wpcm') {
    if (b !== undefined) return { ok: false, error: 'Wraps are a single number.' };
    return { ok: true, yarn: { kind: 'wraps', wrapsPerInch: keyword === 'wpi' ? a : a * CM_PER_INCH } };
  }
  const system: CountSystem = keyword === 'mPerG' ? 'nm' : keyword;
  let size = a;
  let plies = 1;
  if (b !== undefined) {
    if (isDirectSystem(system)) {
      // Direct counts are plied as "30 x 2" (singles × plies), as in ISO 1139 notation (from memory);
      // a slash would read as a denier range such as "20/22".
      if (sep === '/') return { ok: false, error: `Write plied ${countSystemLabel(system)} as "30x2".` };
      size = a;
      plies = b;
    } else {
      if (sep !== '/') return { ok: false, error: `Write plied ${countSystemLabel(system)} with a slash, e.g. "8/2".` };
      const rule = order ?? DEFAULT_ORDER[system];
      if (!rule) return { ok: false, error: `${countSystemLabel(system)} is a single number.` };
      const pliesFirst = rule === 'plies-first' || (rule === 'smaller-is-plies' && a < b);
      size = pliesFirst ? b : a;
      plies = pliesFirst ? a : b;
    }
    if (!Number.isInteger(plies)) return { ok: false, error: 'The ply count must be a whole number.' };
  }
  const count = pliedCount(system, size, plies);
  return { ok: true, yarn: { kind: 'count', system, size, plies, count, metresPerKg: toMetresPerKg(system, count) } };
}
