import { useSearchParams } from 'react-router-dom';
import { PageHeading } from '../../components/ui/page-heading';
import { useSignedInUser } from '../../features/auth/api/get-session';
import { NewDraftForm, writableStudios } from '../../features/library/components/new-draft-form';
import { parseId } from '../parse-id';

/** New draft: the short form between the library (or a studio's page) and drawing; `?studio=` picks where it lives. */
export function NewDraftRoute() {
  const user = useSignedInUser();
  const [params] = useSearchParams();
  const studioId = parseId(params.get('studio') ?? undefined) ?? undefined;
  const studios = writableStudios(user.memberships);
  const back = studioId !== undefined && studios.some((s) => s.id === studioId)
    ? { to: `/studios/${studioId}`, label: 'Back to the studio' }
    : { to: '/drafts', label: 'Drafts' };
  return (
    <div className="flex flex-col gap-4">
      <title>New draft · Shedwright</title>
      <PageHeading title="New draft" back={back} />
      <NewDraftForm studios={studios} studioId={studioId} />
    </div>
  );
}
