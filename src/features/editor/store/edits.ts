import { isDraft, original, produce, type Draft as ImmerDraft } from 'immer';
import type { Draft, DraftArrangement } from '../../../../shared/weave';
import {
  alternateLayers,
  brokenDraw,
  layersByColour,
  layersByShaft,
  MAX_LAYERS,
  MAX_SHAFTS,
  MAX_TREADLES,
  mirror,
  pointDraw,
  repeat,
  repeatWithChange,
  resolveLayers,
  reverse,
  straightDraw,
  toLiftPlanDraft,
  toTreadlingDraft,
  treadleDraftAsDrawnIn,
  type RunChange,
} from '../../../../shared/weave';
import { axisOf, isThreadRow, type GridId, type ListGridId, type ThreadRowId } from './grids';

/**
 * The editor's edits. Each is written once as an immer recipe and exported two ways: as a pure
 * function `(draft, args) => draft` that returns the same object when nothing changed, and (through
 * `.recipe`) for the store, which runs it under `produceWithPatches` to record undo steps.
 */
export interface Edit<A> {
  (draft: Draft, args: A): Draft;
  readonly recipe: (d: ImmerDraft<Draft>, args: A) => void;
  /** What Undo and Redo call this edit ("Undo upside down"), named for what it did with these arguments. */
  labelFor(args: A): string;
}

function edit<A>(label: string | ((args: A) => string), recipe: (d: ImmerDraft<Draft>, args: A) => void): Edit<A> {
  const pure = (draft: Draft, args: A) =>
    produce(draft, (d) => {
      recipe(d, args);
    });
  return Object.assign(pure, { recipe, labelFor: typeof label === 'string' ? () => label : label });
}

type D = ImmerDraft<Draft>;

/** The list that decides the picks: the treadling or the lift plan. */
function pickList(d: D): number[][] {
  return d.control === 'liftplan' ? d.liftplan : d.treadling;
}

function listOf(d: D, grid: ListGridId): number[][] {
  switch (grid) {
    case 'threading':
      return d.threading;
    case 'tieup':
      return d.tieup;
    case 'treadling':
      return d.treadling;
    case 'liftplan':
      return d.liftplan;
  }
}

const byNumber = (a: number, b: number) => a - b;

// Lists that run one entry per end (or pick) beside the threading (or pick list); all grow and
// shrink together. Layer lists stay empty when the draft has one layer.
function endLists(d: D): { list: number[]; fill: number }[] {
  const lists = [{ list: d.warpColors, fill: d.warpColors.at(-1) ?? 0 }];
  if (d.warpLayers.length > 0) lists.push({ list: d.warpLayers, fill: d.warpLayers.at(-1) ?? 1 });
  if (d.blocks) lists.push({ list: d.blocks.warp, fill: 0 });
  return lists;
}

function pickLists(d: D): { list: number[]; fill: number }[] {
  const lists = [{ list: d.weftColors, fill: d.weftColors.at(-1) ?? Math.min(1, d.palette.length - 1) }];
  if (d.weftLayers.length > 0) lists.push({ list: d.weftLayers, fill: d.weftLayers.at(-1) ?? 1 });
  if (d.blocks) lists.push({ list: d.blocks.weft, fill: 0 });
  return lists;
}

/**
 * A colour or layer row to write into. A layer list left empty (all layer 1) is filled out first,
 * so writing a layer never shortens the others' meaning.
 */
function threadRow(d: D, grid: ThreadRowId): number[] {
  if (grid === 'warpColors') return d.warpColors;
  if (grid === 'weftColors') return d.weftColors;
  const list = grid === 'warpLayers' ? d.warpLayers : d.weftLayers;
  const n = grid === 'warpLayers' ? d.threading.length : pickList(d).length;
  if (list.length < n) list.push(...Array.from(resolveLayers(list, n)).slice(list.length));
  return list;
}

