// The block design panel as a weaver uses it: the rows as a block tie-up and treadling instead of a
// block lift plan (the same cloth), a treadle re-tied, and the picks of one weft block in colours of
// their own; "Use as the draft" keeps all of it with the draft.
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { applyProfile, createDraft, type BlockDesign, type Draft } from '../../../shared/weave';
import { DraftEditor } from '../../../src/features/editor';

const PALETTE = ['#22303c', '#efe6d2', '#9a3b2e'];
const DESIGN: BlockDesign = {
  unit: 'double-weave',
  threading: [1, 2],
  treadling: [[1], [2], [1], [2]],
  warpColors: [[0], [1]],
  weftColors: [[0], [1]],
};

/** The editor on a draft, opened at the block design; returns the documents it saves. */
function renderWith(draft: Draft): Draft[] {
  const saves: Draft[] = [];
  const onSave = vi.fn(async (doc: Draft, base: number) => {
    saves.push(doc);
    return { version: base + 1 };
  });
  render(<DraftEditor draft={draft} version={1} draftId={`block-panel-${Math.random()}`} onSave={onSave} showBlockDesign />);
  return saves;
}

describe('block design panel', () => {
  it('turns the rows into a block tie-up and treadling, re-ties a treadle, and gives a weft block its own colours', async () => {
    const start = applyProfile(createDraft({ shafts: 8, palette: PALETTE }), DESIGN).draft;
    const saves = renderWith(start);
    const panel = await screen.findByTestId('block-design');
    fireEvent.change(within(panel).getByLabelText('Rows as'), { target: { value: 'treadling' } });
    // One treadle per different row: treadle 1 shows block 1, treadle 2 block 2.
    const tieup = within(panel).getByRole('table', { name: /Block tie-up/ });
    expect(within(tieup).getByRole('button', { name: 'Treadle 1 shows the pattern in block 1' }).getAttribute('aria-pressed')).toBe('true');
    expect(within(tieup).getByRole('button', { name: 'Treadle 2 shows the pattern in block 2' }).getAttribute('aria-pressed')).toBe('true');
    expect(within(panel).getByRole('button', { name: 'Row 3, treadle 1 pressed' }).getAttribute('aria-pressed')).toBe('true');
    // Treadle 2 also shows block 1 now: rows 2 and 4 show the pattern in both blocks.
    fireEvent.click(within(tieup).getByRole('button', { name: 'Treadle 2 shows the pattern in block 1' }));
    // The picks on treadle 2 take rust in layer 1.
    fireEvent.click(within(panel).getByLabelText('Rows on treadle 2 have their own weft colour order'));
    fireEvent.change(within(panel).getByLabelText('Treadle 2 weft, Layer 1, place 1'), { target: { value: '2' } });
    fireEvent.click(within(panel).getByRole('button', { name: 'Use as the draft' }));

    // Saved after the pause that follows the edit.
    await waitFor(() => expect(saves.at(-1)?.profile?.tieup).toBeDefined(), { timeout: 10_000 });
    const draft = saves.at(-1)!;
    expect(draft.profile).toEqual({ ...DESIGN, tieup: [[1], [1, 2]], treadling: [[1], [2], [1], [2]], blockWeftColors: [[], [[2], [1]]] });
    // The same interlacement as the block lift plan [1], [1, 2], [1], [1, 2].
    const lifted = applyProfile(createDraft({ shafts: 8, palette: PALETTE }), { ...DESIGN, treadling: [[1], [1, 2], [1], [1, 2]] }).draft;
    expect(draft.liftplan).toEqual(lifted.liftplan);
    // Rows 2 and 4 (treadle 2) weave rust in layer 1; rows 1 and 3 keep dark and light.
    expect(draft.weftColors).toEqual([0, 1, 0, 1, 2, 1, 2, 1, 0, 1, 0, 1, 2, 1, 2, 1]);
  }, 30_000);
});
