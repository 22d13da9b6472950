import { z } from 'zod';
import {
  DRAFT_SCHEMA_VERSION,
  MAX_PROFILE_COLUMNS,
  MAX_PROFILE_ROWS,
  MAX_SHAFTS,
  MAX_THREADS,
  MAX_THREADS_PER_UNIT,
  MAX_TREADLES,
  PROFILE_UNIT_IDS,
  type Draft,
  type Sett,
} from './types';
import { migrateDraft } from './migrate';
import { BROKEN_TEXT_MESSAGE, hasLoneSurrogate } from './text';

/** Layers a draft may use: two shafts per plain-weave layer on 32 shafts gives 16. */
export const MAX_LAYERS = 16;
export const MAX_PALETTE = 1024;
export const MAX_NAME_LENGTH = 200;
export const MAX_NOTES_LENGTH = 100_000;

/** Dark warp on light weft, so an uncoloured draft reads as its structure. */
export const DEFAULT_PALETTE: readonly string[] = ['#2b2b33', '#f3efe6'];
export const DEFAULT_SETT: Readonly<Sett> = { warp: 20, weft: 20, unit: 'inch' };
export const DEFAULT_NAME = 'Untitled draft';

/** One thing wrong with a draft document: where (a JSON path) and what, in a weaver's words. */
export interface DraftProblem {
  path: string;
  message: string;
}

/** Thrown by {@link parseDraft}; `problems` lists every problem found, not just the first. */
export class DraftError extends Error {
  readonly problems: DraftProblem[];
  constructor(problems: DraftProblem[]) {
    const head = problems.slice(0, 5).map((p) => p.message).join('; ');
    const more = problems.length > 5 ? ` (and ${problems.length - 5} more)` : '';
    super(`The draft has ${problems.length} problem${problems.length === 1 ? '' : 's'}: ${head}${more}`);
    this.name = 'DraftError';
    this.problems = problems;
  }
}

/** Text the weaver wrote: at most `max` characters, and whole characters only (see ./text). */
const text = (max: number, tooLong: string) =>
  z.string({ error: 'must be text' }).max(max, { error: tooLong }).refine((s) => !hasLoneSurrogate(s), { error: BROKEN_TEXT_MESSAGE });

const wholeNumber = (what: string) =>
  z.number({ error: `${what} must be a number` }).int({ error: `${what} must be a whole number` });

const shaftNumber = wholeNumber('a shaft')
  .min(1, { error: (iss) => `shaft ${String(iss.input)} is not a shaft number (they start at 1)` })
  .max(MAX_SHAFTS, { error: (iss) => `shaft ${String(iss.input)} is above ${MAX_SHAFTS}, the most shafts a draft can have` });

const treadleNumber = wholeNumber('a treadle')
  .min(1, { error: (iss) => `treadle ${String(iss.input)} is not a treadle number (they start at 1)` })
  .max(MAX_TREADLES, { error: (iss) => `treadle ${String(iss.input)} is above ${MAX_TREADLES}, the most treadles a draft can have` });

const colourIndex = wholeNumber('a colour').min(0, { error: 'a colour index cannot be negative' });

const layerNumber = wholeNumber('a layer')
  .min(1, { error: (iss) => `layer ${String(iss.input)} is not a layer number (they start at 1)` })
  .max(MAX_LAYERS, { error: (iss) => `layer ${String(iss.input)} is above ${MAX_LAYERS}, the most layers a draft can have` });

const threadList = <T extends z.ZodType>(item: T, what: string) =>
  z.array(item, { error: `must be a list of ${what}` }).max(MAX_THREADS, {
    error: (iss) => `has ${(iss.input as unknown[]).length} entries; a draft can have at most ${MAX_THREADS}`,
  });

const shaftsOf = z.array(shaftNumber, { error: 'must be a list of shaft numbers, e.g. [1] or [1, 3]' });
const treadlesOf = z.array(treadleNumber, { error: 'must be a list of treadle numbers, e.g. [1] or [1, 3]' });

