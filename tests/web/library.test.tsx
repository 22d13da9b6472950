import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { draftSummary, draftsPage, sessionUser } from './support/factories';
import { apiError, mockApi } from './support/mock-api';
import { renderApp } from './support/render';

const signedIn = { 'GET /api/session': { body: { user: sessionUser() } } };

describe('Drafts library', () => {
  it('lists drafts with owner, studio, size, shafts and a link to each', async () => {
    mockApi({
      ...signedIn,
      'GET /api/drafts': {
        body: draftsPage([
          draftSummary({ id: 7, name: 'Point twill scarf', ends: 180, picks: 620, shafts: 4, studioId: 3, studioName: 'Mill Lane Studio' }),
          draftSummary({ id: 8, name: 'Colour-and-weave sampler', ownerName: 'Tamsin Greaves', ends: 96, picks: 96, shafts: 2 }),
        ]),
      },
    });
    renderApp('/drafts');
    const table = await screen.findByRole('table');
    const rows = within(table).getAllByRole('row').slice(1);
    expect(rows).toHaveLength(2);
    const first = within(rows[0]);
    expect(first.getByRole('link', { name: 'Point twill scarf' }).getAttribute('href')).toBe('/drafts/7');
    expect(first.getByText('Mill Lane Studio')).toBeTruthy();
    expect(first.getByText('180 × 620')).toBeTruthy();
    expect(first.getByText('4')).toBeTruthy();
    const second = within(rows[1]);
    expect(second.getByText('Tamsin Greaves')).toBeTruthy();
    expect(second.getByText('Personal')).toBeTruthy();
    expect(screen.getByText('2 drafts')).toBeTruthy();
  });

  it('shows "No drafts yet" when there are none', async () => {
    mockApi({ ...signedIn, 'GET /api/drafts': { body: draftsPage([]) } });
    renderApp('/drafts');
    expect(await screen.findByText('No drafts yet')).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();
  });

  it('shows the server error with a way to try again', async () => {
    const server = mockApi({ ...signedIn, 'GET /api/drafts': apiError(503, 'db_down', 'The database is not answering.') });
    renderApp('/drafts');
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Could not load drafts');
    expect(alert.textContent).toContain('The database is not answering.');

    server.set({ 'GET /api/drafts': { body: draftsPage([draftSummary({ name: 'Recovered mat' })]) } });
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));
    expect(await screen.findByRole('link', { name: 'Recovered mat' })).toBeTruthy();
  });

  it('sends search, sort and page from the URL to the server', async () => {
    const server = mockApi({ ...signedIn, 'GET /api/drafts': { body: draftsPage([draftSummary()], { total: 45, page: 2 }) } });
    renderApp('/drafts?q=mat&sort=name&page=2');
    await screen.findByRole('table');
    expect(Object.fromEntries(server.to('GET /api/drafts')[0].query)).toEqual({ q: 'mat', sort: 'name', dir: 'asc', page: '2', pageSize: '20' });
    expect(screen.getByText('Page 2 of 3')).toBeTruthy();
    expect(screen.getByRole<HTMLInputElement>('searchbox', { name: 'Search drafts' }).value).toBe('mat');
  });

  it('changes sort, page and search through the URL', async () => {
    const server = mockApi({ ...signedIn, 'GET /api/drafts': { body: draftsPage([draftSummary()], { total: 45 }) } });
    const app = renderApp('/drafts');
    await screen.findByRole('table');

    fireEvent.click(screen.getByRole('button', { name: 'Next' }));
    await waitFor(() => expect(app.location()).toBe('/drafts?page=2'));

    // A new column starts in its natural order (names A to Z) and goes back to page 1.
    fireEvent.click(screen.getByRole('button', { name: /^Name/ }));
    await waitFor(() => expect(app.location()).toBe('/drafts?sort=name'));
    fireEvent.click(screen.getByRole('button', { name: /^Name/ }));
    await waitFor(() => expect(app.location()).toBe('/drafts?sort=name&dir=desc'));
    expect(screen.getByRole('columnheader', { name: /^Name/ }).getAttribute('aria-sort')).toBe('descending');

    fireEvent.change(screen.getByRole('searchbox', { name: 'Search drafts' }), { target: { value: ' scarf ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Search' }));
    await waitFor(() => expect(app.location()).toBe('/drafts?q=scarf&sort=name&dir=desc'));
    await waitFor(() => expect(server.to('GET /api/drafts').at(-1)?.query.get('q')).toBe('scarf'));
  });

  it('says when a search finds nothing and offers to clear it', async () => {
    mockApi({ ...signedIn, 'GET /api/drafts': { body: draftsPage([]) } });
    const app = renderApp('/drafts?q=houndstooth');
    expect(await screen.findByText('No drafts match “houndstooth”')).toBeTruthy();
    fireEvent.click(screen.getByRole('link', { name: 'Clear search' }));
    await waitFor(() => expect(app.location()).toBe('/drafts'));
    expect(await screen.findByText('No drafts yet')).toBeTruthy();
  });
});
