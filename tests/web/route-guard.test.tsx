import fc from 'fast-check';
import { fireEvent, screen, waitFor } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { safeNextPath, signInPathFor } from '../../src/features/auth/next-path';
import { draftsPage, sessionUser } from './support/factories';
import { apiError, mockApi } from './support/mock-api';
import { renderApp } from './support/render';

describe('sign-in guard', () => {
  it('sends a signed-out visitor to sign in, then back to the page they asked for', async () => {
    const server = mockApi({
      'GET /api/session': { body: { user: null } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/auth/sign-in': { body: { user: sessionUser(), csrfToken: 'tok-2' } },
      'GET /api/drafts': { body: draftsPage([]) },
    });
    const app = renderApp('/drafts?q=mat');
    await waitFor(() => expect(app.location()).toBe('/sign-in?next=%2Fdrafts%3Fq%3Dmat'));
    // Nothing behind the guard was asked for while signed out.
    expect(server.to('GET /api/drafts')).toHaveLength(0);

    fireEvent.change(await screen.findByLabelText('E-mail'), { target: { value: 'wren@example.test' } });
    fireEvent.change(screen.getByLabelText('Password'), { target: { value: 'correct horse battery' } });
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(app.location()).toBe('/drafts?q=mat'));
    expect(await screen.findByRole('heading', { name: 'Drafts' })).toBeTruthy();
  });

  it('sends a signed-in weaver from the sign-in page to the drafts', async () => {
    mockApi({ 'GET /api/session': { body: { user: sessionUser() } }, 'GET /api/drafts': { body: draftsPage([]) } });
    const app = renderApp('/sign-in');
    await waitFor(() => expect(app.location()).toBe('/drafts'));
  });

  it('opens the drafts from the bare address', async () => {
    mockApi({ 'GET /api/session': { body: { user: sessionUser() } }, 'GET /api/drafts': { body: draftsPage([]) } });
    const app = renderApp('/');
    await waitFor(() => expect(app.location()).toBe('/drafts'));
  });

  it('goes to sign in when the session ends while a page is open', async () => {
    mockApi({
      'GET /api/session': { body: { user: sessionUser() } },
      'GET /api/drafts': apiError(401, 'signed_out', 'Please sign in.'),
      'GET /api/csrf': { body: { token: 'tok-1' } },
    });
    const app = renderApp('/drafts');
    await waitFor(() => expect(app.location()).toBe('/sign-in?next=%2Fdrafts'));
  });

  it('signs out from the top bar', async () => {
    mockApi({
      'GET /api/session': { body: { user: sessionUser() } },
      'GET /api/drafts': { body: draftsPage([]) },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/auth/sign-out': { body: { csrfToken: 'tok-anon' } },
    });
    const app = renderApp('/drafts');
    fireEvent.click(await screen.findByRole('button', { name: 'Sign out' }));
    await waitFor(() => expect(app.location()).toMatch(/^\/sign-in/));
    expect(await screen.findByRole('heading', { name: 'Sign in' })).toBeTruthy();
  });
});

describe('where to go after signing in', () => {
  it('keeps paths inside the site', () => {
    expect(safeNextPath('/studios/3?tab=members')).toBe('/studios/3?tab=members');
    expect(signInPathFor('/drafts?q=mat')).toBe('/sign-in?next=%2Fdrafts%3Fq%3Dmat');
    expect(signInPathFor('/')).toBe('/sign-in');
  });

  it('refuses addresses that would leave the site', () => {
    for (const raw of ['https://evil.example/', '//evil.example', '/\\evil.example', '/\t/evil.example', 'javascript:alert(1)', '', null]) {
      expect(safeNextPath(raw)).toBe('/drafts');
    }
  });

  it('only ever answers a same-site path (property)', () => {
    const tricky = fc.constantFrom('/', '//', '/\\', '\\', 'http:', 'https://', '/\n/', ' /', '/sign-in');
    const raw = fc.oneof(fc.string(), fc.tuple(tricky, fc.string()).map(([a, b]) => a + b));
    fc.assert(
      fc.property(raw, (input) => {
        const out = safeNextPath(input);
        expect(out.startsWith('/')).toBe(true);
        expect(out.startsWith('//')).toBe(false);
        // eslint-disable-next-line no-control-regex -- the path must carry no control character
        expect(out).not.toMatch(/[\u0000-\u001f\u007f\\]/);
        // Resolved against the site, it stays on the site.
        expect(new URL(out, 'https://shedwright.test').origin).toBe('https://shedwright.test');
        expect(out === input || out === '/drafts').toBe(true);
      }),
    );
  });
});
