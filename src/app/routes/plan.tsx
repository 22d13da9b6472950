import { useParams } from 'react-router-dom';
import { draftQueryOptions } from '../../features/library/api/get-draft';
import { PlanPage } from '../../features/plan/components/plan-page';
import { parseId } from '../parse-id';
import { NotFound } from './not-found';

export function PlanRoute() {
  const id = parseId(useParams().id);
  if (id === null) return <NotFound />;
  return (
    <>
      <title>Plan · Shedwright</title>
      <PlanPage key={id} draftId={id} draftQuery={draftQueryOptions(id)} />
    </>
  );
}
