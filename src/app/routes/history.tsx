import { useParams } from 'react-router-dom';
import { ErrorNotice } from '../../components/ui/error-notice';
import { MissingNotice, PageHeading } from '../../components/ui/page-heading';
import { Spinner } from '../../components/ui/spinner';
import { isApiError } from '../../lib/api-client';
import { useDraft } from '../../features/library/api/get-draft';
import { HistoryPage } from '../../features/history/components/history-page';
import { VersionPhotos } from '../../features/photos/components/version-photos';
import { parseId } from '../parse-id';
import { NotFound } from './not-found';

export function HistoryRoute() {
  const id = parseId(useParams().id);
  return id === null ? <NotFound /> : <DraftHistory key={id} id={id} />;
}

function DraftHistory({ id }: { id: number }) {
  const draft = useDraft(id);
  if (draft.isPending) return <Spinner label="Loading the draft…" />;
  if (draft.isError) {
    if (isApiError(draft.error, 404)) {
      return <MissingNotice title="Draft not found" back={{ to: '/drafts', label: 'Back to Drafts' }}>This draft does not exist, or it is not shared with you.</MissingNotice>;
    }
    return <ErrorNotice title="Could not load the draft" error={draft.error} onRetry={() => void draft.refetch()} />;
  }
  const { name, role } = draft.data.draft;
  return (
    <div className="flex flex-col gap-4">
      <title>{`History of ${name} · Shedwright`}</title>
      <PageHeading title={`History of ${name}`} back={{ to: `/drafts/${id}`, label: name }} />
      <HistoryPage draftId={id} role={role} extra={(n) => <VersionPhotos draftId={id} version={n} canUpload={role !== 'viewer'} />} />
    </div>
  );
}