const blockNumber = wholeNumber('a block').min(1, { error: (iss) => `${String(iss.input)} is not a block number (they start at 1)` });
/** A repeating colour order: at most this many colours before it repeats. */
export const MAX_COLOUR_ORDER = 256;
const colourOrder = z
  .array(colourIndex, { error: 'must be a list of colour indices' })
  .min(1, { error: 'needs at least one colour' })
  .max(MAX_COLOUR_ORDER, { error: `has more than ${MAX_COLOUR_ORDER} colours` });
const colourOrders = z.array(colourOrder, { error: 'must be a list of colour orders, one per set of the unit' }).max(MAX_LAYERS, { error: 'has too many sets' });
const threadsPerUnit = (what: string) => wholeNumber(what).min(1, { error: 'must be at least 1' }).max(MAX_THREADS_PER_UNIT, { error: `is more than ${MAX_THREADS_PER_UNIT}` });

/** The block design kept with a draft (types.ts BlockDesign); profile.ts checks it fits its unit. */
const blockDesignSchema = z.strictObject(
  {
    unit: z.enum(PROFILE_UNIT_IDS, { error: `must be one of ${PROFILE_UNIT_IDS.map((u) => JSON.stringify(u)).join(', ')}` }),
    threading: z
      .array(blockNumber, { error: 'must be a list of block numbers' })
      .min(1, { error: 'needs at least one column' })
      .max(MAX_PROFILE_COLUMNS, { error: `has more than ${MAX_PROFILE_COLUMNS} columns` }),
    treadling: z.array(z.array(blockNumber, { error: 'must be a list of block numbers' }), { error: 'must be a list of rows' }).max(MAX_PROFILE_ROWS, { error: `has more than ${MAX_PROFILE_ROWS} rows` }),
    endsPerUnit: threadsPerUnit('ends per unit').optional(),
    picksPerUnit: threadsPerUnit('picks per unit').optional(),
    warpColors: colourOrders,
    weftColors: colourOrders,
    blockWarpColors: z.array(colourOrders, { error: 'must be a list, one entry per block' }).max(MAX_SHAFTS, { error: 'has more blocks than shafts' }).optional(),
    tieup: z
      .array(z.array(blockNumber, { error: 'must be a list of block numbers' }), { error: 'must be a list of block treadles' })
      .min(1, { error: 'needs at least one block treadle' })
      .max(MAX_SHAFTS, { error: 'has more block treadles than shafts' })
      .optional(),
    blockWeftColors: z.array(colourOrders, { error: 'must be a list, one entry per block' }).max(MAX_SHAFTS, { error: 'has more blocks than shafts' }).optional(),
  },
  { error: 'must be a block design object' },
);

/**
 * Shape of the versioned JSON draft document (docs/draft-format.md). It checks each field on its
 * own; {@link parseDraft} adds the checks between fields and fills defaults.
 */
