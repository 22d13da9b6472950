import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { PlanDefaultsResponse } from '../../../shared/api/plans';
import { defaultPlan } from '../../../shared/plan/plan-schema';
import { draftDetail, sessionUser } from '../support/factories';
import { mockApi, type MockHandler } from '../support/mock-api';
import { renderApp } from '../support/render';
import { twoLayerDraft } from './fixtures';

/** The lists below were worked out with the draft's end 1 on the right, seen from the front. */
const END_ONE_RIGHT = { endOne: 'right', threading: 'above', treadling: 'right', shaftOne: 'bottom' } as const;

const noDefaults: PlanDefaultsResponse = { overall: null, byYarn: [] };

function routes(role: 'owner' | 'viewer', extra: Record<string, MockHandler> = {}) {
  return {
    'GET /api/session': { body: { user: sessionUser() } },
    'GET /api/drafts/4': { body: { draft: draftDetail({ id: 4, name: 'Two-layer trial', role, document: { ...twoLayerDraft(), arrangement: END_ONE_RIGHT } }) } },
    'GET /api/yarns': { body: { yarns: [] } },
    'GET /api/drafts/4/plan': { body: { plan: { ...defaultPlan('inch'), sett: 24, layers: 2 }, updatedAt: '2025-01-01T00:00:00.000Z', updatedByName: 'Wren' } },
    'GET /api/me/plan-defaults': { body: noDefaults },
    ...extra,
  };
}

const fact = (label: string) => {
  const term = screen.getByText(label, { selector: 'dt' });
  return term.nextElementSibling!.textContent!;
};

describe('Plan page', () => {
  it('works out the warp from the saved plan, and keeps it when switching to centimetres', async () => {
    mockApi(routes('owner'));
    renderApp('/drafts/4/plan');
    await screen.findByRole('heading', { level: 2, name: 'Plan' });
    // By hand: 10" ÷ (0.9 × 0.9) = 12.35" in the reed × 24 epi = 296.3 ends = 37.04 repeats of 8 → 37 → 296 ends.
    expect(fact('Total ends')).toMatch(/^296 = 37 repeats/);
    expect(fact('Width in the reed')).toMatch(/^12\.33 in/);

    fireEvent.click(screen.getByRole('radio', { name: 'Centimetres' }));
    expect((screen.getByLabelText('Finished width (cm)') as HTMLInputElement).value).toBe('25.4');
    expect((screen.getByLabelText('Ends per cm') as HTMLInputElement).value).toBe('9.449');
    expect(fact('Total ends')).toMatch(/^296 = 37 repeats/);
    expect(fact('Width in the reed')).toMatch(/^31\.33 cm/);
  });

  it('reads yarns as the weaver writes them, and gives sett advice doubled for two layers', async () => {
    mockApi(routes('owner'));
    renderApp('/drafts/4/plan');
    const warp = await screen.findByLabelText('Warp yarn');
    fireEvent.change(warp, { target: { value: '12 wpi' } });
    // Wraps typed in the yarn box move to their own field.
    expect((screen.getByLabelText('Wraps per inch of the warp yarn') as HTMLInputElement).value).toBe('12');
    // Plain weave: WPI ÷ 2 = 6 per layer (common practice), × 2 layers.
    expect(fact('From wraps per inch (× 2 for 2 layers)')).toBe('12 ends per inch');

    fireEvent.change(warp, { target: { value: '8/2 cotton' } });
    // Ne 4 = 3360 yd/lb = 3360 × 0.9144 m ÷ 0.45359237 kg = 6773 m/kg (ASTM D2260 definitions).
    expect(screen.getByText(/Reads as 6\.77 m per gram/)).toBeTruthy();
    fireEvent.change(warp, { target: { value: '8/2 wool-ish' } });
    expect(screen.getByText(/Unknown count system/)).toBeTruthy();
  });

  it('saves for an editor and shows the estimates and chemicals cautions', async () => {
    const server = mockApi({
      ...routes('owner'),
      'GET /api/csrf': { body: { token: 't' } },
      'PUT /api/drafts/4/plan': (req) => ({ body: { plan: req.body, updatedAt: '2025-01-02T00:00:00.000Z', updatedByName: 'Wren' } }),
    });
    renderApp('/drafts/4/plan');
    await screen.findByRole('heading', { level: 2, name: 'Plan' });
    expect(screen.getByText(/the weaver's sample is the authority/)).toBeTruthy();
    expect(screen.queryByText(/Dyes and finishing chemicals/)).toBeNull();

    fireEvent.change(screen.getByLabelText('Finished length per piece (in)'), { target: { value: '40' } });
    fireEvent.change(screen.getByLabelText('Plan notes'), { target: { value: 'Dye the weft with madder first.' } });
    expect(screen.getByText(/Dyes and finishing chemicals/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'Save plan' }));
    await waitFor(() => expect(server.to('PUT /api/drafts/4/plan')).toHaveLength(1));
    expect(server.to('PUT /api/drafts/4/plan')[0].body).toMatchObject({ finishedLength: 40, notes: 'Dye the weft with madder first.', layers: 2 });
    await screen.findByText('✓ Saved.');
  });

  it('blocks saving while an input is wrong, and shows viewers no save button', async () => {
    mockApi(routes('viewer'));
    renderApp('/drafts/4/plan');
    await screen.findByRole('heading', { level: 2, name: 'Plan' });
    expect(screen.queryByRole('button', { name: 'Save plan' })).toBeNull();
    expect(screen.getByText(/only editors of this draft can save/)).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Take-up (%)'), { target: { value: '120' } });
    expect(screen.getByRole('alert').textContent).toMatch(/need fixing/);
  });

  it('offers the weaver\'s measured allowances for the same yarns', async () => {
    const defaults: PlanDefaultsResponse = {
      overall: { allowances: { takeUp: 0.2 }, results: 3 },
      byYarn: [{ key: '|', warpYarn: null, weftYarn: null, allowances: { takeUp: 0.05, drawIn: 0.07 }, results: 2 }],
    };
    mockApi(routes('owner', { 'GET /api/me/plan-defaults': { body: defaults } }));
    renderApp('/drafts/4/plan');
    const button = await screen.findByRole('button', { name: 'Use my measured allowances (2 results with these yarns)' });
    fireEvent.click(button);
    expect((screen.getByLabelText('Take-up (%)') as HTMLInputElement).value).toBe('5');
    expect((screen.getByLabelText('Draw-in (%)') as HTMLInputElement).value).toBe('7');
    // The other allowances keep their values.
    expect((screen.getByLabelText('Shrinkage in length (%)') as HTMLInputElement).value).toBe('10');
  });

  it('lists which ends share each dent under the layer rule', async () => {
    mockApi(routes('owner'));
    renderApp('/drafts/4/plan');
    await screen.findByRole('heading', { level: 2, name: 'Plan' });
    fireEvent.change(screen.getByLabelText('Ends per dent'), { target: { value: '2' } });
    fireEvent.click(screen.getByRole('checkbox', { name: /Layer rule/ }));
    const table = screen.getByRole('table', { name: /First dents/ });
    // Working from the front, right to left, end 1 on the right: ends 1 and 2 (layers 1 and 2) share dent 1.
    expect(within(table).getAllByRole('row')[1].textContent).toBe('11 (layer 1), 2 (layer 2)');
  });
});
