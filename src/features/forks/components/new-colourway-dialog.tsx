import { useRef, useState, type FormEvent } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import { useForkDraft } from '../api/fork-draft';

export interface ColourChoice {
  name: string;
  colour: string;
}

export interface NewColourwayProps {
  draftId: number;
  draftName: string;
  version: number;
  palette: readonly string[];
  /** Yarns from the weaver's stash offered for each colour. */
  yarns: readonly ColourChoice[];
}

/**
 * "New colourway": forks the draft into the weaver's own space with each colour swapped for another
 * (picked freely, or from their yarns); threading, treadling and colour order stay as they are.
 */
export function NewColourwayDialog({ draftId, draftName, version, palette, yarns }: NewColourwayProps) {
  const dialog = useRef<HTMLDialogElement>(null);
  const fork = useForkDraft();
  const navigate = useNavigate();
  const [name, setName] = useState(`${draftName} (new colourway)`);
  const [colours, setColours] = useState<string[]>([...palette]);
  const fields = fieldErrorsOf(fork.error);

  const openDialog = () => {
    setColours([...palette]);
    fork.reset();
    dialog.current?.showModal();
  };
  const submit = (event: FormEvent) => {
    event.preventDefault();
    fork.mutate({ draftId, name: name.trim(), palette: colours, version }, {
      onSuccess: ({ draft }) => {
        dialog.current?.close();
        navigate(`/drafts/${draft.id}`);
      },
    });
  };
  const setColour = (i: number, value: string) => setColours((c) => c.map((x, j) => (j === i ? value : x)));

  return (
    <>
      <Button onClick={openDialog}>New colourway</Button>
      <dialog ref={dialog} aria-labelledby="colourway-heading" className="m-auto w-full max-w-lg rounded-md border border-line p-0 backdrop:bg-ink/40">
        <form onSubmit={submit} className="flex flex-col gap-4 p-5">
          <h2 id="colourway-heading" className="text-lg font-semibold">New colourway</h2>
          <p className="text-sm text-muted">A copy of version {version} in your own drafts, with the colours you choose. Each end and pick keeps its place in the colour order.</p>
          {fork.isError && Object.keys(fields).length === 0 && <ErrorNotice title="Could not make the colourway" error={fork.error} />}
          <Field label="Name" value={name} onChange={(e) => setName(e.target.value)} required maxLength={200} error={fields.name} />
          <fieldset className="flex flex-col gap-2">
            <legend className="text-sm font-medium">Colours</legend>
            {fields.palette && <p className="text-sm text-danger">⚠ {fields.palette}</p>}
            {palette.map((old, i) => (
              <div key={i} className="flex flex-wrap items-center gap-3 text-sm">
                <span className="inline-flex w-24 items-center gap-1.5">
                  <span aria-hidden="true" className="inline-block size-4 rounded-sm border border-field" style={{ backgroundColor: old }} />
                  Colour {i + 1}
                </span>
                <span aria-hidden="true">→</span>
                <input type="color" aria-label={`New colour for colour ${i + 1}`} value={colours[i]} onChange={(e) => setColour(i, e.target.value)} />
                <code className="text-xs">{colours[i]}</code>
                {yarns.length > 0 && (
                  <select aria-label={`Yarn for colour ${i + 1}`} value="" onChange={(e) => e.target.value && setColour(i, e.target.value)}
                    className="rounded-md border border-field bg-surface px-2 py-1">
                    <option value="">From my yarns…</option>
                    {yarns.map((y) => (
                      <option key={`${y.name}-${y.colour}`} value={y.colour}>
                        {y.name} ({y.colour})
                      </option>
                    ))}
                  </select>
                )}
              </div>
            ))}
          </fieldset>
          <div className="flex justify-end gap-2">
            <Button onClick={() => dialog.current?.close()}>Cancel</Button>
            <Button type="submit" variant="primary" busy={fork.isPending} busyLabel="Making the colourway…">
              Make colourway
            </Button>
          </div>
        </form>
      </dialog>
    </>
  );
}
