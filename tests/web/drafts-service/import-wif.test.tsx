import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { draftSummary, draftsPage, sessionUser } from '../support/factories';
import { apiError, mockApi, type MockHandler } from '../support/mock-api';
import { renderApp } from '../support/render';

function routes(more: Record<string, MockHandler>): Record<string, MockHandler> {
  return { 'GET /api/session': { body: { user: sessionUser() } }, 'GET /api/csrf': { body: { token: 'tok-1' } }, ...more };
}

// A made-up file in the WIF layout (INI sections, from memory); the client sends it unread, so its contents do not matter here.
const wif = (text = '[WIF]\nVersion=1.1\n') => new File([text], 'scarf.wif', { type: 'text/plain' });

function chooseFile(file: File) {
  fireEvent.change(screen.getByTestId('wif-file'), { target: { files: [file] } });
}

describe('import WIF button', () => {
  it('opens the file picker from the button', async () => {
    mockApi(routes({ 'GET /api/drafts': { body: draftsPage([]) } }));
    renderApp('/drafts');
    const button = await screen.findByRole('button', { name: 'Import WIF file' });
    const input = screen.getByTestId<HTMLInputElement>('wif-file');
    const click = vi.spyOn(input, 'click').mockImplementation(() => undefined);
    fireEvent.click(button);
    expect(click).toHaveBeenCalledOnce();
    expect(input.accept).toBe('.wif,text/plain');
  });

  it('sends the file as multipart, links the new draft and refreshes the list', async () => {
    const server = mockApi(routes({
      'GET /api/drafts': (_request, calls) => ({ body: draftsPage(calls === 1 ? [] : [draftSummary({ id: 21, name: 'Imported scarf' })]) }),
      'POST /api/drafts/import-wif': { status: 201, body: { draft: draftSummary({ id: 21, name: 'Imported scarf' }) } },
    }));
    renderApp('/drafts');
    await screen.findByText('No drafts yet');
    const file = wif();
    chooseFile(file);
    const status = await screen.findByRole('status');
    expect(status.textContent).toBe('Imported Imported scarf.');
    expect(within(status).getByRole('link', { name: 'Imported scarf' }).getAttribute('href')).toBe('/drafts/21');
    const [upload] = server.to('POST /api/drafts/import-wif');
    expect(upload.headers.get('x-csrf-token')).toBe('tok-1');
    expect(upload.headers.get('content-type')).toBeNull();
    const call = vi.mocked(fetch).mock.calls.find(([, init]) => init?.body instanceof FormData);
    expect((call?.[1]?.body as FormData).get('file')).toBe(file);
    await waitFor(() => expect(server.to('GET /api/drafts')).toHaveLength(2));
  });

  it('lists what the import had to guess, after the import, so the weaver can check it', async () => {
    mockApi(routes({
      'GET /api/drafts': (_request, calls) => ({ body: draftsPage(calls === 1 ? [] : [draftSummary({ id: 22, name: 'Old mat' })]) }),
      'POST /api/drafts/import-wif': {
        status: 201,
        body: { draft: draftSummary({ id: 22, name: 'Old mat' }), warnings: ['[WIF] gives no Version; read as 1.1.', '3 palette entries had no colour in [COLOR TABLE] and are shown black.'] },
      },
    }));
    renderApp('/drafts');
    await screen.findByText('No drafts yet');
    chooseFile(wif());
    const status = await screen.findByRole('status');
    expect(status.textContent).toContain('Imported Old mat. Check these before weaving from it:');
    const guesses = within(status).getByRole('list', { name: 'What the import had to guess' });
    expect(within(guesses).getAllByRole('listitem').map((li) => li.textContent)).toEqual([
      '[WIF] gives no Version; read as 1.1.',
      '3 palette entries had no colour in [COLOR TABLE] and are shown black.',
    ]);
  });

  it("shows the API's 422 reason for a file it cannot read", async () => {
    const reason = 'Line 4: [THREADING] names shaft 9, but [WEAVING] has 8 shafts';
    const server = mockApi(routes({
      'GET /api/drafts': { body: draftsPage([]) },
      'POST /api/drafts/import-wif': apiError(422, 'unprocessable', reason, { file: reason }),
    }));
    renderApp('/drafts');
    await screen.findByText('No drafts yet');
    chooseFile(wif('[WIF]\n[THREADING]\n1=9\n'));
    expect((await screen.findByRole('alert')).textContent).toContain(`Could not import the file. ${reason}`);
    expect(screen.queryByRole('status')).toBeNull();
    expect(server.to('POST /api/drafts/import-wif')).toHaveLength(1);
    // Nothing was added, so the list is not asked again.
    expect(server.to('GET /api/drafts')).toHaveLength(1);
  });

  it("shows the API's refusal of a file over the size limit", async () => {
    mockApi(routes({
      'GET /api/drafts': { body: draftsPage([]) },
      'POST /api/drafts/import-wif': apiError(413, 'too_large', 'The file is larger than 4 MB'),
    }));
    renderApp('/drafts');
    await screen.findByText('No drafts yet');
    chooseFile(wif());
    expect((await screen.findByRole('alert')).textContent).toContain('Could not import the file. The file is larger than 4 MB');
  });
});
