import { Outlet } from 'react-router-dom';
import { RequireAuth } from '../../features/auth/components/require-auth';
import { AppShell } from '../app-shell';

/** Every signed-in page sits here: the guard, then the shell around the page. */
export function AppLayout() {
  return <RequireAuth>{(user) => <AppShell user={user}><Outlet /></AppShell>}</RequireAuth>;
}
