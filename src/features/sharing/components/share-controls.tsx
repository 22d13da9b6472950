import { useState } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { useCreateShareLink } from '../api/create-share-link';
import { useRevokeShareLink } from '../api/revoke-share-link';
import { useShareStatus } from '../api/get-share-status';

/** Make, show once and withdraw the draft's public read-only link (editors and owners). */
export function ShareControls({ draftId }: { draftId: number }) {
  const status = useShareStatus(draftId);
  const create = useCreateShareLink(draftId);
  const revoke = useRevokeShareLink(draftId);
  const shared = status.data?.shared ?? false;
  const url = create.data?.url;
  const [copied, setCopied] = useState<'done' | 'failed' | null>(null);
  const copy = async (text: string) => {
    try {
      if (!navigator.clipboard) throw new Error('no clipboard');
      await navigator.clipboard.writeText(text);
      setCopied('done');
    } catch {
      setCopied('failed');
    }
  };

  return (
    <section aria-labelledby="share-heading" className="flex flex-col gap-2 text-sm">
      <h2 id="share-heading" className="text-lg font-semibold">Public link</h2>
      {create.isError && <ErrorNotice title="Could not make a link" error={create.error} />}
      {revoke.isError && <ErrorNotice title="Could not withdraw the link" error={revoke.error} />}
      <p>
        {shared ? 'Anyone with the link can read this draft, without signing in.' : 'No public link: only people who can open it in Shedwright can see this draft.'}
      </p>
      {url && shared && (
        <p className="flex flex-wrap items-center gap-2">
          <label htmlFor="share-url" className="font-medium">Link</label>
          <input id="share-url" readOnly value={url} className="w-96 max-w-full rounded-md border border-field px-2 py-1" onFocus={(e) => e.target.select()} />
          <Button variant="quiet" onClick={() => void copy(url)}>Copy</Button>
          <span role="status" className={copied === 'failed' ? 'font-medium text-danger' : 'text-muted'}>
            {copied === 'done' ? 'Copied: paste it where you need it. ' : copied === 'failed' ? 'Could not copy: select the link and copy it yourself. ' : ''}
            Shown once: keep it now.
          </span>
        </p>
      )}
      <div className="flex gap-2">
        <Button onClick={() => create.mutate()} busy={create.isPending} busyLabel="Making a link…">
          {shared ? 'Make a new link' : 'Make a public link'}
        </Button>
        {shared && (
          <Button variant="danger" onClick={() => revoke.mutate(undefined, { onSuccess: () => create.reset() })} busy={revoke.isPending} busyLabel="Withdrawing…">
            Withdraw link
          </Button>
        )}
      </div>
    </section>
  );
}
