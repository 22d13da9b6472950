import type { Editor, Tool } from './editor';
import { DRAW_NAMES } from './edits';

/**
 * The editor's commands, each written once: its name, its key, whether it can run now and what it
 * does. The toolbar buttons, their tooltips, the Keys panel and the key handler are all drawn from
 * this list, so a shortcut cannot say one thing on a button and another in Keys.
 */
export interface Command {
  /** The button's words. */
  label: string;
  /** The key as the weaver presses it, shown in Keys and in the tooltip; absent for button-only commands. */
  keys?: string;
  /** What it does, in a sentence for the Keys panel. */
  does: string;
  /** False when it changes the draft, so a read-only draft offers only moving about. */
  readOnly?: boolean;
  match?(e: KeyLike): boolean;
  /**
   * Whether its button is offered now (disabled otherwise). Omitted means always. A key press runs the
   * command regardless, so the weaver hears why nothing happened ("Nothing to undo.").
   */
  enabled?(editor: Editor): boolean;
  run(editor: Editor, e?: KeyLike): void;
}

/** The parts of a KeyboardEvent the commands read (so tests can pass plain objects). */
export interface KeyLike {
  key: string;
  shiftKey: boolean;
  ctrlKey: boolean;
  metaKey: boolean;
  altKey: boolean;
}

const mod = (e: KeyLike) => e.ctrlKey || e.metaKey;
const plain = (key: string) => (e: KeyLike) => !mod(e) && !e.altKey && e.key.toLowerCase() === key;
const zoom = (editor: Editor, factor: number) => {
  const cell = editor.view.get().cell;
  editor.setView({ cell: Math.max(1, Math.min(40, Math.round(factor > 1 ? cell * factor + 0.5 : cell * factor))) });
};
const ARROWS: Record<string, [number, number]> = { ArrowLeft: [-1, 0], ArrowRight: [1, 0], ArrowUp: [0, -1], ArrowDown: [0, 1] };
const noKey: KeyLike = { key: '', shiftKey: false, ctrlKey: false, metaKey: false, altKey: false };
const tool = (id: Tool, label: string, key: string): Command => ({
  label,
  keys: key,
  does: `${label} tool`,
  match: plain(key.toLowerCase()),
  run: (ed) => ed.setView({ tool: id, message: `${label}.` }),
});

