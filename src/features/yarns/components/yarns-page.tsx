import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { Spinner } from '../../../components/ui/spinner';
import { fieldErrorsOf } from '../../../lib/api-client';
import type { Yarn, YarnBody } from '../../../types/api';
import { useCreateYarn } from '../api/create-yarn';
import { useDeleteYarn } from '../api/delete-yarn';
import { useYarns } from '../api/get-yarns';
import { useUpdateYarn } from '../api/update-yarn';

const cell = 'px-3 py-2 text-left align-middle';
const EMPTY: YarnBody = { name: '', fibre: '', colour: '#8a6f4d', count: '', yardsPerPound: null };

function YarnForm({ initial, onSave, busy, error, submitLabel, onCancel }: {
  initial: YarnBody; onSave: (body: YarnBody) => void; busy: boolean; error: unknown; submitLabel: string; onCancel?: () => void;
}) {
  const [yarn, setYarn] = useState(initial);
  const fields = fieldErrorsOf(error);
  const set = <K extends keyof YarnBody>(key: K, value: YarnBody[K]) => setYarn((y) => ({ ...y, [key]: value }));
  const submit = (event: FormEvent) => {
    event.preventDefault();
    onSave({ ...yarn, name: yarn.name.trim() });
  };
  return (
    <form onSubmit={submit} className="grid grid-cols-1 gap-3 sm:grid-cols-[2fr_2fr_auto_1fr_1fr_auto] sm:items-end">
      <Field label="Name" value={yarn.name} onChange={(e) => set('name', e.target.value)} required maxLength={100} error={fields.name} />
      <Field label="Fibre" value={yarn.fibre} onChange={(e) => set('fibre', e.target.value)} maxLength={100} error={fields.fibre} />
      <Field label="Colour" type="color" value={yarn.colour} onChange={(e) => set('colour', e.target.value)} error={fields.colour} className="h-9 w-16 p-1" />
      <Field label="Count" value={yarn.count} onChange={(e) => set('count', e.target.value)} maxLength={50} placeholder="e.g. 2/8" error={fields.count} />
      <Field label="Yards per pound" type="number" min={1} value={yarn.yardsPerPound ?? ''} error={fields.yardsPerPound}
        onChange={(e) => set('yardsPerPound', e.target.value === '' ? null : Number(e.target.value))} />
      <div className="flex gap-2">
        <Button type="submit" variant="primary" busy={busy} busyLabel="Saving…" disabled={!yarn.name.trim()}>{submitLabel}</Button>
        {onCancel && <Button onClick={onCancel}>Cancel</Button>}
      </div>
    </form>
  );
}

function YarnRow({ yarn }: { yarn: Yarn }) {
  const [editing, setEditing] = useState(false);
  const update = useUpdateYarn();
  const remove = useDeleteYarn();
  if (editing) {
    return (
      <tr className="border-b border-line">
        <td colSpan={6} className={cell}>
          {update.isError && Object.keys(fieldErrorsOf(update.error)).length === 0 && <ErrorNotice title="Could not save the yarn" error={update.error} />}
          <YarnForm initial={yarn} submitLabel="Save" busy={update.isPending} error={update.error} onCancel={() => setEditing(false)}
            onSave={(body) => update.mutate({ id: yarn.id, ...body }, { onSuccess: () => setEditing(false) })} />
        </td>
      </tr>
    );
  }
  return (
    <>
    <tr className="border-b border-line last:border-b-0">
      <th scope="row" className={`${cell} font-medium`}>{yarn.name}</th>
      <td className={cell}>{yarn.fibre}</td>
      <td className={cell}>
        <span className="inline-flex items-center gap-2">
          <span aria-hidden="true" className="inline-block size-5 rounded-sm border border-field" style={{ backgroundColor: yarn.colour }} />
          <code>{yarn.colour}</code>
        </span>
      </td>
      <td className={cell}>{yarn.count}</td>
      <td className={`${cell} tabular-nums`}>{yarn.yardsPerPound ?? '—'}</td>
      <td className={`${cell} whitespace-nowrap`}>
        <Button variant="quiet" onClick={() => setEditing(true)}>Edit<span className="sr-only"> {yarn.name}</span></Button>
        <Button variant="quiet" onClick={() => remove.mutate(yarn.id)} busy={remove.isPending} busyLabel="Removing…">
          Remove<span className="sr-only"> {yarn.name}</span>
        </Button>
      </td>
    </tr>
    {remove.isError && (
      <tr className="border-b border-line">
        <td colSpan={6} className={cell}><ErrorNotice title={`Could not remove ${yarn.name}`} error={remove.error} /></td>
      </tr>
    )}
    </>
  );
}

/** The weaver's yarns: the colours offered when making a new colourway, and the counts a plan starts from. */
export function YarnsPage() {
  const yarns = useYarns();
  const create = useCreateYarn();
  const [formKey, setFormKey] = useState(0);
  return (
    <div className="flex flex-col gap-6">
      <section aria-labelledby="add-yarn" className="rounded-md border border-line bg-surface p-4">
        <h2 id="add-yarn" className="mb-3 text-lg font-semibold">Add a yarn</h2>
        {create.isError && Object.keys(fieldErrorsOf(create.error)).length === 0 && <ErrorNotice title="Could not add the yarn" error={create.error} />}
        <YarnForm key={formKey} initial={EMPTY} submitLabel="Add yarn" busy={create.isPending} error={create.error}
          onSave={(body) => create.mutate(body, { onSuccess: () => setFormKey((k) => k + 1) })} />
      </section>
      {yarns.isPending ? <Spinner label="Loading yarns…" /> : yarns.isError ? (
        <ErrorNotice title="Could not load your yarns" error={yarns.error} onRetry={() => void yarns.refetch()} />
      ) : yarns.data.yarns.length === 0 ? (
        <EmptyState title="No yarns yet">Yarns you add here can be chosen when you make a new colourway.</EmptyState>
      ) : (
        <div className="overflow-x-auto rounded-md border border-line bg-surface">
          <table className="w-full border-collapse text-sm">
            <caption className="sr-only">Your yarns</caption>
            <thead className="border-b border-line bg-sunken">
              <tr>
                <th scope="col" className={cell}>Name</th>
                <th scope="col" className={cell}>Fibre</th>
                <th scope="col" className={cell}>Colour</th>
                <th scope="col" className={cell}>Count</th>
                <th scope="col" className={cell}>Yards per pound</th>
                <th scope="col" className={cell}><span className="sr-only">Actions</span></th>
              </tr>
            </thead>
            <tbody>{yarns.data.yarns.map((y) => <YarnRow key={y.id} yarn={y} />)}</tbody>
          </table>
        </div>
      )}
    </div>
  );
}
