import { act, fireEvent, screen, waitFor } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { Progress } from '../../../shared/api/plans';
import { defaultPlan } from '../../../shared/plan/plan-schema';
import { draftDetail, sessionUser } from '../support/factories';
import { mockApi, type MockHandler } from '../support/mock-api';
import { renderApp } from '../support/render';
import { twoLayerDraft } from '../plan/fixtures';

/** The lists below were worked out with the draft's end 1 on the right, seen from the front. */
const END_ONE_RIGHT = { endOne: 'right', threading: 'above', treadling: 'right', shaftOne: 'bottom' } as const;

// 8 ends a repeat; 10" at 24 epi with 10 % draw-in and shrinkage → 37 repeats = 296 ends; groups of an inch of ends (24).
const plan = { ...defaultPlan('inch'), sett: 24, layers: 2, lists: { ...defaultPlan().lists, layerRule: true } };
const back = { side: 'back', direction: 'right-to-left', shaftNumbering: 'near' } as const;

function routes(progress: Progress | null, extra: Record<string, MockHandler> = {}) {
  return {
    'GET /api/session': { body: { user: sessionUser() } },
    'GET /api/drafts/4': { body: { draft: draftDetail({ id: 4, name: 'Two-layer trial', role: 'viewer', document: { ...twoLayerDraft(), arrangement: END_ONE_RIGHT } }) } },
    'GET /api/yarns': { body: { yarns: [] } },
    'GET /api/drafts/4/plan': { body: { plan, updatedAt: null, updatedByName: null } },
    'GET /api/drafts/4/progress': { body: { progress } },
    'GET /api/drafts/4/results': { body: { results: [] } },
    'GET /api/csrf': { body: { token: 't' } },
    'PUT /api/drafts/4/progress': (req: { body: unknown }) => {
      const b = req.body as { list: 'threading'; position: number; settings: typeof back; movedAt: string };
      return { body: { progress: { list: b.list, positions: { [b.list]: b.position }, settings: b.settings, movedAt: b.movedAt } } };
    },
    ...extra,
  };
}

/** The ends of the group on screen. */
const stepItems = () => screen.getAllByRole('listitem').filter((li) => /^(⚠ )?End \d+:/.test(li.textContent ?? ''));

const heading = () => screen.getByRole('heading', { level: 2, name: /: (group|pick) \d+ of/ }).textContent;

beforeEach(() => localStorage.clear());
afterEach(() => vi.restoreAllMocks());

