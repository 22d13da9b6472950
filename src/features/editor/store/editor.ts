import type { Draft, RunChange } from '../../../../shared/weave';
import { CLOTH_VIEW_NAMES, NAMES } from '../../../../shared/words';
import { arrangementFromDraft, draftArrangement, GROW_MARGIN, refAt, type Arrangement } from '../canvas/layout';
import { createStore, type Store } from './create-store';
import { createDraftStore, type DraftStore, type EditGuard } from './draft-store';
import {
  arrangeEdit,
  copyRange,
  deleteThreadsEdit,
  DRAW_NAMES,
  eraseRange,
  fillRun,
  flipRange,
  insertThreadsEdit,
  mirrorRun,
  paintColor,
  pasteClip,
  repeatRun,
  repeatWithChangeRun,
  reverseRange,
  setCell,
  toLiftPlanEdit,
  toTreadlingEdit,
  treadleAsDrawnInEdit,
  tryTreadling,
  type Clip,
  type RunKind,
} from './edits';
import { parseGoTo } from './go-to';
import { axisOf, GRID_LABELS, isListGrid, isThreadRow, visibleGrids, type GridId } from './grids';

export type Tool = 'draw' | 'erase' | 'select';

/** The cloth views, in the order the editor offers them. */
export type ClothView = 'structure' | 'colour' | 'floats' | 'front' | 'back' | 'layers';
export const CLOTH_VIEWS: { id: ClothView; label: string }[] = [
  { id: 'structure', label: CLOTH_VIEW_NAMES.structure },
  { id: 'colour', label: CLOTH_VIEW_NAMES.colour },
  { id: 'floats', label: CLOTH_VIEW_NAMES.floats },
  { id: 'front', label: CLOTH_VIEW_NAMES.front },
  { id: 'back', label: CLOTH_VIEW_NAMES.back },
  { id: 'layers', label: CLOTH_VIEW_NAMES.layers },
];

/** A cell of a grid by its place on screen: column and row within the grid. */
export interface GridCell {
  grid: GridId;
  col: number;
  row: number;
}

/** A block of cells in one grid, corners in screen columns and rows (inclusive, any order). */
export interface Selection {
  grid: GridId;
  from: GridCell;
  to: GridCell;
}

export interface ViewState {
  tool: Tool;
  cursor: GridCell;
  selection: Selection | null;
  /** Palette index painted into the colour orders. */
  color: number;
  /** Layer painted into the layer rows. */
  layer: number;
  /** Show the warp and weft layer rows even while the draft has no layers. */
  layerRows: boolean;
  /** Pixels per cell: zoom. */
  cell: number;
  arrangement: Arrangement;
  /** End and pick numbers every this many threads. */
  rulerStep: 4 | 8 | 10;
  drawdownView: 'structure' | 'colour';
  /** Cloth views open beside the draft. */
  panels: ClothView[];
  /** Show one cloth view at a time (tabs) instead of side by side. */
  oneAtATime: boolean;
  /** Longest float the weaver accepts, in crossings. */
  floatLimit: number;
  /** Repeats of the draft shown across and down in the cloth views. */
  tile: number;
  /** An end or pick picked out from the Checks list. */
  highlight: { axis: 'ends' | 'picks'; index: number } | null;
  scrollX: number;
  scrollY: number;
  /** Goes up on every keyboard move: the canvas then scrolls the cursor into view (and only then). */
  revealCursor: number;
  clip: Clip | null;
  /** Said by the screen reader and shown under the toolbar: what just happened. */
  message: string;
}

