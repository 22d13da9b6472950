import { Link } from 'react-router-dom';
import { Button } from '../../components/ui/button';
import { ErrorNotice } from '../../components/ui/error-notice';
import { useSignedInUser } from '../../features/auth/api/get-session';
import { useSignOut } from '../../features/auth/api/sign-out';
import { ROLE_LABEL } from '../../lib/roles';
import { PageHeading } from '../../components/ui/page-heading';

export function AccountRoute() {
  const user = useSignedInUser();
  const signOut = useSignOut();
  return (
    <div className="flex max-w-2xl flex-col gap-6">
      <title>Account · Shedwright</title>
      <PageHeading title="Account" />
      <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-2 rounded-md border border-line bg-surface p-4 text-sm">
        <dt className="text-muted">Name</dt>
        <dd className="font-medium">{user.name}</dd>
        <dt className="text-muted">E-mail</dt>
        <dd className="font-medium">{user.email}</dd>
        {user.isAdmin && (
          <>
            <dt className="text-muted">Site role</dt>
            <dd className="font-medium">Administrator</dd>
          </>
        )}
      </dl>
      <section aria-labelledby="account-studios" className="flex flex-col gap-2">
        <h2 id="account-studios" className="text-lg font-semibold">
          Your studios
        </h2>
        {user.memberships.length === 0 ? (
          <p className="text-sm text-muted">
            You are not in a studio yet. <Link to="/studios">Start one</Link>.
          </p>
        ) : (
          <ul className="flex flex-col gap-1 text-sm">
            {user.memberships.map((m) => (
              <li key={m.studioId}>
                <Link to={`/studios/${m.studioId}`}>{m.studioName}</Link> — {ROLE_LABEL[m.role]}
              </li>
            ))}
          </ul>
        )}
      </section>
      <div className="flex flex-col gap-2">
        {signOut.isError && <ErrorNotice title="Could not sign out" error={signOut.error} />}
        <div>
          <Button onClick={() => signOut.mutate()} busy={signOut.isPending} busyLabel="Signing out…">
            Sign out
          </Button>
        </div>
      </div>
    </div>
  );
}
