import { useMemo } from 'react';
import { draftRepeat } from '../../../../shared/print/print-range';
import { arrangementOf, isLayered, pickCount, type Draft } from '../../../../shared/weave';
import { printArrangement } from '../print-links';
import { PrintOptions } from './print-options';

/** The draft page's Print section for the open draft's stored document. */
export function DraftPrintSection({ draftId, draft }: { draftId: number; draft: Draft }) {
  const repeat = useMemo(() => draftRepeat(draft), [draft]);
  const arrangement = printArrangement(arrangementOf(draft));
  return (
    <PrintOptions base={`/api/drafts/${draftId}`} ends={draft.threading.length} picks={pickCount(draft)} layered={isLayered(draft)}
      arrangement={arrangement} repeat={repeat} files />
  );
}
