import { useState } from 'react';
import { Outlet, useOutletContext, useParams } from 'react-router-dom';
import { ErrorNotice } from '../../components/ui/error-notice';
import { MissingNotice } from '../../components/ui/page-heading';
import { Spinner } from '../../components/ui/spinner';
import { useDraft } from '../../features/library/api/get-draft';
import { isApiError } from '../../lib/api-client';
import type { DraftDetail } from '../../types/api';
import { parseId } from '../parse-id';
import { DraftHeader } from './draft-header';
import { DraftSectionBar } from './draft-section-bar';
import { NotFound } from './not-found';

/** What a section of the draft workspace gets from the workspace around it. */
export interface DraftSectionContext {
  draftId: number;
  /** Absent only while offline before the draft ever loaded (the loom-side guide carries on from its own copy). */
  draft?: DraftDetail;
}

/** The section's view of its draft; call only inside a section route. */
export function useDraftSection(): DraftSectionContext {
  return useOutletContext<DraftSectionContext>();
}

/** The draft workspace: the draft's header and section bar, then the section at this address. */
export function DraftRoute() {
  const id = parseId(useParams().id);
  if (id === null) return <NotFound />;
  return <DraftWorkspace key={id} draftId={id} />;
}

function DraftWorkspace({ draftId }: { draftId: number }) {
  const query = useDraft(draftId);
  // Offline on arrival: sections with their own copy on this device (At the loom) still open. Once
  // offline, a section's own retry of the draft must not swap it back for a spinner.
  const [wentOffline, setWentOffline] = useState(false);
  if (!wentOffline && (isApiError(query.error, 0) || query.fetchStatus === 'paused')) setWentOffline(true);
  const offline = wentOffline && !query.data;
  if (query.isPending && !offline) return <Spinner label="Loading the draft…" />;
  if (query.isError && !offline) {
    if (isApiError(query.error, 404)) {
      return (
        <MissingNotice title="Draft not found" back={{ to: '/drafts', label: 'Back to Drafts' }}>
          This draft does not exist, or it is not shared with you.
        </MissingNotice>
      );
    }
    return <ErrorNotice title="Could not load the draft" error={query.error} onRetry={() => void query.refetch()} />;
  }
  const draft = query.data?.draft;
  const context: DraftSectionContext = { draftId, draft };
  return (
    <div className="flex min-h-0 flex-1 flex-col">
      {draft ? <DraftHeader draft={draft} /> : <p className="text-sm text-muted">Offline: showing what this device kept.</p>}
      <DraftSectionBar draftId={draftId} />
      <div className="min-h-0 flex-1 overflow-auto" data-testid="draft-section">
        <Outlet context={context} />
      </div>
    </div>
  );
}