export const draftDocumentSchema = z.strictObject(
  {
    schemaVersion: z.literal(DRAFT_SCHEMA_VERSION, {
      error: (iss) =>
        iss.input === undefined
          ? 'is missing'
          : `${JSON.stringify(iss.input)} is not a version this program reads (it reads ${DRAFT_SCHEMA_VERSION})`,
    }),
    name: text(MAX_NAME_LENGTH, `is longer than ${MAX_NAME_LENGTH} characters`).optional(),
    shafts: wholeNumber('the number of shafts')
      .min(1, { error: 'a draft needs at least 1 shaft' })
      .max(MAX_SHAFTS, { error: (iss) => `${String(iss.input)} shafts is more than ${MAX_SHAFTS}, the most a draft can have` }),
    treadles: wholeNumber('the number of treadles')
      .min(0, { error: 'cannot be negative' })
      .max(MAX_TREADLES, { error: (iss) => `${String(iss.input)} treadles is more than ${MAX_TREADLES}, the most a draft can have` })
      .optional(),
    shed: z.enum(['rising', 'sinking'], { error: 'must be "rising" or "sinking"' }).optional(),
    control: z.enum(['treadling', 'liftplan'], { error: 'must be "treadling" or "liftplan"' }).optional(),
    threading: threadList(shaftsOf, 'ends'),
    tieup: z
      .array(shaftsOf, { error: 'must be a list of treadles' })
      .max(MAX_TREADLES, { error: `has more than ${MAX_TREADLES} treadles` })
      .optional(),
    treadling: threadList(treadlesOf, 'picks').optional(),
    liftplan: threadList(shaftsOf, 'picks').optional(),
    palette: z
      .array(z.string({ error: 'must be a colour like "#1a2b3c"' }).regex(/^#[0-9a-fA-F]{6}$/, {
        error: (iss) => `${JSON.stringify(iss.input)} is not a colour like "#1a2b3c"`,
      }), { error: 'must be a list of colours' })
      .min(1, { error: 'needs at least one colour' })
      .max(MAX_PALETTE, { error: `has more than ${MAX_PALETTE} colours` })
      .optional(),
    warpColors: threadList(colourIndex, 'colour indices').optional(),
    weftColors: threadList(colourIndex, 'colour indices').optional(),
    warpLayers: threadList(layerNumber, 'layer numbers').optional(),
    weftLayers: threadList(layerNumber, 'layer numbers').optional(),
    sett: z
      .strictObject(
        {
          warp: z.number({ error: 'must be a number' }).positive({ error: 'must be more than 0' }).max(1000, { error: 'is more than 1000' }),
          weft: z.number({ error: 'must be a number' }).positive({ error: 'must be more than 0' }).max(1000, { error: 'is more than 1000' }),
          unit: z.enum(['inch', 'cm'], { error: 'must be "inch" or "cm"' }),
        },
        { error: 'must be an object like {"warp": 24, "weft": 24, "unit": "inch"}' },
      )
      .optional(),
    yarns: z
      .array(
        z.strictObject(
          {
            id: text(100, 'is too long').min(1, { error: 'cannot be empty' }),
            name: text(MAX_NAME_LENGTH, 'is too long'),
            color: colourIndex,
          },
          { error: 'must be an object with id, name and color' },
        ),
        { error: 'must be a list' },
      )
      .max(MAX_PALETTE, { error: 'has too many yarns' })
      .optional(),
    notes: text(MAX_NOTES_LENGTH, `is longer than ${MAX_NOTES_LENGTH} characters`).optional(),
    blocks: z
      .strictObject(
        {
          warp: threadList(wholeNumber('a block').min(0, { error: 'a block number cannot be negative' }), 'block numbers'),
          weft: threadList(wholeNumber('a block').min(0, { error: 'a block number cannot be negative' }), 'block numbers'),
        },
        { error: 'must be an object with warp and weft lists' },
      )
      .optional(),
    profile: blockDesignSchema.optional(),
    arrangement: z
      .strictObject(
        {
          endOne: z.enum(['left', 'right'], { error: 'must be "left" or "right"' }),
          threading: z.enum(['above', 'below'], { error: 'must be "above" or "below"' }),
          treadling: z.enum(['right', 'left'], { error: 'must be "right" or "left"' }),
          shaftOne: z.enum(['bottom', 'top'], { error: 'must be "bottom" or "top"' }),
        },
        { error: 'must be an object like {"endOne": "right", "threading": "above", "treadling": "right", "shaftOne": "bottom"}' },
      )
      .optional(),
  },
  { error: 'a draft must be a JSON object' },
);

export type DraftDocument = z.infer<typeof draftDocumentSchema>;

// Safe integers only: where zod might accept more, the fallback to draftDocumentSchema still does.
const wholeIn = (v: unknown, min: number, max: number) => Number.isSafeInteger(v) && (v as number) >= min && (v as number) <= max;
/** A list (by index, so a hole fails as zod would fail it) of at most `maxLength` items that all pass `ok`. */
function listOf(v: unknown, ok: (item: unknown) => boolean, maxLength = Infinity): boolean {
  if (!Array.isArray(v) || v.length > maxLength) return false;
  for (let i = 0; i < v.length; i++) if (!ok(v[i])) return false;
  return true;
}
// Named once, not built per end or pick: these run over every row of every save.
const isShaft = (x: unknown) => wholeIn(x, 1, MAX_SHAFTS);
const isTreadle = (x: unknown) => wholeIn(x, 1, MAX_TREADLES);
const isShaftList = (v: unknown) => listOf(v, isShaft);
const isTreadleList = (v: unknown) => listOf(v, isTreadle);

