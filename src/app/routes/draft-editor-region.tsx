import { useLocation } from 'react-router-dom';
import { ErrorNotice } from '../../components/ui/error-notice';
import { DraftEditor } from '../../features/editor';
import { useSaveDraft } from '../../features/library/api/save-draft';
import type { DraftDetail } from '../../types/api';
import { useParsedDraft } from '../use-parsed-draft';

/**
 * The editor for the draft on this page. Viewers get it read-only; editors and owners save each
 * settled edit as a new version on top of the one they opened.
 */
export function DraftEditorRegion({ draft }: { draft: DraftDetail }) {
  const readOnly = draft.role === 'viewer';
  const save = useSaveDraft(draft.id, { canSave: !readOnly });
  const parsed = useParsedDraft(draft.document);
  // A draft just started as a block design opens at the block design.
  const openBlockDesign = (useLocation().state as { openBlockDesign?: boolean } | null)?.openBlockDesign === true;

  if ('error' in parsed) {
    return <ErrorNotice title="This draft cannot be opened" error={parsed.error} />;
  }
  return (
    <section aria-label="Draft editor" id="draft-editor" className="h-full min-h-0">
      <DraftEditor
        key={draft.id}
        draft={parsed.document}
        version={draft.version}
        draftId={String(draft.id)}
        readOnly={readOnly}
        onSave={readOnly ? undefined : save}
        guardNavigation
        showBlockDesign={openBlockDesign && !readOnly}
      />
    </section>
  );
}