describe('At the loom', () => {
  it('finds the weaver\'s place from the server and moves with buttons and keys', async () => {
    const server = mockApi(routes({ list: 'threading', positions: { threading: 2 }, settings: back, movedAt: '2025-01-01T00:00:00.000Z' }));
    renderApp('/drafts/4/loom');
    await waitFor(() => expect(heading()).toBe('Threading: group 3 of 13'));
    expect(screen.getByRole('progressbar').getAttribute('aria-valuenow')).toBe('3');
    expect(screen.getByRole('button', { name: 'Back of the loom' }).getAttribute('aria-pressed')).toBe('true');

    fireEvent.click(screen.getByRole('button', { name: /Next group/ }));
    expect(heading()).toBe('Threading: group 4 of 13');
    await waitFor(() => expect(server.to('PUT /api/drafts/4/progress')).toHaveLength(1));
    expect(server.to('PUT /api/drafts/4/progress')[0].body).toMatchObject({ list: 'threading', position: 3, settings: back });

    fireEvent.keyDown(window, { key: 'ArrowRight' });
    fireEvent.keyDown(window, { key: ' ' });
    expect(heading()).toBe('Threading: group 6 of 13');
    fireEvent.keyDown(window, { key: 'Backspace' });
    fireEvent.keyDown(window, { key: 'ArrowLeft' });
    expect(heading()).toBe('Threading: group 4 of 13');
    await waitFor(() => expect(server.to('PUT /api/drafts/4/progress')).toHaveLength(5));
    expect(server.to('PUT /api/drafts/4/progress').at(-1)!.body).toMatchObject({ position: 3 });
    await screen.findByText('Place saved.');
  });

  it('names colours in words beside the swatch, with shafts as numbered from the back, and a quick check', async () => {
    mockApi(routes({ list: 'threading', positions: { threading: 0 }, settings: back, movedAt: '2025-01-01T00:00:00.000Z' }));
    renderApp('/drafts/4/loom');
    await waitFor(() => expect(heading()).toBe('Threading: group 1 of 13'));
    // From the back, right to left, the last end (296, on draft shaft 8) comes first; nearest shaft is the back one.
    const first = screen.getAllByRole('listitem').find((li) => li.textContent?.startsWith('End 296'))!;
    expect(first.textContent).toMatch(/^End 296: shaft 1 · dent \d+Cotton, sand \(colour 2\)layer 2$/);
    // The quick check for the group being worked shows before moving on.
    const check = screen.getByRole('region', { name: 'Quick check' });
    expect(check.textContent).toMatch(/Raise shaft 1 alone: every end on it should be Cotton, sand \(colour 2\) \(layer 2\)\. In this group: ends 296, 288, 280\./);
  });

  it('steps with Page Down, Enter and Page Up (as foot switches send), and shows the quick check of the last group too', async () => {
    mockApi(routes({ list: 'threading', positions: { threading: 10 }, settings: back, movedAt: '2025-01-01T00:00:00.000Z' }));
    renderApp('/drafts/4/loom');
    await waitFor(() => expect(heading()).toBe('Threading: group 11 of 13'));
    fireEvent.keyDown(window, { key: 'PageDown' });
    fireEvent.keyDown(window, { key: 'Enter' });
    expect(heading()).toBe('Threading: group 13 of 13');
    expect(screen.getByRole('region', { name: 'Quick check' }).textContent).toMatch(/^Quick check: group 13Raise shaft \d+ alone/);
    fireEvent.keyDown(window, { key: 'PageUp' });
    expect(heading()).toBe('Threading: group 12 of 13');
    // Once the weaver has started, the working order is folded away (and says what it is).
    const order = screen.getByText(/^Working order: from the back, right to left/).closest('details')!;
    expect(order.open).toBe(false);
  });

  it('keeps the weaver on the same end when they turn to the other side of the loom', async () => {
    mockApi(routes({ list: 'threading', positions: { threading: 4 }, settings: { ...back, side: 'front' }, movedAt: '2025-01-01T00:00:00.000Z' }));
    renderApp('/drafts/4/loom');
    await waitFor(() => expect(heading()).toBe('Threading: group 5 of 13'));
    const firstEnd = /^End (\d+):/.exec(stepItems()[0].textContent ?? '')![1];
    fireEvent.click(screen.getByRole('button', { name: 'Back of the loom' }));
    // From the back the ends come in the other order, so end N is in another group number, but the same end is on screen.
    expect(heading()).not.toBe('Threading: group 5 of 13');
    expect(stepItems().some((li) => li.textContent?.startsWith(`End ${firstEnd}:`))).toBe(true);
  });

  it('marks the ends the quick check flags in the list itself, with a mark and words', async () => {
    const d = twoLayerDraft();
    // Four repeats of the 8 ends, end 9 (on shaft 1, with navy ends 1, 17 and 25) drawn in cream by mistake.
    const four = <T,>(list: T[]) => [...list, ...list, ...list, ...list];
    const warpColors = four(d.warpColors);
    warpColors[8] = 1;
    const odd = { ...d, threading: four(d.threading), warpColors, warpLayers: four(d.warpLayers), arrangement: END_ONE_RIGHT };
    mockApi(routes(null, { 'GET /api/drafts/4': { body: { draft: draftDetail({ id: 4, name: 'Two-layer trial', role: 'viewer', document: odd }) } } }));
    renderApp('/drafts/4/loom');
    await waitFor(() => expect(heading()).toMatch(/^Threading: group 1 of \d+$/));
    const nine = screen.getAllByRole('listitem').find((li) => /^⚠ End 9:/.test(li.textContent ?? ''))!;
    expect(nine.textContent).toContain('check this end');
    const eight = screen.getAllByRole('listitem').find((li) => /End 8:/.test(li.textContent ?? ''))!;
    expect(eight.textContent).not.toContain('check this end');
  });

  it('keeps the place on the device while offline and sends it when back online', async () => {
    let online = false;
    const server = mockApi(routes(null, {
      'PUT /api/drafts/4/progress': (req) => {
        if (!online) throw new TypeError('Failed to fetch');
        return { body: { progress: { ...(req.body as object), positions: { threading: (req.body as { position: number }).position } } } };
      },
    }));
    renderApp('/drafts/4/loom');
    await waitFor(() => expect(heading()).toBe('Threading: group 1 of 13'));
    fireEvent.click(screen.getByRole('button', { name: /Next group/ }));
    fireEvent.click(screen.getByRole('button', { name: /Next group/ }));
    await screen.findByText(/Offline: your place is kept on this device/);
    const cached = JSON.parse(localStorage.getItem('shedwright:loom:4')!);
    expect(cached.pending).toBe(true);
    expect(cached.place.positions.threading).toBe(2);

    online = true;
    act(() => { window.dispatchEvent(new Event('online')); });
    await screen.findByText('Place saved.');
    expect(server.to('PUT /api/drafts/4/progress').at(-1)!.body).toMatchObject({ position: 2 });
    expect(JSON.parse(localStorage.getItem('shedwright:loom:4')!).pending).toBe(false);
  });

  it('opens from the copy on the device when the network is down', async () => {
    localStorage.setItem('shedwright:loom:4', JSON.stringify({
      draft: { id: 4, name: 'Two-layer trial', role: 'viewer', document: { ...twoLayerDraft(), arrangement: END_ONE_RIGHT } },
      plan,
      place: { list: 'sleying', positions: { sleying: 4 }, settings: back, movedAt: '2025-01-01T00:00:00.000Z' },
      pending: false,
    }));
    const down = () => { throw new TypeError('Failed to fetch'); };
    mockApi(routes(null, { 'GET /api/drafts/4': down, 'GET /api/drafts/4/plan': down, 'GET /api/drafts/4/progress': down, 'GET /api/drafts/4/results': down }));
    renderApp('/drafts/4/loom');
    await waitFor(() => expect(heading()).toMatch(/^Sleying: group 5 of \d+$/));
    expect(screen.getByText(/Working from the copy kept on this device/)).toBeTruthy();
  });

  it('weaves pick by pick with the repeat counted and the beat reminded', async () => {
    mockApi(routes({ list: 'weaving', positions: { weaving: 5 }, settings: back, movedAt: '2025-01-01T00:00:00.000Z' }));
    renderApp('/drafts/4/loom');
    // 72" finished + 10 % take-up and shrinkage → 88.89" woven × 24 ppi = 2134 picks; 4 picks a repeat → 534 repeats.
    await waitFor(() => expect(heading()).toBe('Weaving: pick 6 of 2134'));
    expect(screen.getByText(/Repeat 2 of 534 · pick 2 of 4 in the draft/)).toBeTruthy();
    expect(screen.getByText(/Beat for 24 picks per inch/)).toBeTruthy();
    expect(screen.getByRole('button', { name: /Next pick/ })).toBeTruthy();
  });

  it('suggests a break after half an hour of steady threading', async () => {
    mockApi(routes(null));
    let now = Date.parse('2025-05-01T09:00:00Z');
    vi.spyOn(Date, 'now').mockImplementation(() => now);
    renderApp('/drafts/4/loom');
    await waitFor(() => expect(heading()).toBe('Threading: group 1 of 13'));
    for (let i = 0; i < 8; i++) {
      expect(screen.queryByText(/Time for a short break/)).toBeNull();
      fireEvent.click(screen.getByRole('button', { name: /Next group/ }));
      now += 4 * 60_000;
    }
    // Eight steps four minutes apart: 28 minutes of work; the ninth makes 32.
    expect(screen.queryByText(/Time for a short break/)).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: /Next group/ }));
    expect(screen.getByText(/Time for a short break/)).toBeTruthy();
    fireEvent.click(screen.getByRole('button', { name: 'I have had a break' }));
    expect(screen.queryByText(/Time for a short break/)).toBeNull();
  });

  it('records sizes and shows the measured take-up', async () => {
    const server = mockApi(routes(null, {
      'POST /api/drafts/4/results': {
        status: 201,
        body: { result: { id: 1, weaverName: 'Wren', mine: true, unit: 'inch', allowances: { takeUp: 0.08, drawIn: 0.1 }, notes: '', createdAt: '2025-01-01T00:00:00Z' } },
      },
    }));
    renderApp('/drafts/4/loom');
    await screen.findByRole('heading', { name: 'What came off the loom' });
    fireEvent.change(screen.getByLabelText('Width in the reed'), { target: { value: '20' } });
    fireEvent.change(screen.getByLabelText('Length woven, on the loom'), { target: { value: '100' } });
    fireEvent.change(screen.getByLabelText('Width off the loom'), { target: { value: '18' } });
    fireEvent.change(screen.getByLabelText('Length off the loom'), { target: { value: '92' } });
    fireEvent.click(screen.getByRole('button', { name: 'Record the sizes' }));
    await screen.findByText(/Recorded:/);
    expect(server.to('POST /api/drafts/4/results')[0].body).toEqual({ unit: 'inch', notes: '', widthInReed: 20, lengthOnLoom: 100, widthOffLoom: 18, lengthOffLoom: 92 });
    expect(screen.getByText(/take-up 8\.0 %, draw-in 10\.0 %/)).toBeTruthy();
  });
});