/**
 * The same schema with the long number lists checked in one plain loop each instead of one zod schema
 * per entry, which cost most of a large draft's parse. It accepts exactly what draftDocumentSchema
 * accepts (a property test holds them to that); it is tried first, and only a draft it refuses goes
 * through draftDocumentSchema, whose issues name each problem.
 */
const quickDocumentSchema = draftDocumentSchema.extend({
  threading: z.custom<number[][]>((v) => listOf(v, isShaftList, MAX_THREADS)),
  tieup: z.custom<number[][]>((v) => listOf(v, isShaftList, MAX_TREADLES)).optional(),
  treadling: z.custom<number[][]>((v) => listOf(v, isTreadleList, MAX_THREADS)).optional(),
  liftplan: z.custom<number[][]>((v) => listOf(v, isShaftList, MAX_THREADS)).optional(),
  warpColors: z.custom<number[]>((v) => listOf(v, (x) => wholeIn(x, 0, Infinity), MAX_THREADS)).optional(),
  weftColors: z.custom<number[]>((v) => listOf(v, (x) => wholeIn(x, 0, Infinity), MAX_THREADS)).optional(),
  warpLayers: z.custom<number[]>((v) => listOf(v, (x) => wholeIn(x, 1, MAX_LAYERS), MAX_THREADS)).optional(),
  weftLayers: z.custom<number[]>((v) => listOf(v, (x) => wholeIn(x, 1, MAX_LAYERS), MAX_THREADS)).optional(),
});

/** draftDocumentSchema's verdict and data, the quick way when the document is sound. */
export function checkDocumentShape(json: unknown) {
  const quick = quickDocumentSchema.safeParse(json);
  return quick.success ? quick : draftDocumentSchema.safeParse(json);
}

// What one position in each list is called, so messages read "threading end 37", not "threading[36]".
const POSITION_WORD: Record<string, string> = {
  threading: 'end',
  tieup: 'treadle',
  treadling: 'pick',
  liftplan: 'pick',
  palette: 'colour',
  warpColors: 'end',
  weftColors: 'pick',
  warpLayers: 'end',
  weftLayers: 'pick',
  yarns: '',
};
const FIELD_WORDS: Record<string, string> = {
  tieup: 'tie-up',
  liftplan: 'lift plan',
  warpColors: 'warp colours',
  weftColors: 'weft colours',
  warpLayers: 'warp layers',
  weftLayers: 'weft layers',
  yarns: 'yarn',
  profile: 'block design',
};

function pathText(path: readonly PropertyKey[]): string {
  return path.map((k, i) => (typeof k === 'number' ? `[${k}]` : i === 0 ? String(k) : `.${String(k)}`)).join('');
}

/** "threading end 37", "tie-up treadle 2", "blocks.warp end 4", "sett.warp". */
function where(path: readonly PropertyKey[]): string {
  if (path.length === 0) return 'draft';
  const [field, index, ...rest] = path;
  const name = FIELD_WORDS[String(field)] ?? String(field);
  if (typeof index === 'number') {
    const word = POSITION_WORD[String(field)];
    const pos = word === undefined || word === '' ? `${name} ${index + 1}` : `${name} ${word} ${index + 1}`;
    const tail = rest.filter((k) => typeof k === 'string');
    return tail.length ? `${pos} ${tail.join(' ')}` : pos;
  }
  if (field === 'blocks' && typeof index === 'string') {
    const pos = rest[0];
    return typeof pos === 'number' ? `blocks ${index} ${index === 'warp' ? 'end' : 'pick'} ${pos + 1}` : `blocks ${index}`;
  }
  return [FIELD_WORDS[String(field)] ?? String(field), ...path.slice(1).map(String)].join(' ');
}

class Problems {
  readonly list: DraftProblem[] = [];
  add(path: readonly PropertyKey[], message: string): void {
    this.list.push({ path: pathText(path), message: `${where(path)}: ${message}` });
  }
}

const isInt = (v: unknown): v is number => typeof v === 'number' && Number.isInteger(v);
const isRecord = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);

function plural(n: number, one: string, many = `${one}s`): string {
  return `${n} ${n === 1 ? one : many}`;
}

/**
 * Numbers past `limit` (within `hardMax`: beyond it the shape check reports them), then numbers listed
 * twice in one row. Plain loops, and a set only for rows of two or more: this runs on every save, over
 * every end and pick.
 */
