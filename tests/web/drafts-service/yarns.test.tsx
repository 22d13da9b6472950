import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import type { Yarn } from '../../../src/types/api';
import { sessionUser } from '../support/factories';
import { apiError, mockApi, type MockHandler } from '../support/mock-api';
import { renderApp } from '../support/render';

// Yards per pound from the count: cotton 840 × 8 ÷ 2 = 3360 (common practice, from memory).
const madder: Yarn = { id: 1, name: 'Madder 8/2 cotton', fibre: 'cotton', colour: '#a83232', count: '8/2', yardsPerPound: 3360 };
const walnut: Yarn = { id: 2, name: 'Walnut linen', fibre: 'linen', colour: '#5c4033', count: '16/2', yardsPerPound: null };

function routes(more: Record<string, MockHandler>): Record<string, MockHandler> {
  return { 'GET /api/session': { body: { user: sessionUser() } }, 'GET /api/csrf': { body: { token: 'tok-1' } }, ...more };
}

/** Answers the yarn list from a list the test changes. */
function stash(list: Yarn[]): MockHandler {
  return () => ({ body: { yarns: [...list] } });
}

const addForm = () => within(screen.getByRole('region', { name: 'Add a yarn' }));
const rowOf = (name: string) => within(screen.getByRole('rowheader', { name }).closest('tr')!);

