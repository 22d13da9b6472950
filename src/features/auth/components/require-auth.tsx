import type { ReactNode } from 'react';
import { Navigate, useLocation } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import type { SessionUser } from '../../../types/api';
import { useSession } from '../api/get-session';
import { signInPathFor } from '../next-path';

/**
 * Shows its children only to a signed-in weaver; anyone else goes to sign in and comes back
 * to the page they asked for afterwards.
 */
export function RequireAuth({ children }: { children: (user: SessionUser) => ReactNode }) {
  const session = useSession();
  const location = useLocation();

  if (session.isPending) return <Spinner label="Checking who is signed in…" />;
  if (session.isError) {
    return (
      <main className="p-6">
        <ErrorNotice title="Could not reach Shedwright" error={session.error} onRetry={() => void session.refetch()} />
      </main>
    );
  }
  if (!session.data.user) {
    return <Navigate to={signInPathFor(location.pathname + location.search)} replace />;
  }
  return children(session.data.user);
}

/** Sends an already signed-in weaver past the sign-in and sign-up pages. */
export function RedirectIfSignedIn({ to, children }: { to: string; children: ReactNode }) {
  const session = useSession();
  if (session.data?.user) return <Navigate to={to} replace />;
  return children;
}