function checkNumbersWithin(problems: Problems, field: string, lists: unknown, limit: number, kind: string, of: string, hardMax: number): void {
  if (!Array.isArray(lists)) return;
  for (let i = 0; i < lists.length; i++) {
    const row: unknown = lists[i];
    if (!Array.isArray(row)) continue;
    for (let j = 0; j < row.length; j++) {
      const v: unknown = row[j];
      if (isInt(v) && v >= 1 && v <= hardMax && v > limit) problems.add([field, i, j], `${kind} ${v} but the draft has ${plural(limit, of)}`);
    }
  }
  for (let i = 0; i < lists.length; i++) {
    const row: unknown = lists[i];
    if (!Array.isArray(row) || row.length < 2) continue;
    const seen = new Set<unknown>();
    for (let j = 0; j < row.length; j++) {
      if (!(j in row)) continue; // a hole, which the shape check reports
      if (seen.has(row[j])) problems.add([field, i, j], `${kind} ${String(row[j])} is listed twice`);
      seen.add(row[j]);
    }
  }
}

function checkLength(problems: Problems, field: string, list: unknown, expected: number, thing: string): void {
  if (Array.isArray(list) && list.length !== 0 && list.length !== expected) {
    problems.add([field], `has ${plural(list.length, 'entry', 'entries')} but the draft has ${plural(expected, thing)} (give one per ${thing}, or leave it empty)`);
  }
}

function checkColours(problems: Problems, field: string, list: unknown, paletteSize: number): void {
  if (!Array.isArray(list)) return;
  list.forEach((v: unknown, i) => {
    if (isInt(v) && v >= paletteSize) {
      problems.add([field, i], `colour ${v} is not in the palette (its colours are numbered 0 to ${paletteSize - 1})`);
    }
  });
}

/** The checks between fields, run on the raw input so they report alongside the shape problems. */
function crossCheck(raw: Record<string, unknown>, problems: Problems): void {
  const shafts = isInt(raw.shafts) && raw.shafts >= 1 && raw.shafts <= MAX_SHAFTS ? raw.shafts : MAX_SHAFTS;
  const tieupLength = Array.isArray(raw.tieup) ? raw.tieup.length : undefined;
  const treadles = isInt(raw.treadles) && raw.treadles >= 0 && raw.treadles <= MAX_TREADLES ? raw.treadles : (tieupLength ?? 0);
  if (isInt(raw.treadles) && tieupLength !== undefined && tieupLength !== raw.treadles) {
    problems.add(['tieup'], `lists ${plural(tieupLength, 'treadle')} but the draft has ${plural(raw.treadles, 'treadle')}`);
  }
  checkNumbersWithin(problems, 'threading', raw.threading, shafts, 'shaft', 'shaft', MAX_SHAFTS);
  checkNumbersWithin(problems, 'tieup', raw.tieup, shafts, 'shaft', 'shaft', MAX_SHAFTS);
  checkNumbersWithin(problems, 'liftplan', raw.liftplan, shafts, 'shaft', 'shaft', MAX_SHAFTS);
  checkNumbersWithin(problems, 'treadling', raw.treadling, treadles, 'treadle', 'treadle', MAX_TREADLES);

  const ends = Array.isArray(raw.threading) ? raw.threading.length : 0;
  const control = resolveControl(raw);
  const pickList = control === 'liftplan' ? raw.liftplan : raw.treadling;
  const picks = Array.isArray(pickList) ? pickList.length : 0;
  if (raw.control === undefined && Array.isArray(raw.treadling) && raw.treadling.length > 0 && Array.isArray(raw.liftplan) && raw.liftplan.length > 0) {
    problems.add(['control'], 'is missing, and the draft has both a treadling and a lift plan: say which one the picks follow');
  }
  checkLength(problems, 'warpColors', raw.warpColors, ends, 'end');
  checkLength(problems, 'warpLayers', raw.warpLayers, ends, 'end');
  checkLength(problems, 'weftColors', raw.weftColors, picks, 'pick');
  checkLength(problems, 'weftLayers', raw.weftLayers, picks, 'pick');
  if (isRecord(raw.blocks)) {
    if (Array.isArray(raw.blocks.warp) && raw.blocks.warp.length !== ends) {
      problems.add(['blocks', 'warp'], `has ${plural(raw.blocks.warp.length, 'entry', 'entries')} but the draft has ${plural(ends, 'end')}`);
    }
    if (Array.isArray(raw.blocks.weft) && raw.blocks.weft.length !== picks) {
      problems.add(['blocks', 'weft'], `has ${plural(raw.blocks.weft.length, 'entry', 'entries')} but the draft has ${plural(picks, 'pick')}`);
    }
  }

  const paletteSize = Array.isArray(raw.palette) ? raw.palette.length : DEFAULT_PALETTE.length;
  if (paletteSize > 0) {
    checkColours(problems, 'warpColors', raw.warpColors, paletteSize);
    checkColours(problems, 'weftColors', raw.weftColors, paletteSize);
    if (isRecord(raw.profile)) checkDesignColours(problems, raw.profile, paletteSize);
    if (Array.isArray(raw.yarns)) {
      raw.yarns.forEach((y: unknown, i) => {
        if (isRecord(y) && isInt(y.color) && y.color >= paletteSize) {
          problems.add(['yarns', i, 'color'], `colour ${y.color} is not in the palette (its colours are numbered 0 to ${paletteSize - 1})`);
        }
      });
    }
  }
  if (Array.isArray(raw.yarns)) {
    const ids = new Set<unknown>();
    raw.yarns.forEach((y: unknown, i) => {
      if (!isRecord(y)) return;
      if (ids.has(y.id)) problems.add(['yarns', i, 'id'], `id ${JSON.stringify(y.id)} is used by another yarn`);
      ids.add(y.id);
    });
  }
}

