import type { Editor } from './editor';

/** One keyboard shortcut: what the Keys panel shows and what pressing it does. */
export interface Shortcut {
  keys: string;
  does: string;
  match(e: KeyLike): boolean;
  run(editor: Editor, e: KeyLike): void;
}

/** The parts of a KeyboardEvent the shortcuts read (so tests can pass plain objects). */
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

export const SHORTCUTS: Shortcut[] = [
  {
    keys: 'Arrow keys',
    does: 'Move the cell cursor; with Shift, select',
    match: (e) => e.key in ARROWS && !mod(e),
    run: (ed, e) => {
      const [dc, dr] = ARROWS[e.key];
      ed.moveCursor(dc, dr, e.shiftKey);
    },
  },
  { keys: 'Space or Enter', does: 'Mark or clear the cell (Alt adds a second shaft or treadle)', match: (e) => (e.key === ' ' || e.key === 'Enter') && !mod(e), run: (ed, e) => ed.toggleAtCursor({ add: e.altKey }) },
  { keys: '[ and ]', does: 'Previous or next grid', match: (e) => (e.key === '[' || e.key === ']') && !mod(e), run: (ed, e) => ed.focusGrid(e.key === ']' ? 1 : -1) },
  { keys: 'D', does: 'Draw tool', match: plain('d'), run: (ed) => ed.setView({ tool: 'draw', message: 'Draw.' }) },
  { keys: 'E', does: 'Erase tool', match: plain('e'), run: (ed) => ed.setView({ tool: 'erase', message: 'Erase.' }) },
  { keys: 'S', does: 'Select tool', match: plain('s'), run: (ed) => ed.setView({ tool: 'select', message: 'Select.' }) },
  { keys: 'Escape', does: 'Clear the selection', match: (e) => e.key === 'Escape', run: (ed) => ed.setView({ selection: null, highlight: null }) },
  { keys: '1', does: 'Straight run over the selection', match: plain('1'), run: (ed) => ed.fill('straight') },
  { keys: '2', does: 'Point run over the selection', match: plain('2'), run: (ed) => ed.fill('point') },
  { keys: '3', does: 'Broken run over the selection', match: plain('3'), run: (ed) => ed.fill('broken') },
  { keys: 'P', does: 'Repeat the selection once after itself', match: plain('p'), run: (ed) => ed.repeatSelection(1) },
  { keys: 'M', does: 'Mirror the selection (point repeat)', match: plain('m'), run: (ed) => ed.mirror() },
  { keys: 'R', does: 'Reverse the selection', match: plain('r'), run: (ed) => ed.reverse() },
  { keys: 'F', does: 'Turn the selection upside down', match: plain('f'), run: (ed) => ed.flip() },
  { keys: 'I', does: 'Insert an end or pick before the cursor', match: (e) => plain('i')(e) || e.key === 'Insert', run: (ed) => ed.insert(1) },
  { keys: 'Delete', does: 'Delete the selected ends or picks', match: (e) => e.key === 'Delete', run: (ed) => ed.remove() },
  { keys: 'Backspace', does: 'Erase the selection', match: (e) => e.key === 'Backspace' && !mod(e), run: (ed) => ed.erase() },
  { keys: 'T', does: 'Treadle as drawn in', match: plain('t'), run: (ed) => ed.treadleAsDrawnIn() },
  { keys: 'Ctrl/⌘ C', does: 'Copy', match: (e) => mod(e) && e.key.toLowerCase() === 'c', run: (ed) => ed.copy() },
  { keys: 'Ctrl/⌘ V', does: 'Paste at the cursor', match: (e) => mod(e) && e.key.toLowerCase() === 'v', run: (ed) => ed.paste() },
  { keys: 'Ctrl/⌘ Z', does: 'Undo', match: (e) => mod(e) && !e.shiftKey && e.key.toLowerCase() === 'z', run: (ed) => ed.undo() },
  {
    keys: 'Shift Ctrl/⌘ Z or Ctrl Y',
    does: 'Redo',
    match: (e) => mod(e) && ((e.shiftKey && e.key.toLowerCase() === 'z') || e.key.toLowerCase() === 'y'),
    run: (ed) => ed.redo(),
  },
  { keys: '+ and −', does: 'Zoom in and out', match: (e) => !mod(e) && (e.key === '+' || e.key === '=' || e.key === '-'), run: (ed, e) => zoom(ed, e.key === '-' ? 0.8 : 1.25) },
];

/** Runs the shortcut for a key press; returns true when one matched (the caller then prevents the default). */
export function handleKey(editor: Editor, e: KeyLike): boolean {
  const shortcut = SHORTCUTS.find((s) => s.match(e));
  if (!shortcut) return false;
  shortcut.run(editor, e);
  return true;
}
