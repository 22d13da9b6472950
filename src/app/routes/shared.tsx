import { Link, useParams } from 'react-router-dom';
import { SharedDraftView } from '../../features/sharing/components/shared-draft-view';

/** A draft opened from a public link: no sign-in, read-only. */
export function SharedRoute() {
  const token = useParams().token ?? '';
  return (
    <main className="mx-auto flex max-w-5xl flex-col gap-4 p-6">
      <title>Shared draft · Shedwright</title>
      <p className="text-lg font-semibold text-accent">
        <Link to="/" className="no-underline">Shedwright</Link>
      </p>
      <SharedDraftView token={token} />
    </main>
  );
}
