import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it } from 'vitest';
import { draftDetail, sessionUser } from '../support/factories';
import { apiError, mockApi, type MockHandler } from '../support/mock-api';
import { renderApp } from '../support/render';
import { stubOffscreenCanvas, twill, version } from './fixtures';

const versions = [
  version({ version: 4, message: 'Wider border', createdAt: '2025-03-16T09:00:00.000Z' }),
  version({ version: 3, authorName: 'Tamsin Greaves', message: 'Plain weave hem', createdAt: '2025-03-15T09:00:00.000Z' }),
  version({ version: 2, message: '', createdAt: '2025-03-14T09:00:00.000Z' }),
  version({ version: 1, message: 'First try', createdAt: '2025-03-13T09:00:00.000Z' }),
];

function historyRoutes(role: 'owner' | 'editor' | 'viewer', more: Record<string, MockHandler> = {}): Record<string, MockHandler> {
  return {
    'GET /api/session': { body: { user: sessionUser() } },
    'GET /api/drafts/7': { body: { draft: draftDetail({ id: 7, name: 'Point twill scarf', version: 4, role }) } },
    'GET /api/drafts/7/versions': { body: { versions } },
    'GET /api/yarns': { body: { yarns: [] } },
    ...more,
  };
}

beforeEach(stubOffscreenCanvas);

const rowOf = (n: number) => screen.getByRole('rowheader', { name: new RegExp(`^${n}`) }).closest('tr')!;

