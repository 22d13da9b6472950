import { Link } from 'react-router-dom';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { ROLE_LABEL } from '../../../lib/roles';
import { useStudios } from '../api/get-studios';

/** The studios the weaver belongs to, with their role and the number of members. */
export function StudiosList() {
  const studios = useStudios();
  if (studios.isPending) return <Spinner label="Loading studios…" />;
  if (studios.isError) return <ErrorNotice title="Could not load studios" error={studios.error} onRetry={() => void studios.refetch()} />;
  if (studios.data.studios.length === 0) {
    return <EmptyState title="No studios yet">Start one below, or ask a studio owner to add you.</EmptyState>;
  }
  return (
    <ul className="divide-y divide-line rounded-md border border-line bg-surface">
      {studios.data.studios.map((studio) => (
        <li key={studio.id} className="flex flex-wrap items-center justify-between gap-2 px-4 py-3">
          <Link to={`/studios/${studio.id}`} className="font-medium underline-offset-4 hover:underline">
            {studio.name}
          </Link>
          <span className="text-sm text-muted">
            {ROLE_LABEL[studio.role]} · {studio.memberCount === 1 ? '1 member' : `${studio.memberCount} members`}
          </span>
        </li>
      ))}
    </ul>
  );
}