const DEFINITIONS = {
  move: {
    label: 'Move',
    keys: 'Arrow keys',
    does: 'Move the cell cursor; with Shift, select',
    readOnly: true,
    match: (e) => e.key in ARROWS && !mod(e),
    run: (ed, e = noKey) => {
      const [dc, dr] = ARROWS[e.key] ?? [0, 0];
      // With end 1 on the right, the ends' grids run right to left: the arrow moves the way it points.
      const v = ed.view.get();
      const across = v.arrangement.endOneRight && ['threading', 'warpColors', 'warpLayers'].includes(v.cursor.grid) ? -dc : dc;
      ed.moveCursor(across, dr, e.shiftKey);
    },
  },
  mark: {
    label: 'Mark',
    keys: 'Space or Enter',
    does: 'Mark or clear the cell (Alt adds a second shaft or treadle)',
    match: (e) => (e.key === ' ' || e.key === 'Enter') && !mod(e),
    run: (ed, e = noKey) => ed.toggleAtCursor({ add: e.altKey }),
  },
  nextGrid: {
    label: 'Next grid',
    keys: '[ and ]',
    does: 'Previous or next grid',
    readOnly: true,
    match: (e) => (e.key === '[' || e.key === ']') && !mod(e),
    run: (ed, e = noKey) => ed.focusGrid(e.key === '[' ? -1 : 1),
  },
  draw: tool('draw', 'Draw', 'D'),
  erase: tool('erase', 'Erase', 'E'),
  select: tool('select', 'Select', 'S'),
  clearSelection: { label: 'Clear the selection', keys: 'Escape', does: 'Clear the selection', readOnly: true, match: (e) => e.key === 'Escape', run: (ed) => ed.setView({ selection: null, highlight: null }) },
  undo: {
    label: 'Undo',
    keys: 'Ctrl/⌘ Z',
    does: 'Undo the last edit',
    match: (e) => mod(e) && !e.shiftKey && e.key.toLowerCase() === 'z',
    enabled: (ed) => ed.doc.get().undoLabel !== null,
    run: (ed) => ed.undo(),
  },
  redo: {
    label: 'Redo',
    keys: 'Shift Ctrl/⌘ Z or Ctrl Y',
    does: 'Redo what was undone',
    match: (e) => mod(e) && ((e.shiftKey && e.key.toLowerCase() === 'z') || e.key.toLowerCase() === 'y'),
    enabled: (ed) => ed.doc.get().redoLabel !== null,
    run: (ed) => ed.redo(),
  },
  straightDraw: { label: DRAW_NAMES.straight, keys: '1', does: 'Fill the selection with a straight draw', match: plain('1'), run: (ed) => ed.fill('straight') },
  pointDraw: { label: DRAW_NAMES.point, keys: '2', does: 'Fill the selection with a point draw', match: plain('2'), run: (ed) => ed.fill('point') },
  brokenDraw: { label: DRAW_NAMES.broken, keys: '3', does: 'Fill the selection with a broken draw', match: plain('3'), run: (ed) => ed.fill('broken') },
  repeat: { label: 'Repeat', keys: 'P', does: 'Repeat the selection after itself', match: plain('p'), run: (ed) => ed.repeatSelection(1) },
  mirror: { label: 'Mirror', keys: 'M', does: 'Mirror the selection into a point repeat', match: plain('m'), run: (ed) => ed.mirror() },
  reverse: { label: 'Reverse', keys: 'R', does: 'Reverse the selection', match: plain('r'), run: (ed) => ed.reverse() },
  upsideDown: { label: 'Upside down', keys: 'F', does: 'Turn the selection upside down', match: plain('f'), run: (ed) => ed.flip() },
  insert: { label: 'Insert', keys: 'I', does: 'Insert an end or pick before the cursor', match: (e) => plain('i')(e) || e.key === 'Insert', run: (ed) => ed.insert(1) },
  delete: { label: 'Delete', keys: 'Delete', does: 'Delete the selected ends or picks', match: (e) => e.key === 'Delete', run: (ed) => ed.remove() },
  eraseSelection: { label: 'Erase the selection', keys: 'Backspace', does: 'Erase the selection', match: (e) => e.key === 'Backspace' && !mod(e), run: (ed) => ed.erase() },
  treadleAsDrawnIn: {
    label: 'Treadle as drawn in',
    keys: 'T',
    does: 'Treadle as drawn in',
    match: plain('t'),
    enabled: (ed) => ed.doc.get().draft.control === 'treadling',
    run: (ed) => ed.treadleAsDrawnIn(),
  },
  copy: { label: 'Copy', keys: 'Ctrl/⌘ C', does: 'Copy the selection', readOnly: true, match: (e) => mod(e) && e.key.toLowerCase() === 'c', run: (ed) => ed.copy() },
  paste: { label: 'Paste', keys: 'Ctrl/⌘ V', does: 'Paste at the cursor', match: (e) => mod(e) && e.key.toLowerCase() === 'v', run: (ed) => ed.paste() },
  zoom: {
    label: 'Zoom',
    keys: '+ and −',
    does: 'Zoom in and out',
    readOnly: true,
    match: (e) => !mod(e) && (e.key === '+' || e.key === '=' || e.key === '-'),
    run: (ed, e = noKey) => zoom(ed, e.key === '-' ? 0.8 : 1.25),
  },
} satisfies Record<string, Command>;

export type CommandId = keyof typeof DEFINITIONS;
export const COMMANDS: Record<CommandId, Command> = DEFINITIONS;

/** Every command with a key, in the order the Keys panel lists them. */
export const SHORTCUTS: Command[] = Object.values(COMMANDS).filter((c) => c.keys !== undefined);

/** The tooltip of a command's button: what it does and its key. */
export function tooltipOf(command: Command): string {
  return command.keys ? `${command.does} (${command.keys})` : command.does;
}

/**
 * Runs the command for a key press; returns true when one matched (the caller then prevents the
 * default). On a read-only draft only the commands that leave it unchanged answer.
 */
export function handleKey(editor: Editor, e: KeyLike, { readOnly = false }: { readOnly?: boolean } = {}): boolean {
  const command = SHORTCUTS.find((c) => c.match?.(e) && (!readOnly || c.readOnly));
  if (!command) return false;
  command.run(editor, e);
  return true;
}