describe('draft history', () => {
  it('lists the versions newest first with author and message, marking the current one', async () => {
    const server = mockApi(historyRoutes('owner'));
    renderApp('/drafts/7/history');
    expect(await screen.findByRole('heading', { level: 1, name: 'Point twill scarf' })).toBeTruthy();
    const rows = within(await screen.findByRole('table')).getAllByRole('row').slice(1);
    expect(rows.map((r) => within(r).getByRole('rowheader').textContent)).toEqual(['4current', '3', '2', '1']);
    expect(within(rowOf(3)).getByText('Tamsin Greaves')).toBeTruthy();
    expect(within(rowOf(3)).getByText('Plain weave hem')).toBeTruthy();
    expect(within(rowOf(4)).getByText('current')).toBeTruthy();
    expect(rowOf(3).querySelector('time')?.getAttribute('dateTime')).toBe('2025-03-15T09:00:00.000Z');
    expect(server.to('GET /api/drafts/7/versions')).toHaveLength(1);
  });

  it('opens a version read-only with its size, message, cloth and downloads', async () => {
    const server = mockApi(historyRoutes('viewer', {
      'GET /api/drafts/7/versions/3': { body: { version: { ...versions[1], document: twill(6) } } },
      'GET /api/drafts/7/photos': { body: { photos: [] } },
    }));
    renderApp('/drafts/7/history');
    fireEvent.click(await screen.findByRole('button', { name: 'Open version 3' }));
    const view = await screen.findByRole('region', { name: 'Version 3 (read-only)' });
    expect(within(view).getByText(/6 ends × 4 picks on 4 shafts/).textContent).toContain('“Plain weave hem”');
    // Three pixels a cell: the picture is as wide as the version's ends and as tall as its picks.
    const cloth = within(view).getByRole('img', { name: 'Cloth of version 3' });
    expect([cloth.getAttribute('width'), cloth.getAttribute('height')]).toEqual(['18', '12']);
    expect(within(view).getByRole('link', { name: 'Export as WIF' }).getAttribute('href')).toBe('/api/drafts/7/export.wif?version=3');
    expect(within(view).getByRole('link', { name: 'Export as JSON' }).getAttribute('href')).toBe('/api/drafts/7/export.json?version=3');
    expect(screen.getByRole('button', { name: 'Open version 3' }).getAttribute('aria-pressed')).toBe('true');
    expect(server.to('GET /api/drafts/7/versions/3')).toHaveLength(1);
    // Read-only means no editor and, for a viewer, nothing to restore or upload.
    expect(screen.queryByRole('region', { name: 'Draft editor' })).toBeNull();
    expect(screen.queryByRole('button', { name: /^Restore/ })).toBeNull();
  });

  it('restores an older version as a new one and refreshes the list', async () => {
    const server = mockApi(historyRoutes('editor', {
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/versions/2/restore': { status: 201, body: { version: 5 } },
    }));
    renderApp('/drafts/7/history');
    await screen.findByRole('table');
    // The current version has nothing to restore.
    expect(within(rowOf(4)).queryByRole('button', { name: /^Restore/ })).toBeNull();
    fireEvent.click(screen.getByRole('button', { name: 'Restore version 2' }));
    expect((await screen.findByRole('status')).textContent).toBe('Restored as version 5.');
    const [restore] = server.to('POST /api/drafts/7/versions/2/restore');
    expect(restore.body).toBeUndefined();
    expect(restore.headers.get('x-csrf-token')).toBe('tok-1');
    await waitFor(() => expect(server.to('GET /api/drafts/7/versions')).toHaveLength(2));
  });

  it('shows why a restore was refused', async () => {
    mockApi(historyRoutes('editor', {
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/versions/1/restore': apiError(403, 'forbidden', 'Your role does not allow this'),
    }));
    renderApp('/drafts/7/history');
    fireEvent.click(await screen.findByRole('button', { name: 'Restore version 1' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Could not restore. Your role does not allow this');
  });

  it('compares two ticked versions, older first, with changed counts and the difference image', async () => {
    const server = mockApi(historyRoutes('viewer', {
      'GET /api/drafts/7/compare': {
        body: {
          a: 2, b: 4,
          ends: [3, 4, 5],
          picks: Array.from({ length: 45 }, (_, i) => i + 1),
          tieup: [{ treadle: 2, shaft: 3 }],
          aligned: {
            ends: { inserted: [3, 4, 5], removed: [], changed: [] },
            picks: { inserted: [], removed: [40, 41], changed: [1, 7, 8, 9] },
          },
          cells: 128,
          imageUrl: '/api/drafts/7/compare.png?a=2&b=4',
        },
      },
    }));
    renderApp('/drafts/7/history');
    const compare = await screen.findByRole<HTMLButtonElement>('button', { name: 'Compare' });
    expect(compare.disabled).toBe(true);
    fireEvent.click(screen.getByRole('checkbox', { name: 'Compare version 4' }));
    expect(compare.disabled).toBe(true);
    fireEvent.click(screen.getByRole('checkbox', { name: 'Compare version 2' }));
    expect(screen.getByText('Versions 2 and 4 ticked')).toBeTruthy();
    expect(server.to('GET /api/drafts/7/compare')).toHaveLength(0);
    fireEvent.click(compare);

    const result = await screen.findByRole('region', { name: 'Version 2 compared with version 4' });
    const [request] = server.to('GET /api/drafts/7/compare');
    expect(request.query.get('a')).toBe('2');
    expect(request.query.get('b')).toBe('4');
    expect(within(result).getByTestId('aligned-ends').textContent).toBe('3 inserted (3–5 in version 4); none removed; none changed');
    expect(within(result).getByTestId('aligned-picks').textContent).toBe('none inserted; 2 removed (40–41 in version 2); 4 changed (1, 7–9 in version 4)');
    expect(within(result).getByTestId('changed-ends').textContent).toBe('3: 3, 4, 5');
    expect(within(result).getByTestId('changed-picks').textContent).toMatch(/^45: 1, 2, .*, 40 and 5 more$/);
    expect(within(result).getByTestId('changed-tieup').textContent).toBe('1: treadle 2 shaft 3');
    const image = within(result).getByRole('img', { name: 'Drawdown differences between version 2 and version 4: 128 cells changed' });
    expect(image.getAttribute('src')).toBe('/api/drafts/7/compare.png?a=2&b=4');
  });

  it('keeps only the last two ticks', async () => {
    mockApi(historyRoutes('viewer'));
    renderApp('/drafts/7/history');
    const box = async (n: number) => screen.findByRole<HTMLInputElement>('checkbox', { name: `Compare version ${n}` });
    fireEvent.click(await box(1));
    fireEvent.click(await box(2));
    fireEvent.click(await box(3));
    expect((await box(1)).checked).toBe(false);
    expect(screen.getByText('Versions 2 and 3 ticked')).toBeTruthy();
  });

  it('says when the history cannot be loaded', async () => {
    mockApi(historyRoutes('owner', { 'GET /api/drafts/7/versions': apiError(500, 'internal', 'The database is not answering') }));
    renderApp('/drafts/7/history');
    expect((await screen.findByRole('alert')).textContent).toContain('Could not load the history. The database is not answering');
  });
});
