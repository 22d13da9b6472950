import { useNavigate, useSearchParams } from 'react-router-dom';
import { AuthCard } from '../../features/auth/components/auth-card';
import { WelcomeForm } from '../../features/auth/components/welcome-form';
import { safeNextPath } from '../../features/auth/next-path';

/** The link in a sign-up mail: one button makes the account, signs in and goes on. */
export function WelcomeRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  const next = safeNextPath(params.get('next'));
  return (
    <AuthCard title="Finish making your account">
      <title>Welcome · Shedwright</title>
      <WelcomeForm token={params.get('token')} onDone={() => navigate(next, { replace: true })} />
    </AuthCard>
  );
}
