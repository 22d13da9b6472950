import { useNavigate, useSearchParams } from 'react-router-dom';
import { AuthCard } from '../../features/auth/components/auth-card';
import { ResetForm } from '../../features/auth/components/reset-form';

export function ResetRoute() {
  const [params] = useSearchParams();
  const navigate = useNavigate();
  return (
    <AuthCard title="Choose a new password">
      <title>New password · Shedwright</title>
      <ResetForm token={params.get('token')} onReset={() => navigate('/drafts', { replace: true })} />
    </AuthCard>
  );
}