/** A colour or layer row as it reads, whole (an empty layer list reads as all layer 1). */
function readThreadRow(draft: Draft, grid: ThreadRowId): readonly number[] {
  if (grid === 'warpColors') return draft.warpColors;
  if (grid === 'weftColors') return draft.weftColors;
  return grid === 'warpLayers' ? resolveLayerList(draft.warpLayers, draft.threading.length) : resolveLayerList(draft.weftLayers, picksIn(draft));
}

const resolveLayerList = (list: readonly number[], n: number) => Array.from(resolveLayers(list, n));
const picksIn = (d: Draft) => (d.control === 'liftplan' ? d.liftplan.length : d.treadling.length);

/** Whether a value belongs in a colour or layer row. */
function fitsRow(d: Draft, grid: ThreadRowId, value: number): boolean {
  return grid === 'warpColors' || grid === 'weftColors' ? value >= 0 && value < d.palette.length : value >= 1 && value <= MAX_LAYERS;
}

/** Inserts `count` empty ends (axis 'ends') or picks at `at`, keeping every per-thread list in step. */
function insertThreads(d: D, axis: 'ends' | 'picks', at: number, count: number): void {
  if (count <= 0) return;
  const main = axis === 'ends' ? d.threading : pickList(d);
  const where = Math.max(0, Math.min(at, main.length));
  main.splice(where, 0, ...Array.from({ length: count }, () => []));
  for (const { list, fill } of axis === 'ends' ? endLists(d) : pickLists(d)) {
    // Inserted threads take the colour (or layer) of the thread before them, as a weaver extending a stripe expects.
    const value = where > 0 ? list[where - 1] : (list[0] ?? fill);
    list.splice(where, 0, ...new Array<number>(count).fill(value));
  }
}

function deleteThreads(d: D, axis: 'ends' | 'picks', from: number, to: number): void {
  const main = axis === 'ends' ? d.threading : pickList(d);
  const a = Math.max(0, from);
  const b = Math.min(main.length - 1, to);
  if (b < a) return;
  main.splice(a, b - a + 1);
  for (const { list } of axis === 'ends' ? endLists(d) : pickLists(d)) list.splice(a, b - a + 1);
}

/** Grows a list so `index` exists; ends and picks grow as the weaver draws past the last one. */
function ensureIndex(d: D, grid: GridId, index: number): void {
  const axis = axisOf(grid);
  if (axis === 'treadles') return;
  const length = axis === 'ends' ? d.threading.length : pickList(d).length;
  if (index >= length) insertThreads(d, axis, length, index + 1 - length);
}

/** Treadling and lift plan are drawn only while they decide the picks; the other is kept as it was. */
function editable(d: D, grid: GridId): boolean {
  return !((grid === 'treadling' && d.control !== 'treadling') || (grid === 'liftplan' && d.control !== 'liftplan'));
}

function inRange(grid: GridId, d: D, index: number, value: number): boolean {
  if (index < 0 || !editable(d, grid)) return false;
  if (grid === 'tieup' && index >= d.treadles) return false;
  const limit = grid === 'treadling' ? d.treadles : d.shafts;
  return value >= 1 && value <= limit;
}

export interface CellArgs {
  grid: ListGridId;
  /** 0-based end, treadle or pick. */
  index: number;
  /** 1-based shaft or treadle. */
  value: number;
  on: boolean;
  /** Replace what the entry holds instead of adding to it (one shaft per end, one treadle per pick). */
  single?: boolean;
}

/** Marks or clears one cell of threading, tie-up, treadling or lift plan. */
export const setCell = edit<CellArgs>('Draw', (d, { grid, index, value, on, single }) => {
  if (!inRange(grid, d, index, value)) return;
  if (on) ensureIndex(d, grid, index);
  const list = listOf(d, grid);
  const entry = list[index];
  if (!entry) return;
  const has = entry.includes(value);
  if (on) {
    if (single) {
      if (entry.length !== 1 || !has) list[index] = [value];
    } else if (!has) {
      entry.push(value);
      entry.sort(byNumber);
    }
  } else if (has) {
    list[index] = entry.filter((v) => v !== value);
  }
});

