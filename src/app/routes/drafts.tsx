import { useSignedInUser } from '../../features/auth/api/get-session';
import { DraftsLibrary } from '../../features/library/components/drafts-library';
import { PageHeading } from '../../components/ui/page-heading';

export function DraftsRoute() {
  const studios = useSignedInUser().memberships.map((m) => ({ id: m.studioId, name: m.studioName }));
  return (
    <div className="flex flex-col gap-4">
      <title>Drafts · Shedwright</title>
      <PageHeading title="Drafts" />
      <DraftsLibrary studios={studios} />
    </div>
  );
}
