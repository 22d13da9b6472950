import { act, fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { findFloats, type Draft } from '../../../shared/weave';
import { DraftEditor } from '../../../src/features/editor';
import { twill } from './fixtures';

/** The editor's keyboard driver: key presses on the focused grid, as a weaver would type them. */
function keyboard(target: HTMLElement) {
  return (key: string, init: Partial<KeyboardEventInit> = {}) => {
    fireEvent.keyDown(target, { key, ...init });
  };
}

describe('DraftEditor', () => {
  it('toggles threading cells from the keyboard, and undoes and redoes them', async () => {
    const saves: Draft[] = [];
    const onSave = vi.fn(async (doc: Draft, base: number) => {
      saves.push(doc);
      return { version: base + 1 };
    });
    render(<DraftEditor draft={twill()} version={3} draftId="test-keys" onSave={onSave} />);
    const grid = screen.getByTestId('draft-canvas');
    grid.focus();
    const press = keyboard(grid);
    const message = () => screen.getByTestId('editor-message').textContent;

    // The cursor starts on end 1 at the bottom row (shaft 4 is drawn at the top, shaft 1 at the bottom).
    press('ArrowDown');
    press('ArrowDown');
    press('ArrowDown');
    expect(message()).toBe('Threading, end 1, shaft 1: marked.');
    press('ArrowUp');
    expect(message()).toBe('Threading, end 1, shaft 2: empty.');
    press(' ');
    expect(message()).toBe('Threading, end 1, shaft 2: marked.');

    press('z', { ctrlKey: true });
    expect(message()).toBe('Undid draw.');
    press('ArrowRight');
    press('ArrowLeft');
    expect(message()).toBe('Threading, end 1, shaft 2: empty.');
    press('z', { ctrlKey: true, shiftKey: true });
    expect(message()).toBe('Redid draw.');

    // Saved after the pause with the version it was based on.
    await act(async () => {
      await new Promise((r) => setTimeout(r, 1200));
    });
    expect(onSave).toHaveBeenCalledTimes(1);
    expect(onSave.mock.calls[0][1]).toBe(3);
    expect(saves[0].threading[0]).toEqual([2]);
    expect(screen.getByTestId('save-status').textContent).toContain('Saved');
  });

  it('selects with shift and arrows and fills a point draw with its key', () => {
    render(<DraftEditor draft={twill({ threading: Array.from({ length: 8 }, () => []) })} version={1} />);
    const grid = screen.getByTestId('draft-canvas');
    const press = keyboard(grid);
    for (let i = 0; i < 5; i++) press('ArrowRight', { shiftKey: true });
    press('2');
    expect(screen.getByTestId('editor-message').textContent).toBe('Filled with a point draw.');
    // The Keys panel lists the shortcut that was just used.
    press('?');
    expect(screen.getByTestId('keys-panel').textContent).toContain('Fill the selection with a point draw');
  });

  it('lists floats over the limit in Checks, and a click jumps to the pick', async () => {
    // Treadle 4 lifts nothing, so picks 4 and 8 pass over every end: weft floats of 8.
    render(<DraftEditor draft={twill({ tieup: [[1, 2], [2, 3], [3, 4], []] })} version={1} />);
    const item = await screen.findByRole('button', { name: /Pick 4 floats over 8 threads/ }, { timeout: 3000 });
    expect(screen.getByRole('button', { name: /Pick 8 floats over 8 threads/ })).toBeTruthy();
    fireEvent.click(item);
    expect(screen.getByTestId('editor-message').textContent).toBe('Pick 4.');
  });

  it('shows the cloth views once worked out (on the page here: happy-dom has no workers), and again after an edit settles', async () => {
    render(<DraftEditor draft={twill({ tieup: [[1, 2], [2, 3], [3, 4], []] })} version={1} />);
    expect(typeof Worker).toBe('undefined');
    expect(screen.getAllByText('Working out the view…')).toHaveLength(2);
    await screen.findByTestId('view-structure');
    expect(screen.getByTestId('view-floats').textContent).toContain('2 floats over the limit');
    expect(screen.queryByText('Working out the view…')).toBeNull();
    // Opening a view asks again: its picture comes without an edit.
    fireEvent.click(within(screen.getByRole('group', { name: 'Views to show' })).getByRole('button', { name: 'Colour' }));
    await screen.findByTestId('view-colour');
    // Shaft 4 tied to treadle 4 (tie-up grid, fourth treadle, top row): the caption follows the
    // engine's count of floats over the limit for that draft once the edit settles.
    const edited = twill({ tieup: [[1, 2], [2, 3], [3, 4], [4]] });
    const expected = findFloats(edited, { limit: 5 }).overLimit.length;
    expect(expected).toBe(0);
    const press = keyboard(screen.getByTestId('draft-canvas'));
    press(']');
    for (let i = 0; i < 3; i++) press('ArrowRight');
    press(' ');
    expect(screen.getByTestId('editor-message').textContent).toBe('Tie-up, treadle 4, shaft 4: marked.');
    await screen.findByText('no floats over the limit', undefined, { timeout: 3000 });
  });

  it('read only: arrows move but nothing changes', () => {
    render(<DraftEditor draft={twill()} version={1} readOnly />);
    const grid = screen.getByTestId('draft-canvas');
    const press = keyboard(grid);
    press('ArrowDown');
    press(' ');
    press('ArrowUp');
    press('ArrowDown');
    expect(screen.getByTestId('editor-message').textContent).toBe('Threading, end 1, shaft 3: empty.');
    expect(screen.queryByRole('button', { name: 'Straight draw' })).toBeNull();
  });

  it('offers Keep my version and Use the other version after a conflict, each saying what it loses', async () => {
    const theirs = twill({ name: 'Their scarf' });
    const onSave = vi.fn(async () => ({ conflict: { version: 5, document: theirs } }));
    render(<DraftEditor draft={twill()} version={3} draftId="test-conflict" onSave={onSave} />);
    const grid = screen.getByTestId('draft-canvas');
    fireEvent.keyDown(grid, { key: ' ' });
    await act(async () => {
      await new Promise((r) => setTimeout(r, 1200));
    });
    const dialog = within(await screen.findByRole('alertdialog'));
    const keep = dialog.getByRole('button', { name: 'Keep my version' });
    const use = dialog.getByRole('button', { name: 'Use the other version' });
    const loses = (button: HTMLElement) => document.getElementById(button.getAttribute('aria-describedby') ?? '')?.textContent;
    expect(loses(keep)).toBe('Saves yours on top. The changes in version 5 are not in it; that version stays in History.');
    expect(loses(use)).toBe('Opens version 5. The edits you made since your last save are lost.');
  });
});
