import { useNavigate } from 'react-router-dom';
import { CreateStudioForm } from '../../features/studio/components/create-studio-form';
import { StudiosList } from '../../features/studio/components/studios-list';
import { PageHeading } from '../../components/ui/page-heading';

export function StudiosRoute() {
  const navigate = useNavigate();
  return (
    <div className="flex flex-col gap-6">
      <title>Studios · Shedwright</title>
      <PageHeading title="Studios" />
      <StudiosList />
      <CreateStudioForm onCreated={({ studio }) => navigate(`/studios/${studio.id}`)} />
    </div>
  );
}
