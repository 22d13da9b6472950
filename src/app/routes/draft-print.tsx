import { ErrorNotice } from '../../components/ui/error-notice';
import { DraftPrintSection } from '../../features/print/components/draft-print-section';
import { ShareControls } from '../../features/sharing/components/share-controls';
import type { DraftDetail } from '../../types/api';
import { useParsedDraft } from '../use-parsed-draft';
import { useDraftSection } from './draft';

/** Print and export: printed drafts, files, and (for editors and owners) the public link. */
export function PrintSection() {
  const { draft } = useDraftSection();
  return draft ? <PrintAndExport draft={draft} /> : null;
}

function PrintAndExport({ draft }: { draft: DraftDetail }) {
  const parsed = useParsedDraft(draft.document);
  return (
    <div className="flex max-w-5xl flex-col gap-8 py-4">
      <title>{`Print and export · ${draft.name} · Shedwright`}</title>
      {'error' in parsed ? (
        <ErrorNotice title="This draft cannot be printed" error={parsed.error} />
      ) : (
        <DraftPrintSection draftId={draft.id} draft={parsed.document} />
      )}
      {draft.role !== 'viewer' && <ShareControls draftId={draft.id} />}
    </div>
  );
}