export interface Editor {
  doc: DraftStore;
  view: Store<ViewState>;
  /** Shafts from the top or bottom: the view setting, needed to turn rows into shafts. */
  refOf(cell: GridCell): { index: number; value: number };
  setView(patch: Partial<ViewState>): void;
  /** Changes the draft's arrangement (an edit, undone like any other). */
  arrange(patch: Partial<Arrangement>): void;
  pointerDown(cell: GridCell, options?: { extend?: boolean; add?: boolean }): void;
  pointerMove(cell: GridCell): void;
  pointerUp(): void;
  moveCursor(dCol: number, dRow: number, extend?: boolean): void;
  focusGrid(step: 1 | -1): void;
  toggleAtCursor(options?: { add?: boolean }): void;
  fill(kind: RunKind): void;
  repeatSelection(times: number): void;
  /** Repeat with a change on the selected run of the threading or a colour or layer row. */
  repeatWithChange(times: number, change: RunChange): void;
  mirror(): void;
  reverse(): void;
  flip(): void;
  erase(): void;
  insert(count?: number): void;
  remove(): void;
  copy(): void;
  paste(): void;
  treadleAsDrawnIn(): void;
  toLiftPlan(): void;
  /** Switches to tie-up and treadling on a loom with this many treadles; returns why not when it cannot. */
  toTreadling(treadles: number): string | null;
  undo(): void;
  redo(): void;
  jumpTo(axis: 'ends' | 'picks', index: number): void;
  /** Goes to or selects what the weaver typed ("end 120", "picks 10–20"); false when it could not be read. */
  goTo(text: string): boolean;
}

export const DEFAULT_VIEW: ViewState = {
  tool: 'draw',
  cursor: { grid: 'threading', col: 0, row: 0 },
  selection: null,
  color: 0,
  layer: 2,
  layerRows: false,
  cell: 14,
  arrangement: { threadingBelow: false, treadlingLeft: false, shaftsFromTop: false, endOneRight: false },
  rulerStep: 4,
  drawdownView: 'colour',
  panels: ['structure', 'floats'],
  oneAtATime: false,
  floatLimit: 5,
  tile: 2,
  highlight: null,
  scrollX: 0,
  scrollY: 0,
  revealCursor: 0,
  clip: null,
  message: '',
};

/** Rows and columns a grid shows for the draft (with room to grow ends and picks). */
export function gridSize(draft: Draft, grid: GridId): { cols: number; rows: number } {
  const picks = draft.control === 'liftplan' ? draft.liftplan.length : draft.treadling.length;
  switch (grid) {
    case 'threading':
      return { cols: draft.threading.length + GROW_MARGIN, rows: draft.shafts };
    case 'warpColors':
      return { cols: draft.threading.length + GROW_MARGIN, rows: 1 };
    case 'tieup':
      return { cols: Math.max(1, draft.treadles), rows: draft.shafts };
    case 'treadling':
      return { cols: Math.max(1, draft.treadles), rows: picks + GROW_MARGIN };
    case 'liftplan':
      return { cols: draft.shafts, rows: picks + GROW_MARGIN };
    case 'weftColors':
    case 'weftLayers':
      return { cols: 1, rows: picks + GROW_MARGIN };
    case 'warpLayers':
      return { cols: draft.threading.length + GROW_MARGIN, rows: 1 };
  }
}

export const picksOf = (d: Draft): number => (d.control === 'liftplan' ? d.liftplan.length : d.treadling.length);

/**
 * Asks before an edit that removes more than half of the ends or of the picks (one slip of the
 * Delete key once took every end), with the counts in the question.
 */
export function removalGuard(confirm: (question: string) => boolean): EditGuard {
  return (before, after) => {
    const counts: [string, number, number][] = [
      ['ends', before.threading.length, after.threading.length],
      ['picks', picksOf(before), picksOf(after)],
    ];
    for (const [word, was, now] of counts) {
      if (now >= was || was - now <= was / 2) continue;
      const what = now === 0 ? `all ${was} ${word}` : `${was - now} of the ${was} ${word}`;
      if (!confirm(`This removes ${what}. Remove them?`)) return false;
    }
    return true;
  };
}

export interface EditorOptions {
  /** Asks the weaver a yes-or-no question (window.confirm in the browser). */
  confirm?: (question: string) => boolean;
}

const browserConfirm = (question: string) => typeof window === 'undefined' || typeof window.confirm !== 'function' || window.confirm(question);

/**
 * The editor: the open draft with its history, the view state (tool, cursor, selection, zoom — not
 * undoable), and the commands the toolbar, keys and pointer call.
 */
