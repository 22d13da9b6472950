import { draftSchema } from '../../../shared/weave';
import { useSignedInUser } from '../../features/auth/api/get-session';
import { CommentsPanel } from '../../features/comments/components/comments-panel';
import { LineageView } from '../../features/forks/components/lineage-view';
import { NewColourwayDialog } from '../../features/forks/components/new-colourway-dialog';
import { DraftHistoryLink } from '../../features/history/components/draft-history-link';
import { useDraft } from '../../features/library/api/get-draft';
import { ShareControls } from '../../features/sharing/components/share-controls';
import { useYarns } from '../../features/yarns/api/get-yarns';
import type { DraftDetail } from '../../types/api';

/**
 * What the Drafts service adds to a draft's page: history, new colourway, lineage, the public link
 * (editors and owners) and comments; exports sit with printing. Shown once the page's own query has the draft.
 */
export function DraftExtras({ draftId }: { draftId: number }) {
  const draft = useDraft(draftId).data?.draft;
  return draft ? <Extras draft={draft} /> : null;
}

function Extras({ draft }: { draft: DraftDetail }) {
  const yarns = useYarns();
  const user = useSignedInUser();
  const document = draftSchema.safeParse(draft.document);
  return (
    <div className="mt-8 flex flex-col gap-8">
      <div className="flex flex-wrap items-center gap-4 text-sm">
        <DraftHistoryLink draftId={draft.id} />
        {document.success && (
          <NewColourwayDialog draftId={draft.id} draftName={draft.name} version={draft.version} palette={document.data.palette}
            yarns={yarns.data?.yarns ?? []} />
        )}
      </div>
      <LineageView draftId={draft.id} />
      {draft.role !== 'viewer' && <ShareControls draftId={draft.id} />}
      <CommentsPanel draftId={draft.id} version={draft.version} currentUserId={user.id} />
    </div>
  );
}
