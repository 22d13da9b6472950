import { Link } from 'react-router-dom';
import { Spinner } from '../../components/ui/spinner';
import { useSession } from '../../features/auth/api/get-session';
import { MailList } from '../../features/mails/components/mail-list';
import { AppShell } from '../app-shell';
import { PageHeading } from '../../components/ui/page-heading';

/**
 * Captured mails. Reachable signed out too, because in development mode the reset link is read
 * here before anyone can sign in; the server decides who may see the mails.
 */
export function AdminMailsRoute() {
  const session = useSession();
  if (session.isPending) return <Spinner />;
  const page = (
    <div className="flex flex-col gap-4">
      <title>Captured mails · Shedwright</title>
      <PageHeading title="Captured mails" />
      <p className="max-w-prose text-sm text-muted">Mails the local mail catcher received instead of sending them out.</p>
      <MailList />
    </div>
  );
  const user = session.data?.user;
  if (user) return <AppShell user={user}>{page}</AppShell>;
  return (
    <main className="mx-auto flex max-w-4xl flex-col gap-4 px-4 py-8">
      <Link to="/sign-in" className="text-lg font-semibold text-accent no-underline">
        Shedwright
      </Link>
      {page}
    </main>
  );
}
