import { PageHeading } from '../../components/ui/page-heading';
import { BinPage } from '../../features/bin';

export function BinRoute() {
  return (
    <div className="flex flex-col gap-4">
      <title>Bin · Shedwright</title>
      <PageHeading title="Bin" back={{ to: '/drafts', label: 'Drafts' }} />
      <BinPage />
    </div>
  );
}
