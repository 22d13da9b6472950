import { useParams } from 'react-router-dom';
import { DraftOverview } from '../../features/library/components/draft-overview';
import { parseId } from '../parse-id';
import { NotFound } from './not-found';

export function DraftRoute() {
  const id = parseId(useParams().id);
  if (id === null) return <NotFound />;
  return (
    <>
      <title>Draft · Shedwright</title>
      <DraftOverview key={id} draftId={id} />
    </>
  );
}
