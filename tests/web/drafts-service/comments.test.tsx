import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import type { Comment } from '../../../src/types/api';
import { draftDetail } from '../support/factories';
import { apiError, mockApi } from '../support/mock-api';
import { renderApp } from '../support/render';
import { draftPageRoutes, twill } from './fixtures';

// The draft page loads the editor's chunk on first use; on a busy machine that outlasts the 5 s default.
vi.setConfig({ testTimeout: 15_000 });

// The signed-in weaver is user 1 (the factories' Wren Hollis).
const scarf = draftDetail({ id: 7, name: 'Point twill scarf', version: 4, role: 'viewer', document: twill(8) });

function comment(overrides: Partial<Comment> = {}): Comment {
  return { id: 1, authorId: 1, authorName: 'Wren Hollis', text: 'Is the hem plain weave?', version: null, end: null, pick: null, createdAt: '2025-03-16T09:00:00.000Z', ...overrides };
}

/** Opens the draft page and finds its comments. */
async function panel() {
  renderApp('/drafts/7/discussion');
  return within(await screen.findByRole('region', { name: 'Comments' }, { timeout: 5000 }));
}

describe('comments', () => {
  it('lists comments with where they point, and a delete button on my own only', async () => {
    mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/drafts/7/comments': {
        body: {
          comments: [
            comment({ id: 1, authorId: 2, authorName: 'Tamsin Greaves', text: 'Long float here?', version: 3, end: 12, pick: 30 }),
            comment({ id: 2, text: 'Fixed in version 4.\nThanks!', version: 4 }),
          ],
        },
      },
    });
    const comments = await panel();
    const items = await comments.findAllByRole('listitem');
    expect(items).toHaveLength(2);
    const meta = (item: HTMLElement) => item.querySelector('p')?.textContent ?? '';
    expect(meta(items[0])).toMatch(/^Tamsin Greaves · .+ · version 3 · end 12 · pick 30$/);
    expect(items[0].querySelector('time')?.getAttribute('dateTime')).toBe('2025-03-16T09:00:00.000Z');
    expect(within(items[0]).getByText('Long float here?')).toBeTruthy();
    expect(within(items[0]).queryByRole('button', { name: 'Delete this comment' })).toBeNull();
    expect(meta(items[1])).toMatch(/^Wren Hollis · .+ · version 4$/);
    expect(within(items[1]).getByText(/^Fixed in version 4\./).textContent).toBe('Fixed in version 4.\nThanks!');
    expect(within(items[1]).getByRole('button', { name: 'Delete this comment' })).toBeTruthy();
  });

  it('posts a comment on the current version at an end and pick, then clears the form and shows it', async () => {
    const posted = comment({ id: 3, text: 'Check the tie-up for treadle 2', version: 4, end: 12, pick: 30 });
    const server = mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/drafts/7/comments': (_request, calls) => ({ body: { comments: calls === 1 ? [] : [posted] } }),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/comments': { status: 201, body: { comment: posted } },
    });
    const comments = await panel();
    expect(await comments.findByText('No comments yet.')).toBeTruthy();
    const post = comments.getByRole<HTMLButtonElement>('button', { name: 'Post comment' });
    expect(post.disabled).toBe(true);
    const text = comments.getByLabelText<HTMLTextAreaElement>('Add a comment on version 4');
    fireEvent.change(text, { target: { value: '  Check the tie-up for treadle 2 ' } });
    fireEvent.change(comments.getByLabelText('End (optional)'), { target: { value: '12' } });
    fireEvent.change(comments.getByLabelText('Pick (optional)'), { target: { value: '30' } });
    fireEvent.click(post);

    expect(await comments.findByText('Check the tie-up for treadle 2')).toBeTruthy();
    const [request] = server.to('POST /api/drafts/7/comments');
    expect(request.body).toEqual({ text: 'Check the tie-up for treadle 2', version: 4, end: 12, pick: 30 });
    expect(request.headers.get('x-csrf-token')).toBe('tok-1');
    expect(text.value).toBe('');
    expect(comments.getByLabelText<HTMLInputElement>('End (optional)').value).toBe('');
    expect(comments.getByLabelText<HTMLInputElement>('Pick (optional)').value).toBe('');
  });

  it('leaves out the end and pick when none are given', async () => {
    const server = mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/comments': { status: 201, body: { comment: comment({ id: 4, text: 'Lovely', version: 4 }) } },
    });
    const comments = await panel();
    fireEvent.change(comments.getByLabelText('Add a comment on version 4'), { target: { value: 'Lovely' } });
    fireEvent.click(comments.getByRole('button', { name: 'Post comment' }));
    await waitFor(() => expect(server.to('POST /api/drafts/7/comments')).toHaveLength(1));
    expect(server.to('POST /api/drafts/7/comments')[0].body).toEqual({ text: 'Lovely', version: 4 });
  });

  it('shows a refusal, marks the field it names and keeps what was typed', async () => {
    mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/comments': apiError(400, 'validation', 'Some fields are not valid', { end: 'Too big: expected number to be <=20000' }),
    });
    const comments = await panel();
    fireEvent.change(comments.getByLabelText('Add a comment on version 4'), { target: { value: 'Here' } });
    fireEvent.change(comments.getByLabelText('End (optional)'), { target: { value: '30000' } });
    fireEvent.click(comments.getByRole('button', { name: 'Post comment' }));
    expect((await comments.findByRole('alert')).textContent).toContain('Could not post the comment. Some fields are not valid');
    // The refused field is marked and says why in words tied to it, not by its red border alone.
    const endField = comments.getByLabelText('End (optional)');
    expect(endField.getAttribute('aria-invalid')).toBe('true');
    const reason = document.getElementById(endField.getAttribute('aria-describedby') ?? '');
    expect(reason?.textContent).toContain('Too big');
    const pickField = comments.getByLabelText('Pick (optional)');
    expect(pickField.getAttribute('aria-invalid')).not.toBe('true');
    expect(pickField.getAttribute('aria-describedby')).toBeNull();
    expect(comments.getByLabelText<HTMLTextAreaElement>('Add a comment on version 4').value).toBe('Here');
  });

  it('deletes my own comment and reloads the list', async () => {
    const server = mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/drafts/7/comments': (_request, calls) => ({ body: { comments: calls === 1 ? [comment({ id: 5, text: 'Typo in the notes' })] : [] } }),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'DELETE /api/drafts/7/comments/5': { status: 204 },
    });
    const comments = await panel();
    fireEvent.click(await comments.findByRole('button', { name: 'Delete this comment' }));
    expect(await comments.findByText('No comments yet.')).toBeTruthy();
    expect(server.to('DELETE /api/drafts/7/comments/5')).toHaveLength(1);
    expect(server.to('GET /api/drafts/7/comments')).toHaveLength(2);
  });

  it('says when a comment could not be deleted, and keeps it', async () => {
    mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/drafts/7/comments': { body: { comments: [comment({ id: 5, text: 'Typo in the notes' })] } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'DELETE /api/drafts/7/comments/5': apiError(404, 'not_found', 'No such comment'),
    });
    const comments = await panel();
    fireEvent.click(await comments.findByRole('button', { name: 'Delete this comment' }));
    expect((await comments.findByRole('alert')).textContent).toContain('Could not delete the comment. No such comment');
    expect(comments.getByText('Typo in the notes')).toBeTruthy();
  });
});
