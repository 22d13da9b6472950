import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { draftDetail, sessionUser } from './support/factories';
import { apiError, mockApi } from './support/mock-api';
import { renderApp } from './support/render';

describe('draft page', () => {
  it('shows the draft facts and the region the editor mounts in', async () => {
    mockApi({
      'GET /api/session': { body: { user: sessionUser() } },
      'GET /api/drafts/7': { body: { draft: draftDetail({ id: 7, name: 'Two-block table mat', ends: 240, picks: 300, shafts: 8, role: 'viewer', studioName: 'Mill Lane Studio' }) } },
      // The Drafts service's parts of the page: yarns for a new colourway, lineage, comments.
      'GET /api/yarns': { body: { yarns: [] } },
      'GET /api/drafts/7/lineage': { body: { draft: { id: 7, name: 'Two-block table mat', ownerName: 'Wren Hollis', parentVersion: null }, ancestors: [], hiddenAncestors: 0, children: [] } },
      'GET /api/drafts/7/comments': { body: { comments: [] } },
    });
    renderApp('/drafts/7');
    expect(await screen.findByRole('heading', { level: 1, name: 'Two-block table mat' }, { timeout: 10_000 })).toBeTruthy();
    const fact = (label: string) => screen.getByText(label, { selector: 'dt' }).nextElementSibling?.textContent;
    expect(fact('Ends × picks')).toBe('240 × 300');
    expect(fact('Shafts')).toBe('8');
    expect(fact('Your role')).toBe('Viewer');
    expect(fact('Studio')).toBe('Mill Lane Studio');
    expect(screen.getByRole('region', { name: 'Draft editor' })).toBeTruthy();
  });

  it('says when a draft is not there or not shared', async () => {
    mockApi({ 'GET /api/session': { body: { user: sessionUser() } }, 'GET /api/drafts/8': apiError(404, 'not_found', 'No such draft.') });
    renderApp('/drafts/8');
    expect(await screen.findByRole('heading', { name: 'Draft not found' })).toBeTruthy();
  });

  it('treats a malformed id as an unknown page without asking the server', async () => {
    mockApi({ 'GET /api/session': { body: { user: sessionUser() } } });
    renderApp('/drafts/abc');
    expect(await screen.findByRole('heading', { name: 'Page not found' })).toBeTruthy();
  });
});

describe('captured mails', () => {
  it('lists mails with their links clickable', async () => {
    mockApi({
      'GET /api/session': { body: { user: sessionUser({ isAdmin: true }) } },
      'GET /api/dev/mails': {
        body: {
          mails: [
            { id: 'm1', to: 'wren@example.test', subject: 'Choose a new password', text: 'Open http://127.0.0.1:4780/reset?token=t0k within an hour.', date: '2025-03-14T10:00:00.000Z' },
          ],
        },
      },
    });
    renderApp('/admin/mails');
    const mail = await screen.findByRole('article', { name: 'Choose a new password' });
    expect(within(mail).getByRole('link', { name: 'http://127.0.0.1:4780/reset?token=t0k' }).getAttribute('href')).toBe('http://127.0.0.1:4780/reset?token=t0k');
    // A developer's tool, not an area of the product: signed in, the page sits in the usual frame without a place in the navigation.
    expect(within(screen.getByRole('navigation', { name: 'Main' })).queryByRole('link', { name: 'Mails' })).toBeNull();
  });

  it('explains the refusal to someone who may not read them', async () => {
    mockApi({ 'GET /api/session': { body: { user: null } }, 'GET /api/dev/mails': apiError(404, 'not_found', 'No such route') });
    renderApp('/admin/mails');
    expect((await screen.findByRole('alert')).textContent).toContain('only when the server runs in development mode');
  });
});

