import { useSearchParams } from 'react-router-dom';
import { AuthCard } from '../../features/auth/components/auth-card';
import { RedirectIfSignedIn } from '../../features/auth/components/require-auth';
import { SignInForm } from '../../features/auth/components/sign-in-form';
import { safeNextPath } from '../../features/auth/next-path';

export function SignInRoute() {
  const [params] = useSearchParams();
  const next = safeNextPath(params.get('next'));
  return (
    <RedirectIfSignedIn to={next}>
      <title>Sign in · Shedwright</title>
      <AuthCard title="Sign in">
        <SignInForm next={params.get('next') ? next : undefined} />
      </AuthCard>
    </RedirectIfSignedIn>
  );
}
