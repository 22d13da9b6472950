import { useRef, type ChangeEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { useImportWif } from '../api/import-wif';

/** "Import WIF file": reads a .wif into a new draft of the weaver's own. */
export function ImportWifButton() {
  const input = useRef<HTMLInputElement>(null);
  const importer = useImportWif();
  const onFile = (event: ChangeEvent<HTMLInputElement>) => {
    const file = event.target.files?.[0];
    if (file) importer.mutate(file);
    event.target.value = '';
  };
  return (
    <div className="flex flex-col items-end gap-2">
      <input ref={input} type="file" accept=".wif,text/plain" className="sr-only" tabIndex={-1} aria-hidden="true" onChange={onFile} data-testid="wif-file" />
      <Button onClick={() => input.current?.click()} busy={importer.isPending} busyLabel="Importing…">
        Import WIF file
      </Button>
      {importer.isSuccess && (
        <div role="status" className="max-w-md text-sm">
          <p>
            Imported <Link to={`/drafts/${importer.data.draft.id}`}>{importer.data.draft.name}</Link>.
            {importer.data.warnings?.length ? ' Check these before weaving from it:' : ''}
          </p>
          {importer.data.warnings && importer.data.warnings.length > 0 && (
            <ul className="mt-1 list-disc pl-5 text-left" aria-label="What the import had to guess">
              {importer.data.warnings.map((w) => (
                <li key={w}>{w}</li>
              ))}
            </ul>
          )}
        </div>
      )}
      {importer.isError && <ErrorNotice title="Could not import the file" error={importer.error} />}
    </div>
  );
}