export interface PaintArgs {
  grid: ThreadRowId;
  from: number;
  to: number;
  /** A palette index for the colour rows, a 1-based layer for the layer rows. */
  color: number;
}

/** Paints a run of ends or picks in one colour (or layer), growing the draft if the run reaches past it. */
export const paintColor = edit<PaintArgs>('Paint', (d, { grid, from, to, color }) => {
  if (!fitsRow(d as Draft, grid, color)) return;
  const a = Math.max(0, Math.min(from, to));
  const b = Math.max(from, to);
  ensureIndex(d, grid, b);
  const list = threadRow(d, grid);
  for (let i = a; i <= b; i++) if (list[i] !== color) list[i] = color;
});

export interface LayerFillArgs {
  axis: 'ends' | 'picks';
  /** How to fill: alternate layers 1, 2 over from..to; every thread of a colour; every end on shafts low..high. */
  by: { kind: 'alternate'; from: number; to: number } | { kind: 'colour'; colour: number; layer: number } | { kind: 'shaft'; low: number; high: number; layer: number };
}

/** The layer rows' quick fills: alternate 1-2, by colour, by shaft (ends only). */
export const fillLayers = edit<LayerFillArgs>('Layer order', (d, { axis, by }) => {
  const draft = original(d) as Draft;
  const ends = axis === 'ends';
  const count = ends ? draft.threading.length : picksIn(draft);
  const current = ends ? draft.warpLayers : draft.weftLayers;
  let next: number[];
  if (by.kind === 'alternate') next = alternateLayers(current, count, by.from, by.to);
  else if (by.kind === 'colour') next = layersByColour(current, ends ? draft.warpColors : draft.weftColors, by.colour, by.layer);
  else if (ends) next = layersByShaft(current, draft.threading, by.low, by.high, by.layer);
  else return;
  const before = resolveLayerList(current, count);
  if (current.length === count && next.every((v, i) => v === before[i])) return;
  if (ends) d.warpLayers = next;
  else d.weftLayers = next;
});

export interface RangeArgs {
  grid: GridId;
  from: number;
  to: number;
}

/** Clears every cell of the entries from..to (colour orders are left as they are). */
export const eraseRange = edit<RangeArgs>('Erase', (d, { grid, from, to }) => {
  if (isThreadRow(grid) || !editable(d, grid)) return;
  const list = listOf(d, grid);
  for (let i = Math.max(0, from); i <= Math.min(to, list.length - 1); i++) if (list[i].length > 0) list[i] = [];
});

export interface ThreadArgs {
  axis: 'ends' | 'picks';
  at: number;
  count: number;
}

/** Inserts empty ends or picks before `at`. */
export const insertThreadsEdit = edit<ThreadArgs>('Insert', (d, { axis, at, count }) => insertThreads(d, axis, at, count));

export interface DeleteArgs {
  axis: 'ends' | 'picks';
  from: number;
  to: number;
}

/** Deletes ends or picks from..to with their colours, layers and block links. */
export const deleteThreadsEdit = edit<DeleteArgs>('Delete', (d, { axis, from, to }) => deleteThreads(d, axis, from, to));

/** Reverses the order of the entries from..to (a run read backwards). */
export const reverseRange = edit<RangeArgs>('Reverse', (d, { grid, from, to }) => {
  if (!editable(d, grid)) return;
  const list: unknown[] = isThreadRow(grid) ? threadRow(d, grid) : listOf(d, grid);
  const a = Math.max(0, from);
  const b = Math.min(to, list.length - 1);
  if (b <= a) return;
  const slice = reverse(list.slice(a, b + 1));
  if (slice.every((v, i) => v === list[a + i])) return;
  list.splice(a, slice.length, ...slice);
});

