import { useSearchParams } from 'react-router-dom';
import { AuthCard } from '../../features/auth/components/auth-card';
import { RedirectIfSignedIn } from '../../features/auth/components/require-auth';
import { SignUpForm } from '../../features/auth/components/sign-up-form';
import { safeNextPath } from '../../features/auth/next-path';

export function SignUpRoute() {
  const [params] = useSearchParams();
  // An invitation link for someone without an account: sign up, then land on the join page, which accepts it.
  const invite = params.get('invite');
  const next = safeNextPath(invite ? `/join?token=${encodeURIComponent(invite)}` : params.get('next'));
  return (
    <RedirectIfSignedIn to={next}>
      <title>Create an account · Shedwright</title>
      <AuthCard title="Create an account">
        <SignUpForm next={params.get('next') || invite ? next : undefined} />
      </AuthCard>
    </RedirectIfSignedIn>
  );
}
