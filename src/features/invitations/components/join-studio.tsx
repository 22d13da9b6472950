import { useEffect, useRef } from 'react';
import { Link } from 'react-router-dom';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { ROLE_LABEL } from '../../../lib/roles';
import { useAcceptInvitation } from '../api/accept-invitation';

/** Accepts the invitation in the link as soon as a signed-in weaver opens it. */
export function JoinStudio({ token }: { token: string }) {
  const accept = useAcceptInvitation();
  const sent = useRef(false);
  useEffect(() => {
    // Once only, even when React runs effects twice in development.
    if (sent.current || !token) return;
    sent.current = true;
    accept.mutate(token);
  }, [accept, token]);

  if (!token) return <p>This link has no invitation in it. Open the link from the invitation mail again.</p>;
  if (accept.isError) return <ErrorNotice title="Could not join the studio" error={accept.error} />;
  if (!accept.isSuccess) return <Spinner label="Joining the studio…" />;
  const { studio } = accept.data;
  return (
    <div className="flex flex-col gap-2">
      <h1 className="text-2xl font-semibold">Welcome to {studio.name}</h1>
      <p>You are in the studio as {ROLE_LABEL[studio.role].toLowerCase()}.</p>
      <p className="flex gap-4">
        <Link to={`/studios/${studio.id}`}>Open the studio</Link>
        <Link to={`/drafts?studio=${studio.id}`}>See its drafts</Link>
      </p>
    </div>
  );
}