/** Colours of the block design's orders must be in the draft's palette. */
function checkDesignColours(problems: Problems, design: Record<string, unknown>, paletteSize: number): void {
  const check = (orders: unknown, what: string) => {
    if (!Array.isArray(orders)) return;
    orders.forEach((order: unknown, set) => {
      if (!Array.isArray(order)) return;
      for (const v of order as unknown[]) {
        if (isInt(v) && v >= paletteSize) {
          problems.add(['profile'], `${what} order ${set + 1}: colour ${v} is not in the palette (its colours are numbered 0 to ${paletteSize - 1})`);
        }
      }
    });
  };
  check(design.warpColors, 'warp colour');
  check(design.weftColors, 'weft colour');
  if (Array.isArray(design.blockWarpColors)) design.blockWarpColors.forEach((orders: unknown, b) => check(orders, `block ${b + 1} warp colour`));
  if (Array.isArray(design.blockWeftColors)) design.blockWeftColors.forEach((orders: unknown, b) => check(orders, `block ${b + 1} weft colour`));
}

function resolveControl(raw: Record<string, unknown>): Draft['control'] {
  if (raw.control === 'treadling' || raw.control === 'liftplan') return raw.control;
  const hasTreadling = Array.isArray(raw.treadling) && raw.treadling.length > 0;
  const hasLiftplan = Array.isArray(raw.liftplan) && raw.liftplan.length > 0;
  return hasLiftplan && !hasTreadling ? 'liftplan' : 'treadling';
}

function valueAt(json: unknown, path: readonly PropertyKey[]): unknown {
  let v = json;
  for (const k of path) v = isRecord(v) || Array.isArray(v) ? (v as Record<PropertyKey, unknown>)[k] : undefined;
  return v;
}

function zodMessage(issue: z.core.$ZodIssue, json: unknown): string {
  if (issue.code === 'invalid_type' && issue.path.length > 0 && valueAt(json, issue.path) === undefined) return 'is missing';
  if (issue.code === 'unrecognized_keys') {
    return `unknown field${issue.keys.length === 1 ? '' : 's'} ${issue.keys.map((k) => JSON.stringify(k)).join(', ')}`;
  }
  if (issue.code === 'invalid_type' && issue.message.startsWith('Invalid input')) return 'is missing or of the wrong kind';
  return issue.message;
}