export function createEditor(draft: Draft, initialView: Partial<ViewState> = {}, { confirm = browserConfirm }: EditorOptions = {}): Editor {
  const doc = createDraftStore(draft, removalGuard(confirm));
  const view = createStore<ViewState>({ ...DEFAULT_VIEW, ...initialView, arrangement: arrangementFromDraft(draft) });
  const setView = (patch: Partial<ViewState>) => view.set((v) => ({ ...v, ...patch }));
  // The arrangement is the draft's: the view follows it through loads, undo and redo.
  doc.subscribe(() => {
    const a = arrangementFromDraft(doc.get().draft);
    const v = view.get().arrangement;
    if (a.threadingBelow !== v.threadingBelow || a.treadlingLeft !== v.treadlingLeft || a.shaftsFromTop !== v.shaftsFromTop || a.endOneRight !== v.endOneRight) setView({ arrangement: a });
  });
  const say = (message: string) => setView({ message });

  const refOf = (c: GridCell) => {
    const r = refAt(c.grid, c.col, c.row, doc.get().draft.shafts, view.get().arrangement.shaftsFromTop);
    return { index: r.index, value: r.value };
  };

  /** The selection (or the cursor cell) as index and value ranges of its grid. */
  const target = () => {
    const { selection, cursor } = view.get();
    const s = selection ?? { grid: cursor.grid, from: cursor, to: cursor };
    const a = refOf(s.from);
    const b = refOf(s.to);
    return {
      grid: s.grid,
      from: Math.min(a.index, b.index),
      to: Math.max(a.index, b.index),
      low: Math.min(a.value, b.value),
      high: Math.max(a.value, b.value),
      isSelection: selection !== null,
    };
  };

  // A drag: the grid it started in, whether it marks or clears, and the last cell reached.
  let drag: { grid: GridId; on: boolean; last: GridCell; add: boolean; select: boolean } | null = null;

  const drawCell = (c: GridCell, on: boolean, add: boolean) => {
    const { index, value } = refOf(c);
    if (isThreadRow(c.grid)) {
      const layers = c.grid === 'warpLayers' || c.grid === 'weftLayers';
      if (on) doc.apply(paintColor, { grid: c.grid, from: index, to: index, color: layers ? view.get().layer : view.get().color });
      return;
    }
    // One shaft per end and one treadle per pick unless the weaver asks to add (alt/option).
    const single = !add && (c.grid === 'threading' || c.grid === 'treadling');
    doc.apply(setCell, { grid: c.grid, index, value, on, single });
  };

  const isMarked = (c: GridCell) => {
    const d = doc.get().draft;
    const { index, value } = refOf(c);
    if (!isListGrid(c.grid)) return false;
    const list = c.grid === 'threading' ? d.threading : c.grid === 'tieup' ? d.tieup : c.grid === 'treadling' ? d.treadling : d.liftplan;
    return list[index]?.includes(value) ?? false;
  };

  // Cells between two drag positions, so a fast drag leaves no gaps (one per step along the longer side).
  const between = (a: GridCell, b: GridCell): GridCell[] => {
    const steps = Math.max(Math.abs(b.col - a.col), Math.abs(b.row - a.row));
    const out: GridCell[] = [];
    for (let i = 1; i <= steps; i++) {
      out.push({ grid: a.grid, col: Math.round(a.col + ((b.col - a.col) * i) / steps), row: Math.round(a.row + ((b.row - a.row) * i) / steps) });
    }
    return out;
  };

  const clampCell = (c: GridCell): GridCell => {
    const { cols, rows } = gridSize(doc.get().draft, c.grid);
    return { grid: c.grid, col: Math.max(0, Math.min(cols - 1, c.col)), row: Math.max(0, Math.min(rows - 1, c.row)) };
  };

  const axisOfTarget = (grid: GridId): 'ends' | 'picks' | null => {
    const axis = axisOf(grid);
    return axis === 'treadles' ? null : axis;
  };

  const run = (ok: boolean, done: string, refused: string) => say(ok ? done : refused);

  const editor: Editor = {
    doc,
    view,
    refOf,
    setView,
    pointerDown(cell, { extend = false, add = false } = {}) {
      const v = view.get();
      if (extend || v.tool === 'select') {
        const anchor = extend && v.selection?.grid === cell.grid ? v.selection.from : extend && v.cursor.grid === cell.grid ? v.cursor : cell;
        setView({ selection: { grid: cell.grid, from: anchor, to: cell }, cursor: cell });
        drag = { grid: cell.grid, on: true, last: cell, add, select: true };
        return;
      }
      setView({ cursor: cell, selection: null });
      const on = v.tool === 'draw' && (isThreadRow(cell.grid) || !isMarked(cell));
      doc.beginGesture(v.tool === 'erase' ? 'Erase' : 'Draw');
      drag = { grid: cell.grid, on, last: cell, add, select: false };
      drawCell(cell, on, add);
    },
    pointerMove(cell) {
      if (!drag || cell.grid !== drag.grid) return;
      if (cell.col === drag.last.col && cell.row === drag.last.row) return;
      if (drag.select) {
        const sel = view.get().selection;
        if (sel) setView({ selection: { ...sel, to: cell }, cursor: cell });
      } else {
        // The cursor catches up at pointer up: moving it on every cell would redraw the cursor
        // layer each frame of the drag, and the cells being drawn already show where the pointer is.
        for (const c of between(drag.last, cell)) drawCell(c, drag.on, drag.add);
      }
      drag.last = cell;
    },
    pointerUp() {
      if (drag && !drag.select) {
        doc.endGesture();
        setView({ cursor: drag.last });
      }
      drag = null;
    },
    moveCursor(dCol, dRow, extend = false) {
      const v = view.get();
      const next = clampCell({ ...v.cursor, col: v.cursor.col + dCol, row: v.cursor.row + dRow });
      if (extend) {
        const from = v.selection?.grid === next.grid ? v.selection.from : v.cursor;
        setView({ cursor: next, selection: { grid: next.grid, from, to: next }, revealCursor: v.revealCursor + 1 });
      } else {
        // A plain move leaves the selection behind, so the next Shift+arrow starts from the cursor.
        setView({ cursor: next, selection: null, revealCursor: v.revealCursor + 1 });
      }
      const { index, value } = refOf(next);
      say(describeCell(doc.get().draft, next.grid, index, value, isMarked(next)));
    },
    focusGrid(step) {
      const grids = visibleGrids(doc.get().draft, view.get().layerRows);
      const at = grids.indexOf(view.get().cursor.grid);
      const grid = grids[(at + step + grids.length) % grids.length];
      setView({ cursor: clampCell({ grid, col: 0, row: 0 }), selection: null, revealCursor: view.get().revealCursor + 1 });
      say(`${GRID_LABELS[grid]} grid`);
    },
    toggleAtCursor({ add = false } = {}) {
      const c = view.get().cursor;
      if (view.get().tool === 'erase') drawCell(c, false, add);
      else drawCell(c, isThreadRow(c.grid) || !isMarked(c), add);
      const { index, value } = refOf(c);
      say(describeCell(doc.get().draft, c.grid, index, value, isMarked(c)));
    },
    fill(kind) {
      const t = target();
      if (!isListGrid(t.grid) || !t.isSelection) return say('Select a run of ends or picks first (shift and arrows, or drag with Select).');
      // A one-row selection means "over every shaft (or treadle)".
      const d = doc.get().draft;
      const all = t.low === t.high;
      const high = all ? (t.grid === 'treadling' ? d.treadles : d.shafts) : t.high;
      const low = all ? 1 : t.low;
      run(doc.apply(fillRun, { grid: t.grid, from: t.from, to: t.to, low, high, kind }), `Filled with a ${DRAW_NAMES[kind].toLowerCase()}.`, 'Nothing changed.');
    },
    repeatSelection(times) {
      const t = target();
      const axis = axisOfTarget(t.grid);
      if (!axis) return say('Repeat works on ends or picks.');
      run(doc.apply(repeatRun, { axis, from: t.from, to: t.to, times }), `Repeated ${times} time${times === 1 ? '' : 's'}.`, 'Nothing changed.');
    },
    repeatWithChange(times, change) {
      const t = target();
      if (t.grid !== 'threading' && !isThreadRow(t.grid)) return say('Repeat with a change works on the threading and the colour and layer rows.');
      if (!t.isSelection) return say('Select the run to repeat first (shift and arrows, or drag with Select).');
      run(
        doc.apply(repeatWithChangeRun, { grid: t.grid, from: t.from, to: t.to, times, change }),
        `Repeated ${times} time${times === 1 ? '' : 's'}, then ${change === 'reverse' ? 'reversed' : 'with two values swapped'} ${times} time${times === 1 ? '' : 's'}, across the ${axisOf(t.grid) === 'ends' ? 'warp' : 'weft'}.`,
        'Nothing changed.',
      );
    },
    mirror() {
      const t = target();
      const axis = axisOfTarget(t.grid);
      if (!axis) return say('Mirror works on ends or picks.');
      run(doc.apply(mirrorRun, { axis, grid: t.grid, from: t.from, to: t.to }), 'Mirrored into a point repeat.', 'Select at least two ends or picks to mirror.');
    },
    reverse() {
      const t = target();
      run(doc.apply(reverseRange, { grid: t.grid, from: t.from, to: t.to }), 'Reversed.', 'Select at least two to reverse.');
    },
    flip() {
      const t = target();
      if (!isListGrid(t.grid)) return;
      const d = doc.get().draft;
      const all = t.low === t.high;
      run(
        doc.apply(flipRange, { grid: t.grid, from: t.from, to: t.to, low: all ? 1 : t.low, high: all ? (t.grid === 'treadling' ? d.treadles : d.shafts) : t.high }),
        'Turned upside down.',
        'Nothing changed.',
      );
    },
    erase() {
      const t = target();
      run(doc.apply(eraseRange, { grid: t.grid, from: t.from, to: t.to }), 'Erased.', 'Nothing to erase.');
    },
    insert(count = 1) {
      const t = target();
      const axis = axisOfTarget(t.grid);
      if (!axis) return say('Insert adds ends or picks: move to the threading, treadling or a colour order.');
      run(doc.apply(insertThreadsEdit, { axis, at: t.from, count }), `Inserted ${count} ${axis === 'ends' ? 'end' : 'pick'}${count === 1 ? '' : 's'}.`, 'Nothing inserted.');
    },
    remove() {
      const t = target();
      const axis = axisOfTarget(t.grid);
      if (!axis) return say('Delete removes ends or picks.');
      run(doc.apply(deleteThreadsEdit, { axis, from: t.from, to: t.to }), `Deleted ${axis} ${t.from + 1}–${t.to + 1}.`, 'Nothing deleted.');
      setView({ selection: null });
    },
    copy() {
      const t = target();
      const clip = copyRange(doc.get().draft, { grid: t.grid, from: t.from, to: t.to });
      setView({ clip, message: `Copied ${clip.entries.length} from the ${GRID_LABELS[t.grid].toLowerCase()}.` });
    },
    paste() {
      const { clip } = view.get();
      if (!clip) return say('Nothing copied yet.');
      const t = target();
      run(doc.apply(pasteClip, { grid: t.grid, at: t.from, clip }), 'Pasted.', 'That cannot be pasted here.');
    },
    treadleAsDrawnIn() {
      run(doc.apply(treadleAsDrawnInEdit, undefined), 'Treadled as drawn in.', 'Treadle as drawn in needs tie-up and treadling.');
    },
    toLiftPlan() {
      run(doc.apply(toLiftPlanEdit, undefined), 'Picks now follow a lift plan.', 'The draft already uses a lift plan.');
      const c = view.get().cursor;
      if (c.grid === 'treadling' || c.grid === 'tieup') setView({ cursor: { grid: 'liftplan', col: 0, row: 0 }, selection: null });
    },
    toTreadling(treadles) {
      const draft = doc.get().draft;
      const check = tryTreadling(draft, treadles);
      if (!check.ok) {
        say(check.reason);
        return check.reason;
      }
      doc.apply(toTreadlingEdit, { treadles });
      setView({ cursor: { grid: 'treadling', col: 0, row: 0 }, selection: null, message: `Picks now follow tie-up and treadling on ${treadles} treadles.` });
      return null;
    },
    arrange(patch) {
      const next = { ...view.get().arrangement, ...patch };
      doc.apply(arrangeEdit, draftArrangement(next));
    },
    undo() {
      const label = doc.get().undoLabel;
      say(doc.undo() ? `Undid ${label?.toLowerCase() ?? 'edit'}.` : 'Nothing to undo.');
    },
    redo() {
      const label = doc.get().redoLabel;
      say(doc.redo() ? `Redid ${label?.toLowerCase() ?? 'edit'}.` : 'Nothing to redo.');
    },
    jumpTo(axis, index) {
      const v = view.get();
      const scroll = axis === 'ends' ? { scrollX: Math.max(0, index * v.cell - 4 * v.cell) } : { scrollY: Math.max(0, index * v.cell - 4 * v.cell) };
      const cursor: GridCell = axis === 'ends' ? { grid: 'threading', col: index, row: 0 } : { grid: 'weftColors', col: 0, row: index };
      setView({ highlight: { axis, index }, cursor, selection: null, ...scroll, message: `${axis === 'ends' ? 'End' : 'Pick'} ${index + 1}.` });
    },
    goTo(text) {
      const d = doc.get().draft;
      const asked = parseGoTo(text, d);
      if ('error' in asked) {
        say(asked.error);
        return false;
      }
      const v = view.get();
      // Ends in the threading (on the cursor's shaft row when it is there), picks in the treadling or lift plan.
      const grid: GridId = asked.axis === 'ends' ? 'threading' : d.control === 'liftplan' ? 'liftplan' : 'treadling';
      const at = (index: number): GridCell =>
        asked.axis === 'ends' ? { grid, col: index, row: v.cursor.grid === grid ? v.cursor.row : 0 } : { grid, col: v.cursor.grid === grid ? v.cursor.col : 0, row: index };
      const revealCursor = v.revealCursor + 1;
      if (asked.kind === 'go') {
        setView({ cursor: at(asked.index), selection: null, revealCursor, message: `${asked.axis === 'ends' ? 'End' : 'Pick'} ${asked.index + 1}.` });
      } else {
        const from = at(asked.from);
        setView({ cursor: from, selection: { grid, from, to: at(asked.to) }, revealCursor, message: `${asked.axis === 'ends' ? 'Ends' : 'Picks'} ${asked.from + 1}–${asked.to + 1} selected.` });
      }
      return true;
    },
  };
  return editor;
}

/** The cursor cell in words, for the screen reader. */
export function describeCell(draft: Draft, grid: GridId, index: number, value: number, marked: boolean): string {
  const state = marked ? 'marked' : 'empty';
  switch (grid) {
    case 'threading':
      return `Threading, end ${index + 1}, shaft ${value}: ${state}.`;
    case 'tieup':
      return `Tie-up, treadle ${index + 1}, shaft ${value}: ${state}.`;
    case 'treadling':
      return `Treadling, pick ${index + 1}, treadle ${value}: ${state}.`;
    case 'liftplan':
      return `Lift plan, pick ${index + 1}, shaft ${value}: ${state}.`;
    case 'warpColors':
      return `${NAMES.warpColourOrder}, end ${index + 1}: colour ${(draft.warpColors[index] ?? 0) + 1}.`;
    case 'weftColors':
      return `${NAMES.weftColourOrder}, pick ${index + 1}: colour ${(draft.weftColors[index] ?? 0) + 1}.`;
    case 'warpLayers':
      return `Warp layers, end ${index + 1}: layer ${draft.warpLayers[index] ?? 1}.`;
    case 'weftLayers':
      return `Weft layers, pick ${index + 1}: layer ${draft.weftLayers[index] ?? 1}.`;
  }
}
