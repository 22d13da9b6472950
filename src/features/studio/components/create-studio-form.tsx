import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { isApiError } from '../../../lib/api-client';
import { useCreateStudio, type CreatedStudio } from '../api/create-studio';

/** Names a new studio; its creator becomes the owner. */
export function CreateStudioForm({ onCreated }: { onCreated: (data: CreatedStudio) => void }) {
  const [name, setName] = useState('');
  const create = useCreateStudio({ onSuccess: onCreated });
  const fieldError = isApiError(create.error, 400, 409) ? create.error.fields.name : undefined;

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    create.mutate({ name: name.trim() });
  };

  return (
    <form onSubmit={submit} aria-labelledby="create-studio-heading" className="flex flex-col gap-3 rounded-md border border-line bg-surface p-4">
      <h2 id="create-studio-heading" className="text-lg font-semibold">
        Start a studio
      </h2>
      <p className="text-sm text-muted">A studio shares drafts with a class or guild group. You will be its owner.</p>
      {create.isError && !fieldError && <ErrorNotice title="Could not create the studio" error={create.error} />}
      <div className="flex flex-wrap items-end gap-2">
        <div className="w-72">
          <Field label="Studio name" name="name" required maxLength={100} value={name} onChange={(e) => setName(e.target.value)} error={fieldError} />
        </div>
        <Button type="submit" variant="primary" busy={create.isPending} busyLabel="Creating…">
          Create studio
        </Button>
      </div>
    </form>
  );
}
