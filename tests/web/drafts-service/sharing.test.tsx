import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { draftDetail } from '../support/factories';
import { apiError, mockApi } from '../support/mock-api';
import { renderApp } from '../support/render';
import { draftPageRoutes, stubOffscreenCanvas, twill } from './fixtures';

// The draft page loads the editor's chunk on first use; on a busy machine that outlasts the 5 s default.
vi.setConfig({ testTimeout: 15_000 });

const scarf = draftDetail({ id: 7, name: 'Point twill scarf', version: 4, role: 'editor', document: twill(8) });
// 32 random bytes in base64url, as the server makes them (invented).
const token = 'q3Xv9LmT0aZ_bYc8Nd-e1FgH2iJk4lMn5oPp6QrS7tU';
const url = `http://127.0.0.1:4780/shared/${token}`;

async function publicLink() {
  return within(await screen.findByRole('region', { name: 'Public link' }, { timeout: 5000 }));
}

describe('share controls', () => {
  afterEach(() => vi.restoreAllMocks());

  it('makes a link, shows it once with a copy button, and offers to withdraw it', async () => {
    const writeText = vi.spyOn(navigator.clipboard, 'writeText').mockResolvedValue(undefined);
    const server = mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/drafts/7/share': (_request, calls) => ({ body: calls === 1 ? { shared: false, createdAt: null } : { shared: true, createdAt: '2025-03-16T09:00:00.000Z' } }),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/share': { status: 201, body: { url, token } },
    });
    renderApp('/drafts/7/print');
    const panel = await publicLink();
    expect(await panel.findByText(/^No public link/)).toBeTruthy();
    expect(panel.queryByRole('button', { name: 'Withdraw link' })).toBeNull();
    fireEvent.click(panel.getByRole('button', { name: 'Make a public link' }));

    const field = await panel.findByLabelText<HTMLInputElement>('Link');
    expect(field.value).toBe(url);
    expect(field.readOnly).toBe(true);
    expect(panel.getByText('Anyone with the link can read this draft, without signing in.')).toBeTruthy();
    expect(panel.getByText('Shown once: keep it now.')).toBeTruthy();
    const [create] = server.to('POST /api/drafts/7/share');
    expect(create.body).toBeUndefined();
    expect(create.headers.get('x-csrf-token')).toBe('tok-1');

    fireEvent.click(panel.getByRole('button', { name: 'Copy' }));
    expect(writeText).toHaveBeenCalledWith(url);
    // Copying says it worked, so the weaver knows the link is ready to paste.
    expect((await panel.findByRole('status')).textContent).toContain('Copied: paste it where you need it.');
    expect(panel.getByRole('button', { name: 'Make a new link' })).toBeTruthy();
    expect(panel.getByRole('button', { name: 'Withdraw link' })).toBeTruthy();
  });

  it('withdraws a live link without ever showing it again', async () => {
    const server = mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/drafts/7/share': { body: { shared: true, createdAt: '2025-03-16T09:00:00.000Z' } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'DELETE /api/drafts/7/share': { body: { shared: false, createdAt: null } },
    });
    renderApp('/drafts/7/print');
    const panel = await publicLink();
    expect(await panel.findByText('Anyone with the link can read this draft, without signing in.')).toBeTruthy();
    // The server keeps only a hash: a live link made earlier cannot be shown.
    expect(panel.queryByLabelText('Link')).toBeNull();
    fireEvent.click(panel.getByRole('button', { name: 'Withdraw link' }));
    expect(await panel.findByText(/^No public link: only people who can open it in Shedwright/)).toBeTruthy();
    expect(panel.queryByRole('button', { name: 'Withdraw link' })).toBeNull();
    expect(panel.getByRole('button', { name: 'Make a public link' })).toBeTruthy();
    expect(server.to('DELETE /api/drafts/7/share')).toHaveLength(1);
  });

  it('hides the link it showed once the link is withdrawn', async () => {
    let live = false;
    mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/drafts/7/share': () => ({ body: { shared: live, createdAt: live ? '2025-03-16T09:00:00.000Z' : null } }),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/share': () => { live = true; return { status: 201, body: { url, token } }; },
      'DELETE /api/drafts/7/share': () => { live = false; return { body: { shared: false, createdAt: null } }; },
    });
    renderApp('/drafts/7/print');
    const panel = await publicLink();
    fireEvent.click(await panel.findByRole('button', { name: 'Make a public link' }));
    await panel.findByLabelText('Link');
    fireEvent.click(panel.getByRole('button', { name: 'Withdraw link' }));
    await waitFor(() => expect(panel.queryByLabelText('Link')).toBeNull());
    expect(panel.getByRole('button', { name: 'Make a public link' })).toBeTruthy();
  });

  it('does not show a fresh link the server already reports withdrawn', async () => {
    // Someone else on the draft withdrew it between the making and the status check.
    mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/share': { status: 201, body: { url, token } },
    });
    const app = renderApp('/drafts/7/print');
    const panel = await publicLink();
    fireEvent.click(await panel.findByRole('button', { name: 'Make a public link' }));
    await waitFor(() => expect(app.queryClient.getMutationCache().getAll()[0]?.state.status).toBe('success'));
    await waitFor(() => expect(app.queryClient.isFetching()).toBe(0));
    expect(panel.queryByLabelText('Link')).toBeNull();
    expect(panel.getByText(/^No public link/)).toBeTruthy();
  });

  it('shows why a link could not be made', async () => {
    mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/share': apiError(429, 'rate_limited', 'Too many links made; try again in a minute'),
    });
    renderApp('/drafts/7/print');
    const panel = await publicLink();
    fireEvent.click(await panel.findByRole('button', { name: 'Make a public link' }));
    expect((await panel.findByRole('alert')).textContent).toContain('Could not make a link. Too many links made; try again in a minute');
    expect(panel.queryByLabelText('Link')).toBeNull();
  });

  it('is not there for a viewer, who is not asked about the link at all', async () => {
    // No mock for GET /api/drafts/7/share: asking would fail the test.
    mockApi(draftPageRoutes({ ...scarf, role: 'viewer' }));
    renderApp('/drafts/7/print');
    await screen.findByRole('link', { name: 'Weaving Information File (WIF)' }, { timeout: 5000 });
    expect(screen.queryByRole('region', { name: 'Public link' })).toBeNull();
  });
});

