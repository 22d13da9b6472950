import { HistoryPage } from '../../features/history/components/history-page';
import { VersionPhotos } from '../../features/photos/components/version-photos';
import { useDraftSection } from './draft';

/** History: every version of the draft, to look at, compare and restore. */
export function HistoryRoute() {
  const { draft } = useDraftSection();
  if (!draft) return null;
  const { id, name, role } = draft;
  return (
    <div className="flex flex-col gap-4 py-4">
      <title>{`History of ${name} · Shedwright`}</title>
      <h2 className="sr-only">History</h2>
      <HistoryPage draftId={id} role={role} extra={(n) => <VersionPhotos draftId={id} version={n} canUpload={role !== 'viewer'} />} />
    </div>
  );
}
