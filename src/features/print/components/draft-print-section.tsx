import { draftSchema, pickCount } from '../../../../shared/weave';
import { isLayered } from '../../editor/canvas/paint';
import { useDraft } from '../../library/api/get-draft';
import type { PrintArrangement } from '../print-links';
import { PrintOptions } from './print-options';

/** The draft page's Print section, once the page's own query has the draft. */
export function DraftPrintSection({ draftId, arrangement }: { draftId: number; arrangement?: PrintArrangement }) {
  const detail = useDraft(draftId).data?.draft;
  const parsed = detail ? draftSchema.safeParse(detail.document) : null;
  if (!parsed?.success) return null;
  const draft = parsed.data;
  return (
    <PrintOptions base={`/api/drafts/${draftId}`} ends={draft.threading.length} picks={pickCount(draft)} layered={isLayered(draft)}
      arrangement={arrangement} files />
  );
}
