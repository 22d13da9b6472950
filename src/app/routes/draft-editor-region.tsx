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
  const save = useSaveDraft(draft.id);
  const parsed = useParsedDraft(draft.document);

  if ('error' in parsed) {
    return <ErrorNotice title="This draft cannot be opened" error={parsed.error} />;
  }
  const readOnly = draft.role === 'viewer';
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
      />
    </section>
  );
}