export interface FlipArgs {
  grid: ListGridId;
  from: number;
  to: number;
  /** 1-based lowest and highest value of the band flipped (e.g. shafts 1–8). */
  low: number;
  high: number;
}

/** Flips the entries from..to upside down within the band low..high (shaft s becomes low + high − s). */
export const flipRange = edit<FlipArgs>('Upside down', (d, { grid, from, to, low: l, high: h }) => {
  if (!editable(d, grid)) return;
  const limit = grid === 'treadling' ? d.treadles : d.shafts;
  const low = Math.max(1, Math.min(l, h));
  const high = Math.min(limit, Math.max(l, h));
  const list = listOf(d, grid);
  for (let i = Math.max(0, from); i <= Math.min(to, list.length - 1); i++) {
    const entry = list[i];
    if (!entry.some((v) => v >= low && v <= high)) continue;
    list[i] = entry.map((v) => (v >= low && v <= high ? low + high - v : v)).sort(byNumber);
  }
});

/** What the editor copies: one entry per end/pick/treadle (values), or one colour per end/pick. */
export type Clip = { kind: 'lists'; entries: number[][] } | { kind: 'colors'; entries: number[] };

/** The entries from..to of a grid, to paste elsewhere. */
export function copyRange(draft: Draft, { grid, from, to }: RangeArgs): Clip {
  const a = Math.max(0, from);
  if (isThreadRow(grid)) {
    return { kind: 'colors', entries: readThreadRow(draft, grid).slice(a, to + 1) };
  }
  const list =
    grid === 'threading' ? draft.threading : grid === 'tieup' ? draft.tieup : grid === 'treadling' ? draft.treadling : draft.liftplan;
  return { kind: 'lists', entries: list.slice(a, to + 1).map((e) => [...e]) };
}

export interface PasteArgs {
  grid: GridId;
  at: number;
  clip: Clip;
}

/**
 * Writes a copied run over the entries from `at`, growing ends or picks as needed. Values above the
 * target grid's count (a shaft 8 pasted into a 6-treadle treadling) are dropped.
 */
export const pasteClip = edit<PasteArgs>('Paste', (d, { grid, at, clip }) => {
  if (clip.entries.length === 0 || at < 0 || !editable(d, grid)) return;
  const last = at + clip.entries.length - 1;
  if (isThreadRow(grid)) {
    if (clip.kind !== 'colors') return;
    ensureIndex(d, grid, last);
    const list = threadRow(d, grid);
    clip.entries.forEach((c, i) => {
      if (fitsRow(d as Draft, grid, c) && list[at + i] !== c) list[at + i] = c;
    });
    return;
  }
  if (clip.kind !== 'lists') return;
  const limit = grid === 'treadling' ? d.treadles : d.shafts;
  ensureIndex(d, grid, last);
  const list = listOf(d, grid);
  clip.entries.forEach((entry, i) => {
    const index = at + i;
    if (index >= list.length) return; // the tie-up does not grow by pasting
    const next = [...new Set(entry.filter((v) => v >= 1 && v <= limit))].sort(byNumber);
    const old = list[index];
    if (old.length !== next.length || old.some((v, k) => v !== next[k])) list[index] = next;
  });
});

/** Sets the shaft count (1–32); shafts above the new count are taken out of every list. */
export const setShafts = edit<{ shafts: number }>('Number of shafts', (d, { shafts }) => {
  const n = Math.max(1, Math.min(MAX_SHAFTS, Math.round(shafts)));
  if (n === d.shafts) return;
  if (n < d.shafts) {
    for (const list of [d.threading, d.tieup, d.liftplan]) {
      for (let i = 0; i < list.length; i++) if (list[i].some((s) => s > n)) list[i] = list[i].filter((s) => s <= n);
    }
  }
  d.shafts = n;
});

