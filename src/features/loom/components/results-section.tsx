import { LOCALE } from '../../../../shared/words';
import { useState, type FormEvent } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field, SelectField } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import type { ResultBody, WeavingResult } from '../../../../shared/api/plans';
import type { LengthUnit } from '../../../../shared/weave/types';
import { useAddResult, useResults } from '../api/results';

const SIZES = [
  ['widthInReed', 'Width in the reed'],
  ['lengthOnLoom', 'Length woven, on the loom'],
  ['widthOffLoom', 'Width off the loom'],
  ['lengthOffLoom', 'Length off the loom'],
  ['widthFinished', 'Width after wet finishing'],
  ['lengthFinished', 'Length after wet finishing'],
] as const;
type SizeKey = (typeof SIZES)[number][0];

const pct = (v: number | undefined) => (v === undefined ? '—' : `${(v * 100).toFixed(1)} %`);

function Allowances({ r }: { r: WeavingResult }) {
  const a = r.allowances;
  return (
    <span className="tabular-nums">
      take-up {pct(a.takeUp)}, draw-in {pct(a.drawIn)}, shrinkage {pct(a.lengthShrinkage)} in length and {pct(a.widthShrinkage)} in width
    </span>
  );
}

/** Measured sizes on and off the loom; the server turns them into the allowances for the next plan. */
export function ResultsSection({ draftId, unit: planUnit }: { draftId: number; unit: LengthUnit }) {
  const [unit, setUnit] = useState<LengthUnit>(planUnit);
  const [values, setValues] = useState<Partial<Record<SizeKey, string>>>({});
  const [notes, setNotes] = useState('');
  const add = useAddResult(draftId);
  const results = useResults(draftId);
  const errors = fieldErrorsOf(add.error);

  const submit = (e: FormEvent) => {
    e.preventDefault();
    const body: Record<string, unknown> = { unit, notes };
    for (const [key] of SIZES) {
      const t = values[key]?.trim();
      if (t) body[key] = Number(t);
    }
    add.mutate(body as ResultBody, { onSuccess: () => { setValues({}); setNotes(''); } });
  };

  return (
    <section aria-labelledby="results-heading" className="flex flex-col gap-3 rounded-md border border-line bg-surface p-4">
      <h2 id="results-heading" className="text-lg font-semibold">What came off the loom</h2>
      <p className="text-sm text-muted">
        Measure on the loom under tension, again off the loom after it has rested, and once more after wet finishing. Your
        measured take-up and shrinkage are offered as the starting point of your next plan.
      </p>
      <form onSubmit={submit} className="grid gap-3 sm:grid-cols-2" noValidate>
        <SelectField label="Measured in" value={unit} onChange={(e) => setUnit(e.target.value as LengthUnit)}>
          <option value="inch">inches</option>
          <option value="cm">centimetres</option>
        </SelectField>
        <div />
        {SIZES.map(([key, label]) => (
          <Field
            key={key}
            label={`${label}${key.endsWith('Finished') ? ' (when done)' : ''}`}
            inputMode="decimal"
            className="min-h-12 text-base"
            value={values[key] ?? ''}
            error={errors[key]}
            onChange={(e) => setValues((v) => ({ ...v, [key]: e.target.value }))}
          />
        ))}
        <Field label="Notes" className="min-h-12 text-base" value={notes} onChange={(e) => setNotes(e.target.value)} />
        <div className="flex items-end">
          <Button type="submit" variant="primary" className="min-h-12" busy={add.isPending} busyLabel="Recording…">Record the sizes</Button>
        </div>
      </form>
      {add.isError && <ErrorNotice title="Could not record the sizes" error={add.error} />}
      {add.isSuccess && (
        <p role="status" className="rounded-md border border-ok bg-ok-soft p-3 text-sm">
          <span aria-hidden="true">✓ </span>Recorded: <Allowances r={add.data.result} />.
        </p>
      )}
      {results.data && results.data.results.length > 0 && (
        <ul aria-label="Results so far" className="flex flex-col gap-1 text-sm">
          {results.data.results.map((r) => (
            <li key={r.id}>
              {new Date(r.createdAt).toLocaleDateString(LOCALE)} · {r.mine ? 'you' : r.weaverName}: <Allowances r={r} />
              {r.notes ? ` — ${r.notes}` : ''}
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
