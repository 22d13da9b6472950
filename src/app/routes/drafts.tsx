import { DraftsLibrary } from '../../features/library/components/drafts-library';
import { PageHeading } from '../../components/ui/page-heading';

export function DraftsRoute() {
  return (
    <div className="flex flex-col gap-4">
      <title>Drafts · Shedwright</title>
      <PageHeading title="Drafts" />
      <DraftsLibrary />
    </div>
  );
}
