import { describe, expect, it, vi } from 'vitest';
import { createEditor } from '../../../src/features/editor/store/editor';
import { handleKey, type KeyLike } from '../../../src/features/editor/store/commands';
import { twill } from './fixtures';

const key = (k: string, shiftKey = false): KeyLike => ({ key: k, shiftKey, ctrlKey: false, metaKey: false, altKey: false });

describe('keyboard selection', () => {
  it('a plain arrow clears the selection, so Shift+arrow then selects from the cursor', () => {
    const editor = createEditor(twill(), {}, { confirm: () => true });
    handleKey(editor, key('ArrowRight', true));
    handleKey(editor, key('ArrowRight', true));
    expect(editor.view.get().selection).toMatchObject({ from: { col: 0 }, to: { col: 2 } });
    for (let i = 0; i < 3; i++) handleKey(editor, key('ArrowRight'));
    expect(editor.view.get().selection).toBeNull();
    handleKey(editor, key('ArrowRight', true));
    expect(editor.view.get().selection).toMatchObject({ from: { col: 5 }, to: { col: 6 } });
    // Delete then takes the two selected ends only.
    handleKey(editor, key('Delete'));
    expect(editor.doc.get().draft.threading).toHaveLength(6);
  });
});

describe('edits that remove most of the draft', () => {
  it('ask first, with the counts, and keep the draft when the weaver says no', () => {
    const confirm = vi.fn(() => false);
    const editor = createEditor(twill(), {}, { confirm });
    const before = editor.doc.get().draft;
    editor.setView({ selection: { grid: 'threading', from: { grid: 'threading', col: 0, row: 0 }, to: { grid: 'threading', col: 7, row: 0 } } });
    editor.remove();
    expect(confirm).toHaveBeenCalledWith('This removes all 8 ends. Remove them?');
    expect(editor.doc.get().draft).toBe(before);
    expect(editor.doc.get().undoLabel).toBeNull();
    expect(editor.view.get().message).toBe('Nothing deleted.');
  });

  it('go ahead when the weaver says yes, as one undo step', () => {
    const editor = createEditor(twill(), {}, { confirm: () => true });
    editor.setView({ selection: { grid: 'treadling', from: { grid: 'treadling', col: 0, row: 1 }, to: { grid: 'treadling', col: 0, row: 5 } } });
    editor.remove();
    expect(editor.doc.get().draft.treadling).toHaveLength(3);
    editor.undo();
    expect(editor.doc.get().draft.treadling).toHaveLength(8);
  });

  it('do not ask for half or less', () => {
    const confirm = vi.fn(() => false);
    const editor = createEditor(twill(), {}, { confirm });
    editor.setView({ selection: { grid: 'threading', from: { grid: 'threading', col: 0, row: 0 }, to: { grid: 'threading', col: 3, row: 0 } } });
    editor.remove();
    expect(confirm).not.toHaveBeenCalled();
    expect(editor.doc.get().draft.threading).toHaveLength(4);
  });
});
