import { parseDraft } from '../../../../shared/weave';
import { ClothPreview } from '../../../components/ui/cloth-preview';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { useVersion } from '../api/get-version';

/** One saved version, read-only: its cloth, size and downloads. */
export function VersionView({ draftId, n }: { draftId: number; n: number }) {
  const query = useVersion(draftId, n);
  if (query.isPending) return <Spinner label={`Loading version ${n}…`} />;
  if (query.isError) return <ErrorNotice title={`Could not load version ${n}`} error={query.error} onRetry={() => void query.refetch()} />;
  const draft = parseDraft(query.data.version.document);
  return (
    <section aria-labelledby="version-view-heading" className="flex flex-col gap-3 rounded-md border border-line bg-surface p-4">
      <h2 id="version-view-heading" className="text-lg font-semibold">
        Version {n} <span className="text-sm font-normal text-muted">(read-only)</span>
      </h2>
      <p className="text-sm">
        {draft.threading.length} ends × {draft.control === 'liftplan' ? draft.liftplan.length : draft.treadling.length} picks on {draft.shafts} shafts
        {query.data.version.message && <> · “{query.data.version.message}”</>}
      </p>
      <ClothPreview draft={draft} label={`Cloth of version ${n}`} />
      <p className="flex gap-4 text-sm">
        <a href={`/api/drafts/${draftId}/export.wif?version=${n}`} download>
          Export as WIF
        </a>
        <a href={`/api/drafts/${draftId}/export.json?version=${n}`} download>
          Export as JSON
        </a>
      </p>
    </section>
  );
}
