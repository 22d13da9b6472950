import { useQueryClient } from '@tanstack/react-query';
import { useNavigate, useParams } from 'react-router-dom';
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
  return (
    <>
      <title>Studio · Shedwright</title>
      <StudioMembers key={id} studioId={id} currentUserId={user.id} onLeft={onLeft} />
      {user.memberships.some((m) => m.studioId === id && m.role === 'owner') && <div className="mt-6"><InviteForm studioId={id} /></div>}
    </>
  );
}
