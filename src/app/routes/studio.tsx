import { useQueryClient } from '@tanstack/react-query';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { buttonClasses } from '../../components/ui/button';
import { sessionQueryOptions, useSignedInUser } from '../../features/auth/api/get-session';
import { InviteForm } from '../../features/invitations/components/invite-form';
import { StudioMembers } from '../../features/studio/components/studio-members';
import { parseId } from '../parse-id';
import { NotFound } from './not-found';

export function StudioRoute() {
  const id = parseId(useParams().id);
  const user = useSignedInUser();
  const navigate = useNavigate();
  const queryClient = useQueryClient();
  if (id === null) return <NotFound />;

  const onLeft = () => {
    // The session lists the studios the user belongs to.
    void queryClient.invalidateQueries({ queryKey: sessionQueryOptions().queryKey });
    navigate('/studios', { replace: true });
  };
  const role = user.memberships.find((m) => m.studioId === id)?.role;
  return (
    <>
      <title>Studio · Shedwright</title>
      {(role === 'owner' || role === 'editor') && (
        <p className="mb-4 flex flex-wrap items-center gap-3">
          <Link to={`/drafts/new?studio=${id}`} className={buttonClasses('primary')}>
            New draft
          </Link>
          <Link to={`/drafts?studio=${id}`}>This studio&apos;s drafts</Link>
        </p>
      )}
      <StudioMembers key={id} studioId={id} currentUserId={user.id} onLeft={onLeft} />
      {role === 'owner' && <div className="mt-6"><InviteForm studioId={id} /></div>}
    </>
  );
}
