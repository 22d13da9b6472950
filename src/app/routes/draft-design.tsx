import { useDraftSection } from './draft';
import { DraftEditorRegion } from './draft-editor-region';

/** Design: the workspace where the draft is drawn. */
export function DesignSection() {
  const { draft } = useDraftSection();
  if (!draft) return <p className="p-4 text-sm">The draft cannot be drawn while offline; At the loom still works from this device&apos;s copy.</p>;
  return (
    <>
      <title>{`${draft.name} · Shedwright`}</title>
      <DraftEditorRegion draft={draft} />
    </>
  );
}
