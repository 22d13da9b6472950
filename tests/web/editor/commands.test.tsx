import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { DraftEditor } from '../../../src/features/editor';
import { COMMANDS, SHORTCUTS } from '../../../src/features/editor/store/commands';
import { twill } from './fixtures';

describe('editor commands', () => {
  it('gives every toolbar button with a key the same key in its tooltip as the Keys panel lists', () => {
    render(<DraftEditor draft={twill()} version={1} />);
    fireEvent.click(screen.getByRole('button', { name: 'Keys' }));
    const panel = within(screen.getByTestId('keys-panel'));
    const toolbar = within(screen.getByRole('toolbar', { name: 'Draft tools' }));
    let checked = 0;
    // Repeat's button repeats as many times as the box beside it says, so its tooltip says so too.
    for (const command of Object.values(COMMANDS).filter((c) => c !== COMMANDS.repeat)) {
      const button = toolbar.queryByRole('button', { name: command.label });
      if (!button || !command.keys) continue;
      expect(button.getAttribute('title')).toBe(`${command.does} (${command.keys})`);
      expect(panel.getByText(command.keys)).toBeTruthy();
      checked++;
    }
    // Draw, Erase, Select, Undo, Redo (no edit yet, so plain), the three draws, Mirror, Reverse,
    // Upside down, Insert, Delete, Copy, Paste, Treadle as drawn in.
    expect(checked).toBe(16);
    expect(SHORTCUTS.map((c) => c.keys)).toEqual([...new Set(SHORTCUTS.map((c) => c.keys))]);
  });

  it('disables Undo until there is an edit, then names the edit on it', () => {
    render(<DraftEditor draft={twill()} version={1} />);
    const toolbar = within(screen.getByRole('toolbar', { name: 'Draft tools' }));
    expect((toolbar.getByRole('button', { name: 'Undo' }) as HTMLButtonElement).disabled).toBe(true);
    const grid = screen.getByTestId('draft-canvas');
    for (let i = 0; i < 3; i++) fireEvent.keyDown(grid, { key: 'ArrowRight', shiftKey: true });
    fireEvent.click(toolbar.getByRole('button', { name: 'Upside down' }));
    const undo = toolbar.getByRole('button', { name: 'Undo upside down' }) as HTMLButtonElement;
    expect(undo.disabled).toBe(false);
    fireEvent.click(undo);
    expect(screen.getByTestId('editor-message').textContent).toBe('Undid upside down.');
    expect(toolbar.getByRole('button', { name: 'Redo upside down' })).toBeTruthy();
  });

  it('answers only the keys that leave a read-only draft unchanged', () => {
    render(<DraftEditor draft={twill()} version={1} readOnly />);
    const grid = screen.getByTestId('draft-canvas');
    fireEvent.keyDown(grid, { key: 'ArrowRight' });
    expect(screen.getByTestId('editor-message').textContent).toMatch(/^Threading, end 2/);
    fireEvent.keyDown(grid, { key: 'f' });
    fireEvent.keyDown(grid, { key: 'Delete' });
    expect(screen.getByTestId('editor-message').textContent).toMatch(/^Threading, end 2/);
  });
});