/** Sets the treadle count (1–32); the tie-up grows or shrinks and the treadling loses treadles above it. */
export const setTreadles = edit<{ treadles: number }>('Number of treadles', (d, { treadles }) => {
  const n = Math.max(1, Math.min(MAX_TREADLES, Math.round(treadles)));
  if (n === d.treadles) return;
  if (n < d.treadles) {
    d.tieup.splice(n);
    for (let i = 0; i < d.treadling.length; i++) {
      if (d.treadling[i].some((t) => t > n)) d.treadling[i] = d.treadling[i].filter((t) => t <= n);
    }
  } else {
    while (d.tieup.length < n) d.tieup.push([]);
  }
  d.treadles = n;
});

const HEX = /^#[0-9a-f]{6}$/;

/** Changes one palette colour ('#rrggbb'); every end and pick in it changes with it. */
export const setPaletteColor = edit<{ index: number; color: string }>('Colour change', (d, { index, color }) => {
  const hex = color.toLowerCase();
  if (!HEX.test(hex) || index < 0 || index >= d.palette.length || d.palette[index] === hex) return;
  d.palette[index] = hex;
});

/** Adds a colour at the end of the palette. */
export const addPaletteColor = edit<{ color: string }>('Add colour', (d, { color }) => {
  const hex = color.toLowerCase();
  if (HEX.test(hex)) d.palette.push(hex);
});

/**
 * Takes a colour out of the palette. Ends, picks and yarns in it move to `replaceWith` (colour 0 by
 * default); the last colour cannot go.
 */
export const removePaletteColor = edit<{ index: number; replaceWith?: number }>('Remove colour', (d, { index, replaceWith = 0 }) => {
  const n = d.palette.length;
  if (n <= 1 || index < 0 || index >= n) return;
  const target = replaceWith === index ? (index === 0 ? 1 : 0) : Math.max(0, Math.min(n - 1, replaceWith));
  // Indices above the removed one shift down by one.
  const remap = (c: number) => {
    const v = c === index ? target : c;
    return v > index ? v - 1 : v;
  };
  for (const list of [d.warpColors, d.weftColors]) {
    for (let i = 0; i < list.length; i++) {
      const v = remap(list[i]);
      if (v !== list[i]) list[i] = v;
    }
  }
  d.yarns = d.yarns.filter((y) => y.color !== index);
  for (const y of d.yarns) if (y.color > index) y.color -= 1;
  d.palette.splice(index, 1);
});

/** Names the yarn shown in a palette colour; an empty name removes the yarn. */
export const setYarnName = edit<{ color: number; name: string }>('Yarn name', (d, { color, name }) => {
  if (color < 0 || color >= d.palette.length) return;
  const trimmed = name.trim().slice(0, 200);
  const i = d.yarns.findIndex((y) => y.color === color);
  if (trimmed === '') {
    if (i >= 0) d.yarns.splice(i, 1);
    return;
  }
  if (i >= 0) {
    if (d.yarns[i].name !== trimmed) d.yarns[i].name = trimmed;
    return;
  }
  const ids = new Set(d.yarns.map((y) => y.id));
  let n = d.yarns.length + 1;
  while (ids.has(`yarn-${n}`)) n++;
  d.yarns.push({ id: `yarn-${n}`, name: trimmed, color });
});

/** Renames the draft. */
export const renameDraft = edit<{ name: string }>('Rename', (d, { name }) => {
  const trimmed = name.slice(0, 200);
  if (trimmed !== d.name) d.name = trimmed;
});

/** Takes the whole result of an engine function, assigning only the fields it changed (small patches). */
function wholeEdit<A>(label: string | ((args: A) => string), fn: (draft: Draft, args: A) => Draft): Edit<A> {
  return edit<A>(label, (d, args) => {
    const base = original(d) as Draft;
    const next = fn(base, args);
    if (next === base) return;
    const target = d as unknown as Record<string, unknown>;
    for (const [key, value] of Object.entries(next)) {
      if ((base as unknown as Record<string, unknown>)[key] !== value) target[key] = value;
    }
    for (const key of Object.keys(base)) if (!(key in next)) delete target[key];
  });
}

