import { LOCALE } from '../../../../shared/words';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-client';
import type { CapturedMail } from '../../../types/api';
import { useCapturedMails } from '../api/get-captured-mails';
import { linkify } from '../linkify';

/** The captured mails, newest first, with their links clickable. */
export function MailList() {
  const mails = useCapturedMails();
  if (mails.isPending) return <Spinner label="Loading mails…" />;
  if (mails.isError) {
    if (isApiError(mails.error, 403, 404)) {
      return <ErrorNotice title="Not available" message="Captured mails are a tool for developers: they are shown only when the server runs in development mode." />;
    }
    return <ErrorNotice title="Could not load mails" error={mails.error} onRetry={() => void mails.refetch()} />;
  }
  const sorted = [...mails.data.mails].sort((a, b) => b.date.localeCompare(a.date));
  return (
    <div className="flex flex-col gap-3">
      <div>
        <Button onClick={() => void mails.refetch()} busy={mails.isFetching} busyLabel="Refreshing…">
          Refresh
        </Button>
      </div>
      {sorted.length === 0 ? (
        <EmptyState title="No mails caught yet">Sign-up and password reset mails show up here.</EmptyState>
      ) : (
        <ol className="flex flex-col gap-3">
          {sorted.map((mail) => (
            <MailItem key={mail.id} mail={mail} />
          ))}
        </ol>
      )}
    </div>
  );
}

function MailItem({ mail }: { mail: CapturedMail }) {
  return (
    <li>
      <article aria-label={mail.subject} className="flex flex-col gap-2 rounded-md border border-line bg-surface p-4">
        <h2 className="font-semibold">{mail.subject}</h2>
        <p className="text-sm text-muted">
          To {mail.to} · <time dateTime={mail.date}>{new Date(mail.date).toLocaleString(LOCALE)}</time>
        </p>
        <p className="text-sm break-words whitespace-pre-wrap">
          {linkify(mail.text).map((part, i) =>
            part.kind === 'link' ? (
              <a key={i} href={part.text} className="underline underline-offset-4">
                {part.text}
              </a>
            ) : (
              part.text
            ),
          )}
        </p>
      </article>
    </li>
  );
}
