import { useMemo } from 'react';
import { DraftError, parseDraft } from '../../../shared/weave';
import { ErrorNotice } from '../../components/ui/error-notice';
import { DraftEditor } from '../../features/editor';
import { useSaveDraft } from '../../features/library/api/save-draft';
import { DraftPrintSection } from '../../features/print/components/draft-print-section';
import type { DraftDetail } from '../../types/api';

/**
 * The editor and the Print section for the draft on this page, from one parse of its document. Viewers get it read-only; editors and owners save each
 * settled edit as a new version on top of the one they opened.
 */
export function DraftEditorRegion({ draft }: { draft: DraftDetail }) {
  const save = useSaveDraft(draft.id);
  const parsed = useMemo(() => {
    try {
      return { document: parseDraft(draft.document) };
    } catch (error) {
      return { error: error instanceof DraftError ? error : new Error(String(error)) };
    }
  }, [draft.document]);

  if ('error' in parsed) {
    return <ErrorNotice title="This draft cannot be opened" error={parsed.error} />;
  }
  const readOnly = draft.role === 'viewer';
  return (
    <>
      <section aria-label="Draft editor" id="draft-editor">
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
      <DraftPrintSection draftId={draft.id} draft={parsed.document} />
    </>
  );
}
