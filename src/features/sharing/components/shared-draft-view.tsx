import { parseDraft } from '../../../../shared/weave';
import { ClothPreview } from '../../../components/ui/cloth-preview';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { isApiError } from '../../../lib/api-client';
import { useSharedDraft } from '../api/get-shared-draft';

/** A draft opened from a public link: read-only, no sign-in. */
export function SharedDraftView({ token }: { token: string }) {
  const query = useSharedDraft(token);
  if (query.isPending) return <Spinner label="Loading the shared draft…" />;
  if (query.isError) {
    if (isApiError(query.error, 404, 400)) {
      return <p>This link does not work: it may have been withdrawn. Ask the person who shared it for a new one.</p>;
    }
    return <ErrorNotice title="Could not load the draft" error={query.error} onRetry={() => void query.refetch()} />;
  }
  const { draft: shared } = query.data;
  const draft = parseDraft(shared.document);
  return (
    <article className="flex flex-col gap-4">
      <h1 className="text-2xl font-semibold">{shared.name}</h1>
      <p className="text-sm text-muted">
        Shared by {shared.ownerName} · version {shared.version} · {draft.threading.length} ends on {draft.shafts} shafts · read-only
      </p>
      <ClothPreview draft={draft} label={`Cloth of ${shared.name}`} />
      {draft.notes && <p className="max-w-prose whitespace-pre-line">{draft.notes}</p>}
    </article>
  );
}
