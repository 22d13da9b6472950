import { useParams } from 'react-router-dom';
import { draftQueryOptions } from '../../features/library/api/get-draft';
import { LoomPage } from '../../features/loom/components/loom-page';
import { planQueryOptions } from '../../features/plan/api/get-plan';
import { parseId } from '../parse-id';
import { NotFound } from './not-found';

export function LoomRoute() {
  const id = parseId(useParams().id);
  if (id === null) return <NotFound />;
  return (
    <>
      <title>At the loom · Shedwright</title>
      <LoomPage key={id} draftId={id} draftQuery={draftQueryOptions(id)} planQuery={planQueryOptions(id)} />
    </>
  );
}
