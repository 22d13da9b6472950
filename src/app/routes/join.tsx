import { useSearchParams } from 'react-router-dom';
import { JoinStudio } from '../../features/invitations/components/join-studio';

/** The link in an invitation mail (behind sign-in: a newcomer signs up first, then lands back here). */
export function JoinRoute() {
  const [params] = useSearchParams();
  return (
    <>
      <title>Join a studio · Shedwright</title>
      <JoinStudio token={params.get('token') ?? ''} />
    </>
  );
}
