import { useSignedInUser } from '../../features/auth/api/get-session';
import { CommentsPanel } from '../../features/comments/components/comments-panel';
import { useDraftSection } from './draft';

/** Discussion: questions and notes from everyone who can see the draft. */
export function DiscussionSection() {
  const { draft } = useDraftSection();
  const user = useSignedInUser();
  if (!draft) return null;
  return (
    <div className="max-w-3xl py-4">
      <title>{`Discussion · ${draft.name} · Shedwright`}</title>
      <CommentsPanel draftId={draft.id} version={draft.version} currentUserId={user.id} />
    </div>
  );
}
