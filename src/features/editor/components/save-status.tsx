import { useStore } from '../store/create-store';
import { SAVE_STATUS_TEXT, type Autosave } from '../store/autosave';

const MARKS = { saved: '✓', saving: '…', offline: '⚠', conflict: '⚠', incomplete: '⚠' } as const;

/** "Saved / Saving… / Offline — edits kept on this device / Conflict", and the conflict choices. */
export function SaveStatus({ autosave }: { autosave: Autosave }) {
  const status = useStore(autosave, (s) => s.status);
  const conflict = useStore(autosave, (s) => s.conflict);
  return (
    <div className="flex flex-col items-end gap-1">
      <p role="status" aria-live="polite" className="flex items-center gap-1 text-sm" data-testid="save-status">
        <span aria-hidden="true">{MARKS[status]}</span>
        <span className={status === 'offline' || status === 'conflict' || status === 'incomplete' ? 'font-medium text-danger' : 'text-muted'}>{SAVE_STATUS_TEXT[status]}</span>
      </p>
      {conflict && (
        <div role="alertdialog" aria-labelledby="conflict-title" aria-describedby="conflict-text" className="max-w-sm rounded-md border-2 border-danger bg-danger-soft p-3 text-sm">
          <h2 id="conflict-title" className="font-semibold text-danger">
            <span aria-hidden="true">⚠ </span>Someone saved this draft before you
          </h2>
          <p id="conflict-text" className="my-2">
            Version {conflict.version} on the server is not the one your edits started from. Nothing has been overwritten. Choose which version to keep:
          </p>
          <div className="flex flex-col gap-2">
            <div>
              <button type="button" aria-describedby="keep-mine-loses" className="rounded-md bg-accent px-3 py-1.5 font-medium text-white hover:bg-accent-strong" onClick={() => autosave.keepMine()}>
                Keep my version
              </button>
              <p id="keep-mine-loses" className="mt-1 text-xs">
                Saves yours on top. The changes in version {conflict.version} are not in it; that version stays in History.
              </p>
            </div>
            <div>
              <button type="button" aria-describedby="use-other-loses" className="rounded-md border border-field bg-surface px-3 py-1.5 font-medium hover:bg-sunken" onClick={() => autosave.takeTheirs()}>
                Use the other version
              </button>
              <p id="use-other-loses" className="mt-1 text-xs">
                Opens version {conflict.version}. The edits you made since your last save are lost.
              </p>
            </div>
          </div>
        </div>
      )}
    </div>
  );
}