export type RunKind = 'straight' | 'point' | 'broken';

export interface FillArgs {
  grid: ListGridId;
  from: number;
  to: number;
  /** 1-based band of shafts (or treadles) the run climbs through. */
  low: number;
  high: number;
  kind: RunKind;
}

/** The engine's draw of this kind on `n` shafts, as one repeat. */
function drawOf(kind: RunKind, n: number): number[] {
  if (kind === 'point') return pointDraw(n);
  if (kind === 'broken') return n >= 4 ? brokenDraw(n) : straightDraw(n);
  return straightDraw(n);
}

/** The trade's name for each kind of draw the fill writes. */
export const DRAW_NAMES: Record<RunKind, string> = { straight: 'Straight draw', point: 'Point draw', broken: 'Broken draw' };

/** Fills the entries from..to with a straight, point or broken draw over the shafts low..high. */
export const fillRun = edit<FillArgs>(({ kind }) => DRAW_NAMES[kind], (d, { grid, from, to, low, high, kind }) => {
  const limit = grid === 'treadling' ? d.treadles : d.shafts;
  const lo = Math.max(1, Math.min(low, high));
  const hi = Math.min(limit, Math.max(low, high));
  const a = Math.max(0, Math.min(from, to));
  const b = Math.max(from, to);
  if (hi < lo || !editable(d, grid) || (grid === 'tieup' && b >= d.treadles)) return;
  const unit = drawOf(kind, hi - lo + 1).map((v) => v + lo - 1);
  const count = b - a + 1;
  const run = repeat(unit, Math.ceil(count / unit.length)).slice(0, count);
  ensureIndex(d, grid, b);
  const list = listOf(d, grid);
  run.forEach((v, i) => {
    const old = list[a + i];
    if (old.length !== 1 || old[0] !== v) list[a + i] = [v];
  });
});

/** Ends (or picks) from..to whole: their list entries with colours, layers and block links. */
interface ThreadRun {
  entries: unknown[][];
}

function threadRun(d: D, axis: 'ends' | 'picks', from: number, to: number): ThreadRun {
  const main = axis === 'ends' ? d.threading : pickList(d);
  const lists: unknown[][] = [main, ...(axis === 'ends' ? endLists(d) : pickLists(d)).map((l) => l.list)];
  // Read the plain arrays, not immer proxies, so the copies carry no drafts.
  return { entries: lists.map((l) => ((isDraft(l) ? original(l) : l) as unknown[]).slice(from, to + 1)) };
}

/** Writes a run of whole threads from `at`, over what is there, growing the draft to hold it. */
function writeRun(d: D, axis: 'ends' | 'picks', at: number, run: ThreadRun): void {
  const length = run.entries[0]?.length ?? 0;
  if (length === 0) return;
  ensureIndex(d, axis === 'ends' ? 'threading' : 'weftColors', at + length - 1);
  const main = axis === 'ends' ? d.threading : pickList(d);
  const lists: unknown[][] = [main, ...(axis === 'ends' ? endLists(d) : pickLists(d)).map((l) => l.list)];
  lists.forEach((list, k) => {
    run.entries[k].forEach((v, i) => {
      if (list[at + i] !== v) list[at + i] = v;
    });
  });
}

export interface RepeatArgs {
  axis: 'ends' | 'picks';
  from: number;
  to: number;
  /** Copies written after the run. */
  times: number;
}

/** Writes `times` more copies of ends (or picks) from..to straight after them, colours and all. */
export const repeatRun = edit<RepeatArgs>('Repeat', (d, { axis, from, to, times }) => {
  const a = Math.max(0, Math.min(from, to));
  const b = Math.max(from, to);
  const run = threadRun(d, axis, a, b);
  if ((run.entries[0]?.length ?? 0) === 0 || times < 1) return;
  writeRun(d, axis, b + 1, { entries: run.entries.map((list) => repeat(list, Math.min(times, 1000))) });
});

