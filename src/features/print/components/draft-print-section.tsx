import { draftSchema, isLayered, pickCount } from '../../../../shared/weave';
import type { PrintArrangement } from '../print-links';
import { PrintOptions } from './print-options';

/** The draft page's Print section for the stored document (nothing when it cannot be read). */
export function DraftPrintSection({ draftId, document, arrangement }: { draftId: number; document: unknown; arrangement?: PrintArrangement }) {
  const parsed = draftSchema.safeParse(document);
  if (!parsed.success) return null;
  const draft = parsed.data;
  return (
    <PrintOptions base={`/api/drafts/${draftId}`} ends={draft.threading.length} picks={pickCount(draft)} layered={isLayered(draft)}
      arrangement={arrangement} files />
  );
}