describe('sign-up, reset and account', () => {
  it('checks the password length first, then says a link is on its way (the same for any address)', async () => {
    const server = mockApi({
      'GET /api/session': { body: { user: null } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/auth/sign-up': { status: 202, body: { ok: true } },
    });
    renderApp('/sign-up?next=%2Fstudios');
    fireEvent.change(await screen.findByLabelText('Name'), { target: { value: 'Wren Hollis' } });
    fireEvent.change(screen.getByLabelText('E-mail'), { target: { value: 'wren@example.test' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'short' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));
    expect(await screen.findByText('Use at least 10 characters.')).toBeTruthy();
    expect(server.to('POST /api/auth/sign-up')).toHaveLength(0);

    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'long enough now' } });
    fireEvent.click(screen.getByRole('button', { name: 'Create account' }));
    expect((await screen.findByRole('status')).textContent).toContain('We sent a link to wren@example.test');
    expect(server.to('POST /api/auth/sign-up')[0].body).toEqual({ name: 'Wren Hollis', email: 'wren@example.test', password: 'long enough now', next: '/studios' });
  });

  it('makes the account from the mailed link with one button and goes where the sign-up was headed', async () => {
    const server = mockApi({
      'GET /api/session': { body: { user: null } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/auth/sign-up/confirm': { status: 201, body: { user: sessionUser(), csrfToken: 'tok-2' } },
      'GET /api/drafts': { body: { items: [], total: 0, page: 1, pageSize: 20 } },
    });
    const app = renderApp('/welcome?token=w3lc0me&next=%2F%2Fevil.example');
    fireEvent.click(await screen.findByRole('button', { name: 'Make my account' }));
    // A next path off this site is refused: the drafts instead.
    await waitFor(() => expect(app.location()).toBe('/drafts'));
    expect(server.to('POST /api/auth/sign-up/confirm')[0].body).toEqual({ token: 'w3lc0me' });
  });

  it('says a used sign-up link is used, and offers sign-in and sign-up instead of the button', async () => {
    mockApi({
      'GET /api/session': { body: { user: null } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/auth/sign-up/confirm': apiError(400, 'bad_request', 'This link is invalid, has been used or has expired; sign in, or sign up again'),
    });
    renderApp('/welcome?token=used');
    fireEvent.click(await screen.findByRole('button', { name: 'Make my account' }));
    expect((await screen.findByRole('alert')).textContent).toContain('has been used');
    expect(screen.queryByRole('button', { name: 'Make my account' })).toBeNull();
    expect(screen.getByRole('link', { name: 'Sign up again' }).getAttribute('href')).toBe('/sign-up');
  });

  it('sets a new password from the mailed token and opens the drafts', async () => {
    const server = mockApi({
      'GET /api/session': { body: { user: null } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/auth/reset': { body: { user: sessionUser(), csrfToken: 'tok-2' } },
      'GET /api/drafts': { body: { items: [], total: 0, page: 1, pageSize: 20 } },
    });
    const app = renderApp('/reset?token=abc');
    fireEvent.change(await screen.findByLabelText('New password'), { target: { value: 'a fresh password' } });
    fireEvent.change(screen.getByLabelText('New password again'), { target: { value: 'a fresh password' } });
    fireEvent.click(screen.getByRole('button', { name: 'Set password and sign in' }));
    await waitFor(() => expect(app.location()).toBe('/drafts'));
    expect(server.to('POST /api/auth/reset')[0].body).toEqual({ token: 'abc', password: 'a fresh password' });
  });

  it('answers a reset request the same way whatever the address', async () => {
    mockApi({ 'GET /api/session': { body: { user: null } }, 'GET /api/csrf': { body: { token: 'tok-1' } }, 'POST /api/auth/forgot': { status: 202 } });
    renderApp('/forgot');
    fireEvent.change(await screen.findByLabelText('E-mail'), { target: { value: 'someone@example.test' } });
    fireEvent.click(screen.getByRole('button', { name: 'Send the link' }));
    expect((await screen.findByRole('status')).textContent).toContain('If an account uses someone@example.test');
  });

  it('shows the account name, e-mail and studios', async () => {
    mockApi({
      'GET /api/session': { body: { user: sessionUser({ memberships: [{ studioId: 5, studioName: 'Mill Lane Studio', role: 'editor' }] }) } },
    });
    renderApp('/account');
    expect(await screen.findByRole('heading', { name: 'Account' })).toBeTruthy();
    expect(screen.getByText('wren@example.test')).toBeTruthy();
    expect(screen.getByRole('link', { name: 'Mill Lane Studio' }).getAttribute('href')).toBe('/studios/5');
    expect(within(screen.getByRole('navigation', { name: 'Main' })).queryByRole('link', { name: 'Mails' })).toBeNull();
  });
});
