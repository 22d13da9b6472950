import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it } from 'vitest';
import { sessionUser } from './support/factories';
import { apiError, mockApi } from './support/mock-api';
import { renderApp } from './support/render';

const signedOut = { 'GET /api/session': { body: { user: null } }, 'GET /api/csrf': { body: { token: 'tok-1' } } };

function fill(input: HTMLElement, value: string) {
  fireEvent.change(input, { target: { value } });
}

describe('sign-in form', () => {
  it('submits the e-mail and password and shows a bad-credentials error', async () => {
    const server = mockApi({
      ...signedOut,
      'POST /api/auth/sign-in': apiError(401, 'bad_credentials', 'Wrong e-mail or password.'),
    });
    const app = renderApp('/sign-in');
    fill(await screen.findByLabelText('E-mail'), 'wren@example.test');
    fill(screen.getByLabelText('Password'), 'not-the-password');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));

    const alert = await screen.findByRole('alert');
    expect(alert.textContent).toContain('That e-mail and password do not match an account.');
    const [request] = server.to('POST /api/auth/sign-in');
    expect(request.body).toEqual({ email: 'wren@example.test', password: 'not-the-password' });
    expect(request.headers.get('x-csrf-token')).toBe('tok-1');
    // Still here, with what was typed kept for a second try.
    expect(app.location()).toBe('/sign-in');
    expect(screen.getByLabelText<HTMLInputElement>('E-mail').value).toBe('wren@example.test');
  });

  it('asks for missing fields without sending anything', async () => {
    const server = mockApi(signedOut);
    renderApp('/sign-in');
    fireEvent.click(await screen.findByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Enter your e-mail address.')).toBeTruthy();
    expect(screen.getByText('Enter your password.')).toBeTruthy();
    expect(screen.getByLabelText('E-mail').getAttribute('aria-invalid')).toBe('true');
    expect(server.to('POST /api/auth/sign-in')).toHaveLength(0);
  });

  it('shows the API field errors beside their inputs, linked for screen readers', async () => {
    mockApi({ ...signedOut, 'POST /api/auth/sign-in': apiError(400, 'invalid', 'Check the form.', { email: 'Not an e-mail address.' }) });
    renderApp('/sign-in');
    fill(await screen.findByLabelText('E-mail'), 'wren@example.test');
    fill(screen.getByLabelText('Password'), 'whatever-it-is');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    const message = await screen.findByText('Not an e-mail address.');
    const input = screen.getByLabelText('E-mail');
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(input.getAttribute('aria-describedby')).toContain(message.closest('p')?.id);
  });

  it('checks the address with the same schema as the server and says what to write, sending nothing', async () => {
    const server = mockApi(signedOut);
    renderApp('/sign-in');
    fill(await screen.findByLabelText('E-mail'), 'wren');
    fill(screen.getByLabelText('Password'), 'whatever-it-is');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText('Write the whole e-mail address, such as ana@example.com.')).toBeTruthy();
    expect(server.to('POST /api/auth/sign-in')).toHaveLength(0);
    // Corrected, the message goes as the weaver types.
    fill(screen.getByLabelText('E-mail'), 'wren@example.test');
    await waitFor(() => expect(screen.queryByText('Write the whole e-mail address, such as ana@example.com.')).toBeNull());
  });

  it('signs in and goes to the drafts', async () => {
    mockApi({
      ...signedOut,
      'POST /api/auth/sign-in': { body: { user: sessionUser(), csrfToken: 'tok-2' } },
      'GET /api/drafts': { body: { items: [], total: 0, page: 1, pageSize: 20 } },
    });
    const app = renderApp('/sign-in');
    fill(await screen.findByLabelText('E-mail'), 'wren@example.test');
    fill(screen.getByLabelText('Password'), 'correct horse battery');
    fireEvent.click(screen.getByRole('button', { name: 'Sign in' }));
    await waitFor(() => expect(app.location()).toBe('/drafts'));
    const banner = await screen.findByRole('banner');
    expect(within(banner).getByText('Wren Hollis')).toBeTruthy();
  });
});
