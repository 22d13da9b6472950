// States that used to be told by colour or fading alone now come with words (WCAG 2.2 SC 1.4.1 use
// of colour, 3.3.1 error identification, 1.4.3 contrast).
import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { fireEvent, render, screen, within } from '@testing-library/react';
import { MemoryRouter } from 'react-router-dom';
import { describe, expect, it } from 'vitest';
import { expandProfile } from '../../shared/weave';
import { CommentsPanel } from '../../src/features/comments/components/comments-panel';
import { DraftEditor } from '../../src/features/editor';
import { DraftsTable } from '../../src/features/library/components/drafts-table';
import { DEFAULT_DRAFTS_SEARCH } from '../../src/features/library/drafts-search';
import { doubleWeaveProfile } from '../helpers/draft-fixtures';
import { draftSummary } from './support/factories';
import { apiError, mockApi } from './support/mock-api';

/** The element an input's aria-describedby names, as text. */
const description = (input: HTMLElement) =>
  (input.getAttribute('aria-describedby') ?? '').split(' ').map((id) => document.getElementById(id)?.textContent ?? '').join(' ');

describe('words where there was only colour', () => {
  it('says the library list is updating instead of fading it', () => {
    render(
      <MemoryRouter>
        <DraftsTable drafts={[draftSummary({ name: 'Harbour mat' })]} search={DEFAULT_DRAFTS_SEARCH} onSort={() => {}} stale />
      </MemoryRouter>,
    );
    expect(screen.getByRole('status').textContent).toBe('Updating the list…');
    const table = screen.getByRole('table');
    expect(table.getAttribute('aria-busy')).toBe('true');
    expect(table.className).not.toMatch(/opacity/);
  });

  it('gives a refused end number its reason beside the field, not only a red border', async () => {
    mockApi({
      'GET /api/drafts/7/comments': { body: { comments: [] } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/comments': apiError(400, 'validation', 'Some fields are not valid', { end: 'This draft has 240 ends.' }),
    });
    const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
    render(
      <QueryClientProvider client={client}>
        <CommentsPanel draftId={7} version={1} currentUserId={1} />
      </QueryClientProvider>,
    );
    await screen.findByText('No comments yet.');
    fireEvent.change(screen.getByLabelText('Add a comment on version 1'), { target: { value: 'Too tight here' } });
    fireEvent.change(screen.getByLabelText('End (optional)'), { target: { value: '900' } });
    fireEvent.click(screen.getByRole('button', { name: 'Post comment' }));
    await screen.findByText('This draft has 240 ends.');
    const end = screen.getByLabelText('End (optional)');
    expect(end.getAttribute('aria-invalid')).toBe('true');
    expect(description(end)).toContain('This draft has 240 ends.');
    expect(screen.getByLabelText('Pick (optional)').getAttribute('aria-invalid')).toBeNull();
  });

  it('explains a colour that is not one, beside its box', () => {
    render(<DraftEditor draft={expandProfile(doubleWeaveProfile(), 'double-weave')} version={1} />);
    const hex = screen.getByLabelText('Colour 1: hex');
    expect(hex.getAttribute('aria-invalid')).toBe('false');
    fireEvent.change(hex, { target: { value: '#12' } });
    expect(hex.getAttribute('aria-invalid')).toBe('true');
    expect(description(hex)).toMatch(/# and six digits or letters a–f/);
    const row = hex.closest('li')!;
    expect(within(row).getByText(/such as #2f44b0/)).toBeTruthy();
  });
});
