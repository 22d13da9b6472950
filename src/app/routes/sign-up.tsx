import { useSearchParams } from 'react-router-dom';
import { AuthCard } from '../../features/auth/components/auth-card';
import { RedirectIfSignedIn } from '../../features/auth/components/require-auth';
import { SignUpForm } from '../../features/auth/components/sign-up-form';
import { safeNextPath } from '../../features/auth/next-path';

export function SignUpRoute() {
  const [params] = useSearchParams();
  const next = safeNextPath(params.get('next'));
  return (
    <RedirectIfSignedIn to={next}>
      <title>Create an account · Shedwright</title>
      <AuthCard title="Create an account">
        <SignUpForm next={params.get('next') ? next : undefined} />
      </AuthCard>
    </RedirectIfSignedIn>
  );
}
