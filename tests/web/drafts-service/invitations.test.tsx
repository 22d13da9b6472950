import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { member, sessionUser } from '../support/factories';
import { apiError, mockApi, type MockHandler } from '../support/mock-api';
import { renderApp } from '../support/render';

const token = 'Hq2m8ZcV0b-Yx7Lp3Nw_Td5Rk9Fs1Gj4Ua6Eo0Ii2Ck';

function studioRoutes(role: 'owner' | 'editor', more: Record<string, MockHandler> = {}): Record<string, MockHandler> {
  return {
    'GET /api/session': { body: { user: sessionUser({ memberships: [{ studioId: 5, studioName: 'Mill Lane Studio', role }] }) } },
    'GET /api/studios/5': { body: { studio: { id: 5, name: 'Mill Lane Studio', role }, members: [member({ userId: 1, name: 'Wren Hollis', role })] } },
    'GET /api/csrf': { body: { token: 'tok-1' } },
    ...more,
  };
}

async function inviteForm() {
  return within(await screen.findByRole('region', { name: 'Invite someone' }));
}

describe('invite form', () => {
  it('lets an owner invite by e-mail in a chosen role, then clears the address', async () => {
    const server = mockApi(studioRoutes('owner', {
      'POST /api/studios/5/invitations': { status: 201, body: { invitation: { email: 'ola@example.test', role: 'editor', expiresAt: '2025-03-23T09:00:00.000Z' } } },
    }));
    renderApp('/studios/5');
    const form = await inviteForm();
    const send = form.getByRole<HTMLButtonElement>('button', { name: 'Send invitation' });
    expect(send.disabled).toBe(true);
    const role = form.getByLabelText<HTMLSelectElement>('Role');
    expect(role.value).toBe('viewer');
    expect([...role.options].map((o) => o.textContent)).toEqual(['Owner', 'Editor', 'Viewer']);
    fireEvent.change(form.getByLabelText('E-mail'), { target: { value: ' ola@example.test ' } });
    fireEvent.change(role, { target: { value: 'editor' } });
    fireEvent.click(send);

    expect((await form.findByRole('status')).textContent).toBe('Invitation sent to ola@example.test.');
    const [invite] = server.to('POST /api/studios/5/invitations');
    expect(invite.body).toEqual({ email: 'ola@example.test', role: 'editor' });
    expect(invite.headers.get('x-csrf-token')).toBe('tok-1');
    expect(form.getByLabelText<HTMLInputElement>('E-mail').value).toBe('');
  });

  it('is not offered to an editor', async () => {
    mockApi(studioRoutes('editor'));
    renderApp('/studios/5');
    await screen.findByRole('heading', { name: 'Mill Lane Studio' });
    expect(screen.queryByRole('region', { name: 'Invite someone' })).toBeNull();
    expect(screen.queryByRole('button', { name: 'Send invitation' })).toBeNull();
  });

  it('shows a refusal of the address beside the field', async () => {
    mockApi(studioRoutes('owner', {
      'POST /api/studios/5/invitations': apiError(400, 'validation', 'Some fields are not valid', { email: 'Invalid email address' }),
    }));
    renderApp('/studios/5');
    const form = await inviteForm();
    fireEvent.change(form.getByLabelText('E-mail'), { target: { value: 'ola@example' } });
    fireEvent.click(form.getByRole('button', { name: 'Send invitation' }));
    expect(await form.findByText('Invalid email address')).toBeTruthy();
    expect(form.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
    expect(form.getByLabelText<HTMLInputElement>('E-mail').value).toBe('ola@example');
    expect(form.queryByRole('status')).toBeNull();
  });

  it('shows a refusal that names no field as a notice', async () => {
    mockApi(studioRoutes('owner', {
      'POST /api/studios/5/invitations': apiError(409, 'conflict', 'ola@example.test is already in this studio'),
    }));
    renderApp('/studios/5');
    const form = await inviteForm();
    fireEvent.change(form.getByLabelText('E-mail'), { target: { value: 'ola@example.test' } });
    fireEvent.click(form.getByRole('button', { name: 'Send invitation' }));
    expect((await form.findByRole('alert')).textContent).toContain('Could not send the invitation. ola@example.test is already in this studio');
  });
});

describe('join page', () => {
  it('accepts the token from the link once and welcomes the new member', async () => {
    const server = mockApi({
      'GET /api/session': { body: { user: sessionUser() } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/invitations/accept': { body: { studio: { id: 5, name: 'Mill Lane Studio', role: 'editor' } } },
    });
    renderApp(`/join?token=${token}`);
    expect(await screen.findByRole('heading', { name: 'Welcome to Mill Lane Studio' })).toBeTruthy();
    expect(screen.getByText('You are in the studio as editor.')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Open the studio' }).getAttribute('href')).toBe('/studios/5');
    expect(screen.getByRole('link', { name: 'See its drafts' }).getAttribute('href')).toBe('/drafts?studio=5');
    expect(server.to('POST /api/invitations/accept').map((r) => r.body)).toEqual([{ token }]);
    // The session lists the studios, so it is asked again.
    await waitFor(() => expect(server.to('GET /api/session')).toHaveLength(2));
    expect(server.to('POST /api/invitations/accept')).toHaveLength(1);
  });

  it('explains a link with no token and sends nothing', async () => {
    const server = mockApi({ 'GET /api/session': { body: { user: sessionUser() } } });
    renderApp('/join');
    expect(await screen.findByText(/^This link has no invitation in it\./)).toBeTruthy();
    expect(server.requests.filter((r) => r.method !== 'GET')).toEqual([]);
  });

  it("shows the server's reason when the invitation no longer works", async () => {
    mockApi({
      'GET /api/session': { body: { user: sessionUser() } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/invitations/accept': apiError(404, 'not_found', 'This invitation has expired or was already used'),
    });
    renderApp(`/join?token=${token}`);
    expect((await screen.findByRole('alert')).textContent).toContain('Could not join the studio. This invitation has expired or was already used');
    expect(screen.queryByRole('heading', { name: /^Welcome/ })).toBeNull();
  });
});