describe('shared draft page', () => {
  beforeEach(stubOffscreenCanvas);

  it('shows the draft read-only to someone not signed in', async () => {
    const document = { ...twill(8), notes: 'Wet-finish in warm water.\nPress while damp.' };
    const server = mockApi({
      [`GET /api/shared/${token}`]: { body: { draft: { name: 'Point twill scarf', ownerName: 'Wren Hollis', version: 4, updatedAt: '2025-03-16T09:00:00.000Z', document } } },
    });
    renderApp(`/shared/${token}`);
    expect(await screen.findByRole('heading', { level: 1, name: 'Point twill scarf' })).toBeTruthy();
    expect(screen.getByText('Shared by Wren Hollis · version 4 · 8 ends on 4 shafts · read-only')).toBeTruthy();
    const cloth = screen.getByRole('img', { name: 'Cloth of Point twill scarf' });
    expect([cloth.getAttribute('width'), cloth.getAttribute('height')]).toEqual(['24', '12']);
    expect(screen.getByText(/^Wet-finish in warm water\./).textContent).toBe('Wet-finish in warm water.\nPress while damp.');
    expect(screen.queryByRole('region', { name: 'Draft editor' })).toBeNull();
    expect(screen.queryByRole('button')).toBeNull();
    // No sign-in check: the page asks for the shared draft and nothing else.
    expect(server.requests.map((r) => `${r.method} ${r.path}`)).toEqual([`GET /api/shared/${token}`]);
  });

  it('explains a withdrawn link', async () => {
    mockApi({ [`GET /api/shared/${token}`]: apiError(404, 'not_found', 'No such link') });
    renderApp(`/shared/${token}`);
    expect(await screen.findByText(/^This link does not work: it may have been withdrawn\./)).toBeTruthy();
    expect(screen.queryByRole('heading', { level: 1 })).toBeNull();
  });

  it('offers a retry when the server fails', async () => {
    const server = mockApi({ [`GET /api/shared/${token}`]: { status: 503, text: '<h1>Bad gateway</h1>' } });
    renderApp(`/shared/${token}`);
    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('Could not load the draft. The server could not answer just now.');
    fireEvent.click(within(alert).getByRole('button', { name: 'Try again' }));
    await waitFor(() => expect(server.to(`GET /api/shared/${token}`)).toHaveLength(2));
  });
});