export interface ChangeRepeatArgs {
  grid: 'threading' | ThreadRowId;
  from: number;
  to: number;
  /** K: the run K times, then its change K times. */
  times: number;
  change: RunChange;
}

/**
 * Repeat with a change, in one row (the threading, or a colour or layer row) from the run on: the
 * run K times, its changed copy K times, and so on across the rest of the warp (or weft), at least
 * once each. Other rows are left as they are.
 */
export const repeatWithChangeRun = edit<ChangeRepeatArgs>('Repeat with a change', (d, { grid, from, to, times, change }) => {
  const a = Math.max(0, Math.min(from, to));
  const b = Math.max(from, to);
  const draft = original(d) as Draft;
  const length = grid === 'threading' ? draft.threading.length : axisOf(grid) === 'ends' ? draft.threading.length : picksIn(draft);
  const source: readonly unknown[] = grid === 'threading' ? draft.threading : readThreadRow(draft, grid);
  const run = source.slice(a, Math.min(b, length - 1) + 1);
  const k = Math.max(1, Math.min(times, 1000));
  if (run.length === 0) return;
  const pair = 2 * k * run.length;
  const out = repeatWithChange(run, k, change, Math.max(1, Math.ceil((length - a) / pair)));
  const total = Math.max(pair, Math.min(out.length, length - a));
  ensureIndex(d, grid, a + total - 1);
  const list: unknown[] = grid === 'threading' ? d.threading : threadRow(d, grid);
  for (let i = 0; i < total; i++) if (list[a + i] !== out[i]) list[a + i] = out[i];
});

/** Follows ends (or picks) from..to with their mirror image, the last one shared as the centre (a point repeat). */
export const mirrorRun = edit<RangeArgs & { axis: 'ends' | 'picks' }>('Mirror', (d, { axis, from, to }) => {
  const a = Math.max(0, Math.min(from, to));
  const b = Math.max(from, to);
  const run = threadRun(d, axis, a, b);
  const n = run.entries[0]?.length ?? 0;
  if (n < 2) return;
  writeRun(d, axis, a + n, { entries: run.entries.map((list) => mirror(list).slice(n)) });
});

/** Treadling follows the threading, end for pick (the engine's treadle as drawn in). */
export const treadleAsDrawnInEdit = wholeEdit<void>('Treadle as drawn in', (draft) =>
  draft.control === 'treadling' ? treadleDraftAsDrawnIn(draft) : draft,
);

/** Switches the picks to a lift plan worked out from tie-up and treadling. */
export const toLiftPlanEdit = wholeEdit<void>('Change to a lift plan', (draft) => toLiftPlanDraft(draft));

/**
 * Switches the picks to tie-up and treadling for a loom with `treadles` treadles; the result says
 * why when it cannot be done (see {@link tryTreadling}), and the draft is left as it is.
 */
export const toTreadlingEdit = wholeEdit<{ treadles: number }>('Change to tie-up and treadling', (draft, { treadles }) => {
  const result = toTreadlingDraft(draft, treadles);
  return result.ok ? result.draft : draft;
});

/** Whether the draft can be woven on `treadles` treadles, and why not. */
export function tryTreadling(draft: Draft, treadles: number): { ok: true } | { ok: false; reason: string } {
  const result = toTreadlingDraft(draft, treadles);
  return result.ok ? { ok: true } : result;
}

/** Replaces the whole draft (an expanded profile, say) as one undoable edit. */
export const replaceDraft = wholeEdit<{ draft: Draft }>('Replace the draft', (_draft, { draft }) => draft);

/** Sets how the draft is laid out (end 1's side, threading, treadling, shaft 1): the arrangement every view and print follows. */
export const arrangeEdit = edit<DraftArrangement>('Change the arrangement', (d, a) => {
  d.arrangement = { ...a };
});