describe('yarns page', () => {
  it('says there are no yarns yet, and why to add some', async () => {
    mockApi(routes({ 'GET /api/yarns': { body: { yarns: [] } } }));
    renderApp('/yarns');
    expect(await screen.findByText('No yarns yet')).toBeTruthy();
    expect(screen.getByText('Yarns you add here can be chosen when you make a new colourway.')).toBeTruthy();
    expect(screen.queryByRole('table')).toBeNull();
  });

  it('lists yarns with fibre, colour, count and yards per pound', async () => {
    mockApi(routes({ 'GET /api/yarns': { body: { yarns: [madder, walnut] } } }));
    renderApp('/yarns');
    await screen.findByRole('table');
    const cells = (name: string) => [...screen.getByRole('rowheader', { name }).closest('tr')!.querySelectorAll('th, td')].slice(0, 5).map((c) => c.textContent);
    expect(cells('Madder 8/2 cotton')).toEqual(['Madder 8/2 cotton', 'cotton', '#a83232', '8/2', '3360']);
    expect(cells('Walnut linen')).toEqual(['Walnut linen', 'linen', '#5c4033', '16/2', '—']);
  });

  it('adds a yarn with every field, then empties the form and lists it', async () => {
    const list: Yarn[] = [];
    const server = mockApi(routes({
      'GET /api/yarns': stash(list),
      'POST /api/yarns': (request) => {
        list.push({ id: 1, ...(request.body as Omit<Yarn, 'id'>) });
        return { status: 201, body: { yarn: list[0] } };
      },
    }));
    renderApp('/yarns');
    await screen.findByText('No yarns yet');
    const form = addForm();
    const add = form.getByRole<HTMLButtonElement>('button', { name: 'Add yarn' });
    expect(add.disabled).toBe(true);
    fireEvent.change(form.getByLabelText('Name'), { target: { value: ' Madder 8/2 cotton  ' } });
    fireEvent.change(form.getByLabelText('Fibre'), { target: { value: 'cotton' } });
    fireEvent.change(form.getByLabelText('Colour'), { target: { value: '#a83232' } });
    fireEvent.change(form.getByLabelText('Count'), { target: { value: '8/2' } });
    fireEvent.change(form.getByLabelText('Yards per pound'), { target: { value: '3360' } });
    fireEvent.click(add);

    expect(await screen.findByRole('rowheader', { name: 'Madder 8/2 cotton' })).toBeTruthy();
    expect(server.to('POST /api/yarns')[0].body).toEqual({ name: 'Madder 8/2 cotton', fibre: 'cotton', colour: '#a83232', count: '8/2', yardsPerPound: 3360 });
    expect(server.to('POST /api/yarns')[0].headers.get('x-csrf-token')).toBe('tok-1');
    expect(addForm().getByLabelText<HTMLInputElement>('Name').value).toBe('');
    // A new form starts from the default undyed brown.
    expect(addForm().getByLabelText<HTMLInputElement>('Colour').value).toBe('#8a6f4d');
  });

  it('sends no yards per pound as null, and shows a field refusal beside the field', async () => {
    const server = mockApi(routes({
      'GET /api/yarns': { body: { yarns: [] } },
      'POST /api/yarns': apiError(400, 'validation', 'Some fields are not valid', { count: 'Too long' }),
    }));
    renderApp('/yarns');
    await screen.findByText('No yarns yet');
    fireEvent.change(addForm().getByLabelText('Name'), { target: { value: 'Oak gall wool' } });
    fireEvent.change(addForm().getByLabelText('Count'), { target: { value: 'very long count' } });
    fireEvent.click(addForm().getByRole('button', { name: 'Add yarn' }));
    expect(await addForm().findByText('Too long')).toBeTruthy();
    expect(addForm().getByLabelText('Count').getAttribute('aria-invalid')).toBe('true');
    // The field says it; a second notice above the form would repeat it.
    expect(screen.queryByRole('alert')).toBeNull();
    expect(server.to('POST /api/yarns')[0].body).toEqual({ name: 'Oak gall wool', fibre: '', colour: '#8a6f4d', count: 'very long count', yardsPerPound: null });
    expect(addForm().getByLabelText<HTMLInputElement>('Name').value).toBe('Oak gall wool');
  });

  it('shows a refusal that names no field above the form', async () => {
    mockApi(routes({
      'GET /api/yarns': { body: { yarns: [] } },
      'POST /api/yarns': apiError(409, 'conflict', 'You already have a yarn called Oak gall wool'),
    }));
    renderApp('/yarns');
    await screen.findByText('No yarns yet');
    fireEvent.change(addForm().getByLabelText('Name'), { target: { value: 'Oak gall wool' } });
    fireEvent.click(addForm().getByRole('button', { name: 'Add yarn' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Could not add the yarn. You already have a yarn called Oak gall wool');
  });

  it('edits a yarn in its row and saves the change', async () => {
    const list = [madder, walnut];
    const server = mockApi(routes({
      'GET /api/yarns': stash(list),
      'PATCH /api/yarns/2': (request) => {
        list[1] = { ...walnut, ...(request.body as Partial<Yarn>), id: 2 };
        return { body: { yarn: list[1] } };
      },
    }));
    renderApp('/yarns');
    fireEvent.click(await screen.findByRole('button', { name: 'Edit Walnut linen' }));
    const form = within(screen.getByRole('button', { name: 'Save' }).closest('form')!);
    expect(form.getByLabelText<HTMLInputElement>('Name').value).toBe('Walnut linen');
    expect(form.getByLabelText<HTMLInputElement>('Colour').value).toBe('#5c4033');
    expect(form.getByLabelText<HTMLInputElement>('Yards per pound').value).toBe('');
    fireEvent.change(form.getByLabelText('Count'), { target: { value: '20/2' } });
    fireEvent.change(form.getByLabelText('Yards per pound'), { target: { value: '3000' } });
    fireEvent.click(form.getByRole('button', { name: 'Save' }));

    await waitFor(() => expect(screen.queryByRole('button', { name: 'Save' })).toBeNull());
    const [patch] = server.to('PATCH /api/yarns/2');
    expect(patch.body).toMatchObject({ name: 'Walnut linen', fibre: 'linen', colour: '#5c4033', count: '20/2', yardsPerPound: 3000 });
    expect(rowOf('Walnut linen').getByText('20/2')).toBeTruthy();
    expect(rowOf('Walnut linen').getByText('3000')).toBeTruthy();
    expect(server.to('GET /api/yarns')).toHaveLength(2);
  });

  it('cancels an edit without asking the server', async () => {
    const server = mockApi(routes({ 'GET /api/yarns': { body: { yarns: [madder] } } }));
    renderApp('/yarns');
    fireEvent.click(await screen.findByRole('button', { name: 'Edit Madder 8/2 cotton' }));
    const form = within(screen.getByRole('button', { name: 'Save' }).closest('form')!);
    fireEvent.change(form.getByLabelText('Name'), { target: { value: 'Renamed' } });
    fireEvent.click(form.getByRole('button', { name: 'Cancel' }));
    expect(screen.getByRole('rowheader', { name: 'Madder 8/2 cotton' })).toBeTruthy();
    expect(server.requests.filter((r) => r.method !== 'GET')).toEqual([]);
  });

  it('removes a yarn and reloads the list', async () => {
    const list = [madder, walnut];
    const server = mockApi(routes({
      'GET /api/yarns': stash(list),
      'DELETE /api/yarns/1': () => {
        list.splice(0, 1);
        return { status: 204 };
      },
    }));
    renderApp('/yarns');
    fireEvent.click(await screen.findByRole('button', { name: 'Remove Madder 8/2 cotton' }));
    await waitFor(() => expect(screen.queryByRole('rowheader', { name: 'Madder 8/2 cotton' })).toBeNull());
    expect(screen.getByRole('rowheader', { name: 'Walnut linen' })).toBeTruthy();
    expect(server.to('DELETE /api/yarns/1')).toHaveLength(1);
  });

  it('says when a change could not be saved, and keeps the edit open', async () => {
    mockApi(routes({
      'GET /api/yarns': { body: { yarns: [madder] } },
      'PATCH /api/yarns/1': apiError(404, 'not_found', 'No such yarn'),
    }));
    renderApp('/yarns');
    fireEvent.click(await screen.findByRole('button', { name: 'Edit Madder 8/2 cotton' }));
    fireEvent.click(screen.getByRole('button', { name: 'Save' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Could not save the yarn. No such yarn');
    expect(screen.getByRole('button', { name: 'Save' })).toBeTruthy();
  });

  it('says when a yarn could not be removed, and keeps it listed', async () => {
    mockApi(routes({
      'GET /api/yarns': { body: { yarns: [madder] } },
      'DELETE /api/yarns/1': { status: 503, text: '<h1>Service unavailable</h1>' },
    }));
    renderApp('/yarns');
    fireEvent.click(await screen.findByRole('button', { name: 'Remove Madder 8/2 cotton' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Could not remove Madder 8/2 cotton. The server could not answer just now.');
    expect(screen.getByRole('rowheader', { name: 'Madder 8/2 cotton' })).toBeTruthy();
  });
});
