import type { ReactNode } from 'react';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { MissingNotice, PageHeading } from '../../../components/ui/page-heading';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-client';
import type { DraftDetail } from '../../../types/api';
import { useDraft } from '../api/get-draft';
import { formatDate } from '../format';
import { ROLE_LABEL } from '../../../lib/roles';

/** One draft's page: its facts, then whatever the page puts below them (the editor). */
export function DraftOverview({ draftId, editor }: { draftId: number; editor?: (draft: DraftDetail) => ReactNode }) {
  const query = useDraft(draftId);

  if (query.isPending) return <Spinner label="Loading the draft…" />;
  if (query.isError) {
    if (isApiError(query.error, 404)) {
      return (
        <MissingNotice title="Draft not found" back={{ to: '/drafts', label: 'Back to Drafts' }}>
          This draft does not exist, or it is not shared with you.
        </MissingNotice>
      );
    }
    return <ErrorNotice title="Could not load the draft" error={query.error} onRetry={() => void query.refetch()} />;
  }
  return <DraftFacts draft={query.data.draft} editor={editor?.(query.data.draft)} />;
}

function DraftFacts({ draft, editor }: { draft: DraftDetail; editor?: ReactNode }) {
  const facts: [string, ReactNode][] = [
    ['Owner', draft.ownerName],
    ['Studio', draft.studioName ?? 'Personal'],
    ['Your role', ROLE_LABEL[draft.role]],
    ['Ends × picks', `${draft.ends} × ${draft.picks}`],
    ['Shafts', draft.shafts],
    ['Colours', draft.colors],
    ['Version', draft.version],
    ['Updated', <time dateTime={draft.updatedAt}>{formatDate(draft.updatedAt, true)}</time>],
  ];
  return (
    <div className="flex flex-col gap-6">
      <PageHeading title={draft.name} back={{ to: '/drafts', label: 'Drafts' }}>
        {draft.tags.length > 0 && (
          <ul aria-label="Tags" className="flex flex-wrap gap-1.5">
            {draft.tags.map((tag) => (
              <li key={tag} className="rounded-full border border-line bg-surface px-2 py-0.5 text-xs">
                {tag}
              </li>
            ))}
          </ul>
        )}
      </PageHeading>

      <div className="flex flex-wrap gap-6">
        <dl className="grid min-w-72 grid-cols-[max-content_1fr] gap-x-6 gap-y-2 rounded-md border border-line bg-surface p-4 text-sm">
          {facts.map(([label, value]) => (
            <div key={label} className="contents">
              <dt className="text-muted">{label}</dt>
              <dd className="font-medium tabular-nums">{value}</dd>
            </div>
          ))}
        </dl>
        {draft.thumbnailUrl && (
          <img src={draft.thumbnailUrl} alt={`Cloth preview of ${draft.name}`} className="size-48 rounded-md border border-line object-cover" />
        )}
      </div>

      {editor}
    </div>
  );
}
