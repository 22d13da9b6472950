import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { member, sessionUser } from './support/factories';
import { apiError, mockApi } from './support/mock-api';
import { renderApp } from './support/render';

const me = sessionUser({ id: 1, memberships: [{ studioId: 5, studioName: 'Mill Lane Studio', role: 'owner' }] });
const owner = member({ userId: 1, name: 'Wren Hollis', email: 'wren@example.test', role: 'owner' });
const assistant = member({ userId: 2, name: 'Tamsin Greaves', role: 'editor' });
const student = member({ userId: 3, name: 'Ola Brightwater', email: 'ola@example.test', role: 'viewer' });

function studioAs(role: 'owner' | 'editor' | 'viewer') {
  return { body: { studio: { id: 5, name: 'Mill Lane Studio', role }, members: [owner, assistant, student] } };
}

describe('studio members', () => {
  it('lets an owner change roles and remove others, but not themself', async () => {
    const server = mockApi({
      'GET /api/session': { body: { user: me } },
      'GET /api/studios/5': studioAs('owner'),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'PATCH /api/studios/5/members/3': { body: { members: [owner, assistant, { ...student, role: 'editor' }] } },
    });
    renderApp('/studios/5');
    const row = (name: string) => within(screen.getByRole('row', { name: new RegExp(name) }));

    await screen.findByRole('heading', { name: 'Mill Lane Studio' });
    expect(row('Wren Hollis').queryByRole('combobox')).toBeNull();
    expect(row('Wren Hollis').getByRole('button', { name: 'Leave studio' })).toBeTruthy();
    expect(row('Tamsin Greaves').getByRole('button', { name: 'Remove Tamsin Greaves' })).toBeTruthy();

    const select = row('Ola Brightwater').getByRole('combobox', { name: 'Role of Ola Brightwater' });
    const save = row('Ola Brightwater').getByRole<HTMLButtonElement>('button', { name: 'Save role of Ola Brightwater' });
    expect(save.disabled).toBe(true);
    fireEvent.change(select, { target: { value: 'editor' } });
    fireEvent.click(save);
    await waitFor(() => expect(server.to('PATCH /api/studios/5/members/3')).toHaveLength(1));
    const [patch] = server.to('PATCH /api/studios/5/members/3');
    expect(patch.body).toEqual({ role: 'editor' });
    expect(patch.headers.get('x-csrf-token')).toBe('tok-1');
    await waitFor(() => expect(save.disabled).toBe(true));
  });

  it('shows an editor the roles as text, with no controls over others', async () => {
    mockApi({ 'GET /api/session': { body: { user: sessionUser({ id: 2 }) } }, 'GET /api/studios/5': studioAs('editor') });
    renderApp('/studios/5');
    await screen.findByRole('heading', { name: 'Mill Lane Studio' });
    expect(screen.queryAllByRole('combobox')).toHaveLength(0);
    expect(screen.queryByRole('button', { name: /^Remove/ })).toBeNull();
    expect(within(screen.getByRole('row', { name: /Tamsin Greaves/ })).getByRole('button', { name: 'Leave studio' })).toBeTruthy();
    expect(within(screen.getByRole('row', { name: /Ola Brightwater/ })).getByText('Viewer')).toBeTruthy();
  });

  it('asks before removing, and shows a refusal from the server', async () => {
    mockApi({
      'GET /api/session': { body: { user: me } },
      'GET /api/studios/5': studioAs('owner'),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'DELETE /api/studios/5/members/2': apiError(409, 'conflict', 'Tamsin owns drafts in this studio.'),
    });
    renderApp('/studios/5');
    fireEvent.click(await screen.findByRole('button', { name: 'Remove Tamsin Greaves' }));
    fireEvent.click(screen.getByRole('button', { name: 'Yes, remove' }));
    expect((await screen.findByRole('alert')).textContent).toContain('Tamsin owns drafts in this studio.');
  });

  it('takes a member who leaves back to the studio list', async () => {
    mockApi({
      'GET /api/session': { body: { user: sessionUser({ id: 3 }) } },
      'GET /api/studios/5': studioAs('viewer'),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'DELETE /api/studios/5/members/3': { body: { members: [owner, assistant] } },
      'GET /api/studios': { body: { studios: [] } },
    });
    const app = renderApp('/studios/5');
    fireEvent.click(await screen.findByRole('button', { name: 'Leave studio' }));
    fireEvent.click(screen.getByRole('button', { name: 'Yes, leave' }));
    await waitFor(() => expect(app.location()).toBe('/studios'));
    expect(await screen.findByText('No studios yet')).toBeTruthy();
  });

  it('says a studio is not found when the server hides it', async () => {
    mockApi({ 'GET /api/session': { body: { user: me } }, 'GET /api/studios/9': apiError(404, 'not_found', 'No such studio.') });
    renderApp('/studios/9');
    expect(await screen.findByRole('heading', { name: 'Studio not found' })).toBeTruthy();
  });

  it('creates a studio and opens it', async () => {
    const server = mockApi({
      'GET /api/session': { body: { user: me } },
      'GET /api/studios': { body: { studios: [{ id: 5, name: 'Mill Lane Studio', role: 'owner', memberCount: 3 }] } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/studios': { status: 201, body: { studio: { id: 6, name: 'Tuesday guild', role: 'owner' } } },
      'GET /api/studios/6': { body: { studio: { id: 6, name: 'Tuesday guild', role: 'owner' }, members: [owner] } },
    });
    const app = renderApp('/studios');
    expect(await screen.findByText('Owner · 3 members')).toBeTruthy();
    fireEvent.change(screen.getByLabelText('Studio name'), { target: { value: '  Tuesday guild ' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create studio' }));
    await waitFor(() => expect(app.location()).toBe('/studios/6'));
    expect(server.to('POST /api/studios')[0].body).toEqual({ name: 'Tuesday guild' });
    expect(await screen.findByRole('heading', { name: 'Tuesday guild' })).toBeTruthy();
  });
});
