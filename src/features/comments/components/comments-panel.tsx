import { LOCALE } from '../../../../shared/words';
import { useId, useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { FieldError } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import { Spinner } from '../../../components/ui/spinner';
import { useAddComment } from '../api/add-comment';
import { useDeleteComment } from '../api/delete-comment';
import { useComments } from '../api/get-comments';

const when = new Intl.DateTimeFormat(LOCALE, { dateStyle: 'medium', timeStyle: 'short' });
const optionalNumber = (text: string) => (text.trim() === '' ? undefined : Number(text));

/** Questions and notes on a draft; anyone who can see it may comment, and delete their own. */
export function CommentsPanel({ draftId, version, currentUserId }: { draftId: number; version: number; currentUserId: number }) {
  const comments = useComments(draftId);
  const add = useAddComment(draftId);
  const remove = useDeleteComment(draftId);
  const [text, setText] = useState('');
  const [end, setEnd] = useState('');
  const [pick, setPick] = useState('');
  const fields = fieldErrorsOf(add.error);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (!text.trim()) return;
    add.mutate({ text: text.trim(), version, end: optionalNumber(end), pick: optionalNumber(pick) }, {
      onSuccess: () => { setText(''); setEnd(''); setPick(''); },
    });
  };

  return (
    <section aria-labelledby="comments-heading" className="flex flex-col gap-3 text-sm">
      <h2 id="comments-heading" className="text-lg font-semibold">Comments</h2>
      {remove.isError && <ErrorNotice title="Could not delete the comment" error={remove.error} />}
      {comments.isPending ? <Spinner label="Loading comments…" /> : comments.isError ? (
        <ErrorNotice title="Could not load comments" error={comments.error} onRetry={() => void comments.refetch()} />
      ) : comments.data.comments.length === 0 ? (
        <p className="text-muted">No comments yet.</p>
      ) : (
        <ul className="flex flex-col gap-2">
          {comments.data.comments.map((c) => (
            <li key={c.id} className="rounded-md border border-line bg-surface p-3">
              <p className="text-xs text-muted">
                {c.authorName} · <time dateTime={c.createdAt}>{when.format(new Date(c.createdAt))}</time>
                {c.version !== null && ` · version ${c.version}`}
                {c.end !== null && ` · end ${c.end}`}
                {c.pick !== null && ` · pick ${c.pick}`}
              </p>
              <p className="whitespace-pre-line">{c.text}</p>
              {c.authorId === currentUserId && (
                <Button variant="quiet" onClick={() => remove.mutate(c.id)}>Delete<span className="sr-only"> this comment</span></Button>
              )}
            </li>
          ))}
        </ul>
      )}
      <form onSubmit={submit} className="flex flex-col gap-2">
        {add.isError && <ErrorNotice title="Could not post the comment" error={add.error} />}
        <label htmlFor="comment-text" className="font-medium">Add a comment on version {version}</label>
        <textarea id="comment-text" value={text} onChange={(e) => setText(e.target.value)} maxLength={2000} rows={3}
          className="rounded-md border border-field bg-surface px-3 py-2" />
        <div className="flex flex-wrap items-end gap-3">
          <ThreadField label="End (optional)" value={end} onChange={setEnd} error={fields.end} />
          <ThreadField label="Pick (optional)" value={pick} onChange={setPick} error={fields.pick} />
          <Button type="submit" variant="primary" busy={add.isPending} busyLabel="Posting…" disabled={!text.trim()}>Post comment</Button>
        </div>
      </form>
    </section>
  );
}

/** An end or pick number for a comment, with the server's reason beside it when it refused one. */
function ThreadField({ label, value, onChange, error }: { label: string; value: string; onChange: (v: string) => void; error?: string }) {
  const errorId = useId();
  return (
    <div className="flex flex-col gap-1">
      <label className="flex flex-col gap-1">
        {label}
        <input type="number" min={1} value={value} onChange={(e) => onChange(e.target.value)} aria-invalid={error ? true : undefined}
          aria-describedby={error ? errorId : undefined}
          className="w-28 rounded-md border border-field px-2 py-1 aria-[invalid=true]:border-2 aria-[invalid=true]:border-danger" />
      </label>
      {error && <FieldError id={errorId} message={error} />}
    </div>
  );
}