/**
 * Reads a JSON draft document into a {@link Draft}, filling defaults for omitted optional fields
 * (see docs/draft-format.md). A document of an older schema version is upgraded first
 * ({@link migrateDraft}); the object passed in is never changed. Colour and layer lists are either empty (defaults apply) or give
 * exactly one entry per end/pick: a shorter colour order is a mistake here, not a repeat.
 *
 * @throws DraftError listing every problem, e.g. "threading end 37: shaft 9 but the draft has 8 shafts".
 */
export function parseDraft(stored: unknown): Draft {
  const json = migrateDraft(stored);
  const problems = new Problems();
  const shape = checkDocumentShape(json);
  if (!shape.success) {
    for (const issue of shape.error.issues) problems.add(issue.path, zodMessage(issue, json));
  }
  if (isRecord(json)) crossCheck(json, problems);
  if (problems.list.length > 0 || !shape.success) throw new DraftError(problems.list);
  return withDefaults(shape.data);
}

function withDefaults(doc: DraftDocument): Draft {
  const control = resolveControl(doc);
  const treadling = doc.treadling ?? [];
  const liftplan = doc.liftplan ?? [];
  const ends = doc.threading.length;
  const picks = control === 'liftplan' ? liftplan.length : treadling.length;
  const palette = (doc.palette ?? DEFAULT_PALETTE).map((c) => c.toLowerCase());
  const treadles = doc.treadles ?? doc.tieup?.length ?? 0;
  const weftDefault = Math.min(1, palette.length - 1);
  const filled = (list: number[] | undefined, n: number, value: number) => (list && list.length > 0 ? list : new Array<number>(n).fill(value));
  const draft: Draft = {
    schemaVersion: DRAFT_SCHEMA_VERSION,
    name: doc.name ?? DEFAULT_NAME,
    shafts: doc.shafts,
    treadles,
    shed: doc.shed ?? 'rising',
    control,
    threading: doc.threading,
    tieup: doc.tieup ?? Array.from({ length: treadles }, () => []),
    treadling,
    liftplan,
    palette,
    warpColors: filled(doc.warpColors, ends, 0),
    weftColors: filled(doc.weftColors, picks, weftDefault),
    warpLayers: doc.warpLayers ?? [],
    weftLayers: doc.weftLayers ?? [],
    sett: doc.sett ?? { ...DEFAULT_SETT },
    yarns: doc.yarns ?? [],
    notes: doc.notes ?? '',
  };
  if (doc.blocks) draft.blocks = doc.blocks;
  if (doc.profile) draft.profile = doc.profile;
  if (doc.arrangement) draft.arrangement = doc.arrangement;
  return draft;
}

/**
 * A zod schema that accepts exactly what {@link parseDraft} accepts and yields the {@link Draft},
 * so API request schemas can embed a draft and report every problem as an issue.
 */
export const draftSchema = z.unknown().transform((value, ctx): Draft => {
  try {
    return parseDraft(value);
  } catch (err) {
    if (!(err instanceof DraftError)) throw err;
    for (const p of err.problems) ctx.addIssue({ code: 'custom', message: p.message, input: value });
    return z.NEVER;
  }
});

/** A draft for a loom of the given size and nothing drawn yet. */
export function emptyDraft(shafts: number, treadles: number): Draft {
  return parseDraft({ schemaVersion: DRAFT_SCHEMA_VERSION, shafts, treadles, threading: [] });
}

type DeepReadonly<T> = T extends readonly (infer U)[] ? readonly DeepReadonly<U>[] : T extends object ? { readonly [K in keyof T]: DeepReadonly<T[K]> } : T;

/** Fields of a draft as callers may hold them (read-only lists are fine); all optional. */
export type DraftInput = Partial<DeepReadonly<Draft>>;

/**
 * Builds a valid draft from the fields given; the rest take their defaults, and colour/layer
 * lists left empty are filled to the draft's length.
 *
 * @example createDraft({ shafts: 2, threading: [[1], [2]], treadles: 2, tieup: [[1], [2]], treadling: [[1], [2]] })
 * @throws DraftError when the result would not be a valid draft.
 */
export function createDraft(partial: DraftInput): Draft {
  const doc: Record<string, unknown> = { schemaVersion: DRAFT_SCHEMA_VERSION, shafts: 4, threading: [], ...partial };
  return parseDraft(doc);
}
