import { Link, useParams } from 'react-router-dom';
import { DraftOverview } from '../../features/library/components/draft-overview';
import { parseId } from '../parse-id';
import { DraftEditorRegion } from './draft-editor-region';
import { DraftExtras } from './draft-extras';
import { NotFound } from './not-found';

export function DraftRoute() {
  const id = parseId(useParams().id);
  if (id === null) return <NotFound />;
  return (
    <>
      <title>Draft · Shedwright</title>
      <nav aria-label="This draft" className="mb-4 flex gap-3 text-sm">
        <Link to={`/drafts/${id}/plan`}>Plan</Link>
        <Link to={`/drafts/${id}/loom`}>At the loom</Link>
      </nav>
      <DraftOverview
        key={id}
        draftId={id}
        editor={(draft) => <DraftEditorRegion draft={draft} />}
      />
      <DraftExtras key={`extras-${id}`} draftId={id} />
    </>
  );
}
