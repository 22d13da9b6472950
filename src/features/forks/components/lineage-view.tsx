import { Link } from 'react-router-dom';
import { NAMES } from '../../../../shared/words';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import type { LineageDraft } from '../../../types/api';
import { useLineage } from '../api/get-lineage';

function DraftLink({ draft }: { draft: LineageDraft }) {
  return (
    <>
      <Link to={`/drafts/${draft.id}`}>{draft.name}</Link> <span className="text-muted">by {draft.ownerName}</span>
    </>
  );
}

/** The draft's family: what it was made from (nearest first) and the colourways made from it. */
export function LineageView({ draftId }: { draftId: number }) {
  const query = useLineage(draftId);
  if (query.isPending) return <Spinner label="Loading the lineage…" />;
  if (query.isError) return <ErrorNotice title="Could not load the lineage" error={query.error} onRetry={() => void query.refetch()} />;
  const { draft, ancestors, hiddenAncestors, children } = query.data;
  return (
    <section aria-labelledby="lineage-heading" className="flex flex-col gap-2 text-sm">
      <h2 id="lineage-heading" className="text-lg font-semibold">Lineage</h2>
      <div>
        <h3 className="font-medium">{NAMES.madeFrom}</h3>
        {ancestors.length === 0 && hiddenAncestors === 0 ? (
          <p className="text-muted">Nothing: this draft started here.</p>
        ) : (
          <ol aria-label={`${NAMES.madeFrom}, nearest first`} className="ml-5 list-decimal">
            {ancestors.map((a, i) => (
              <li key={a.id}>
                <DraftLink draft={a} />
                {i === 0 && draft.parentVersion !== null && <span className="text-muted"> (version {draft.parentVersion})</span>}
              </li>
            ))}
            {hiddenAncestors > 0 && <li className="text-muted">{hiddenAncestors === 1 ? 'A draft' : `${hiddenAncestors} drafts`} not shared with you</li>}
          </ol>
        )}
      </div>
      <div>
        <h3 className="font-medium">Colourways made from it</h3>
        {children.length === 0 ? (
          <p className="text-muted">None yet.</p>
        ) : (
          <ul aria-label="Colourways made from this draft" className="ml-5 list-disc">
            {children.map((c) => (
              <li key={c.id}>
                <DraftLink draft={c} /> <span className="text-muted">(from version {c.parentVersion})</span>
              </li>
            ))}
          </ul>
        )}
      </div>
    </section>
  );
}
