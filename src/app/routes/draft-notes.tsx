import { LineageView } from '../../features/forks/components/lineage-view';
import { useDraftSection } from './draft';

/** Notes and photos: what the weaver wrote about the draft, the cloth woven from it, and where it came from. */
export function NotesSection() {
  const { draft } = useDraftSection();
  if (!draft) return null;
  return (
    <div className="flex max-w-5xl flex-col gap-8 py-4">
      <title>{`Notes and photos · ${draft.name} · Shedwright`}</title>
      <LineageView draftId={draft.id} />
    </div>
  );
}
