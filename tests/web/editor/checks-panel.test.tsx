import { fireEvent, render, screen, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { expandProfile } from '../../../shared/weave';
import { DraftEditor } from '../../../src/features/editor';
import { doubleWeaveProfile } from '../../helpers/draft-fixtures';

describe('Checks', () => {
  it('counts items by kind, folds a kind away, and jumps to an item’s end', async () => {
    const draft = expandProfile(doubleWeaveProfile({ threading: [1, 1, 1, 2, 2, 2] }), 'double-weave');
    draft.threading[1] = [8]; // end 2 (layer 2 of block 1) onto block 2's layer-2 shaft
    draft.liftplan[4] = [...draft.liftplan[4], 3].sort((a, b) => a - b);
    render(<DraftEditor draft={draft} version={1} />);
    const list = await screen.findByTestId('checks', undefined, { timeout: 5000 });
    const threading = within(list).getByRole('button', { name: /Ends on the wrong shaft \(1\)/ });
    const layers = within(list).getByRole('button', { name: /Layers tied together \(1\)/ });
    expect(threading.getAttribute('aria-expanded')).toBe('true');
    const item = within(list).getByRole('button', { name: /^End 2 \(layer 2\) is on shaft 8/ });
    fireEvent.click(layers);
    expect(layers.getAttribute('aria-expanded')).toBe('false');
    expect(within(list).queryByRole('button', { name: /Pick 5/ })).toBeNull();
    fireEvent.click(item);
    expect(screen.getByTestId('editor-message').textContent).toBe('End 2.');
  });
});
