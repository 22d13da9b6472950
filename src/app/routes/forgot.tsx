import { AuthCard } from '../../features/auth/components/auth-card';
import { ForgotForm } from '../../features/auth/components/forgot-form';

export function ForgotRoute() {
  return (
    <AuthCard title="Forgot your password?">
      <title>Forgot password · Shedwright</title>
      <ForgotForm />
    </AuthCard>
  );
}
