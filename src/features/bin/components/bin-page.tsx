import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { useBin, useRestoreDraft } from '../api/bin';

const day = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

/** The Bin: deleted drafts, each restorable until the day it goes for good. */
export function BinPage() {
  const bin = useBin();
  const restore = useRestoreDraft();
  return (
    <div className="flex flex-col gap-3">
      {restore.isError && <ErrorNotice title="Could not restore the draft" error={restore.error} />}
      {restore.isSuccess && (
        <p role="status" className="text-sm">
          Restored <Link to={`/drafts/${restore.data.draft.id}`}>{restore.data.draft.name}</Link>.
        </p>
      )}
      {bin.isPending ? (
        <Spinner label="Loading the Bin…" />
      ) : bin.isError ? (
        <ErrorNotice title="Could not load the Bin" error={bin.error} onRetry={() => void bin.refetch()} />
      ) : bin.data.drafts.length === 0 ? (
        <EmptyState title="The Bin is empty">Drafts you delete stay here for 30 days, and can be restored until then.</EmptyState>
      ) : (
        <>
          <p className="text-sm text-muted">Deleted drafts stay here for 30 days; restore one to have it back just as it was.</p>
          <ul aria-label="Drafts in the Bin" className="flex flex-col divide-y divide-line rounded-md border border-line bg-surface">
            {bin.data.drafts.map((d) => (
              <li key={d.id} className="flex flex-wrap items-center gap-x-4 gap-y-1 px-4 py-2 text-sm">
                <span className="font-medium">{d.name}</span>
                <span className="text-muted">{d.studioName ?? 'Personal'}</span>
                <span className="text-muted">deleted {day.format(new Date(d.binnedAt))}, gone for good on {day.format(new Date(d.purgeAt))}</span>
                <span className="ml-auto">
                  <Button onClick={() => restore.mutate(d.id)} busy={restore.isPending && restore.variables === d.id} busyLabel="Restoring…"
                    aria-label={`Restore ${d.name}`}>
                    Restore
                  </Button>
                </span>
              </li>
            ))}
          </ul>
        </>
      )}
    </div>
  );
}
