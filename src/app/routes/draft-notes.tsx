import { useSignedInUser } from '../../features/auth/api/get-session';
import { LineageView } from '../../features/forks/components/lineage-view';
import { DraftDetailsForm } from '../../features/library/components/draft-details-form';
import { writableStudios } from '../../features/library/components/new-draft-form';
import { useParsedDraft } from '../use-parsed-draft';
import { useDraftSection } from './draft';

/** Notes and photos: the draft's details and what the weaver wrote about it, the cloth woven from it, and where it came from. */
export function NotesSection() {
  const { draft } = useDraftSection();
  const user = useSignedInUser();
  const parsed = useParsedDraft(draft?.document);
  if (!draft) return null;
  const studios = writableStudios(user.memberships);
  return (
    <div className="flex max-w-5xl flex-col gap-8 py-4">
      <title>{`Notes and photos · ${draft.name} · Shedwright`}</title>
      {'document' in parsed && <DraftDetailsForm draft={draft} document={parsed.document} studios={studios} />}
      <LineageView draftId={draft.id} />
    </div>
  );
}
