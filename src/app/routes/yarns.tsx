import { PageHeading } from '../../components/ui/page-heading';
import { YarnsPage } from '../../features/yarns/components/yarns-page';

export function YarnsRoute() {
  return (
    <div className="flex flex-col gap-4">
      <title>Yarns · Shedwright</title>
      <PageHeading title="Yarns" />
      <YarnsPage />
    </div>
  );
}
