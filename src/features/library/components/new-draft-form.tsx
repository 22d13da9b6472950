import { useState, type FormEvent, type ReactNode } from 'react';
import { useNavigate } from 'react-router-dom';
import { MAX_SHAFTS, MAX_THREADS, MAX_TREADLES, PROFILE_UNITS, type ProfileUnitId, type StartingStructure } from '../../../../shared/weave';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field, FieldError, SelectField } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import type { Membership } from '../../../types/api';
import { useCreateDraft } from '../api/create-draft';

/** A studio the weaver may add drafts to (owner or editor there). */
export interface StudioChoice {
  id: number;
  name: string;
}

const STRUCTURES: { value: StartingStructure; label: string; hint: string }[] = [
  { value: 'empty', label: 'Empty', hint: 'No threading, tie-up or treadling: draw everything yourself.' },
  { value: 'plain', label: 'Plain weave', hint: 'Threaded straight, alternate shafts lifted.' },
  { value: 'straight-twill', label: 'Straight twill', hint: 'Threaded and treadled straight, as balanced a twill as the shafts allow.' },
  { value: 'point-twill', label: 'Point twill', hint: 'Threaded and treadled on a point: diamonds.' },
  { value: 'block', label: 'Block design', hint: 'Two blocks in the unit you choose; the block design opens with the draft.' },
];

/** The form's numbers as typed: kept as text so a half-typed value is the weaver's, not reset under her. */
interface Numbers {
  shafts: string;
  treadles: string;
  ends: string;
  picks: string;
}

/** The places a draft can live: the weaver's own drafts, or a studio. */
export function PlaceOptions({ studios }: { studios: readonly StudioChoice[] }) {
  return (
    <>
      <option value="">Personal drafts (only you)</option>
      {studios.map((s) => (
        <option key={s.id} value={s.id}>Studio: {s.name}</option>
      ))}
    </>
  );
}

/** Studios where the signed-in weaver is an owner or editor: where she may start or move drafts. */
export function writableStudios(memberships: readonly Membership[]): StudioChoice[] {
  return memberships.filter((m) => m.role === 'owner' || m.role === 'editor').map((m) => ({ id: m.studioId, name: m.studioName }));
}

/** What a field of the form is called in the API's error `fields`. */
const apiField = (field: string) => field.replace(/^start\./, '');

/**
 * New draft: name, where it lives, the loom (shafts, and treadles with a tie-up or a lift plan),
 * ends and picks, and a starting structure. Everything has a usable default, so "Create draft" is
 * one press away; the draft opens in the workspace (at the block design when started as one).
 */
export function NewDraftForm({ studios, studioId }: { studios: readonly StudioChoice[]; studioId?: number }) {
  const navigate = useNavigate();
  const create = useCreateDraft();
  const [name, setName] = useState('Untitled draft');
  const [where, setWhere] = useState(studioId !== undefined && studios.some((s) => s.id === studioId) ? String(studioId) : '');
  const [numbers, setNumbers] = useState<Numbers>({ shafts: '4', treadles: '6', ends: '48', picks: '48' });
  const [liftPlan, setLiftPlan] = useState(false);
  const [structure, setStructure] = useState<StartingStructure>('straight-twill');
  const [unit, setUnit] = useState<ProfileUnitId>('double-weave');
  const errors = Object.fromEntries(Object.entries(fieldErrorsOf(create.error)).map(([k, v]) => [apiField(k), v]));
  const shown = new Set(['name', 'studioId', 'shafts', 'treadles', 'ends', 'picks', 'structure', 'unit']);
  const otherError = create.isError && !Object.keys(errors).some((k) => shown.has(k));

  const number = (key: keyof Numbers) => ({
    inputMode: 'numeric' as const,
    value: numbers[key],
    onChange: (e: { target: { value: string } }) => setNumbers((n) => ({ ...n, [key]: e.target.value })),
    error: errors[key],
  });

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const toNumber = (text: string) => (text.trim() === '' ? Number.NaN : Number(text));
    create.mutate(
      {
        name: name.trim(),
        studioId: where === '' ? undefined : Number(where),
        start: {
          shafts: toNumber(numbers.shafts),
          treadles: liftPlan ? 0 : toNumber(numbers.treadles),
          ends: toNumber(numbers.ends),
          picks: toNumber(numbers.picks),
          structure,
          unit: structure === 'block' ? unit : undefined,
        },
      },
      { onSuccess: ({ draft }) => navigate(`/drafts/${draft.id}`, { state: { openBlockDesign: structure === 'block' } }) },
    );
  };

  return (
    <form onSubmit={submit} noValidate aria-labelledby="new-draft-heading" className="flex max-w-3xl flex-col gap-5 rounded-md border border-line bg-surface p-5">
      <h2 id="new-draft-heading" className="sr-only">New draft</h2>
      {otherError && <ErrorNotice title="Could not make the draft" error={create.error} />}
      <div className="flex flex-wrap gap-4">
        <div className="w-80">
          <Field label="Name" value={name} onChange={(e) => setName(e.target.value)} maxLength={200} error={errors.name} />
        </div>
        <div className="w-64">
          <SelectField label="Where it lives" value={where} onChange={(e) => setWhere(e.target.value)} error={errors.studioId}
            hint={studios.length === 0 ? 'Studios where you are an owner or editor are offered here.' : undefined}>
            <PlaceOptions studios={studios} />
          </SelectField>
        </div>
      </div>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-base font-semibold">Loom</legend>
        <div className="flex flex-wrap items-start gap-4">
          <div className="w-28"><Field label="Shafts" {...number('shafts')} hint={`2 to ${MAX_SHAFTS}`} /></div>
          <Choice legend="Picks are woven with" error={undefined}>
            <Radio name="control" checked={!liftPlan} onChange={() => setLiftPlan(false)}>Treadles and a tie-up</Radio>
            <Radio name="control" checked={liftPlan} onChange={() => setLiftPlan(true)}>A lift plan (table or dobby loom)</Radio>
          </Choice>
          {!liftPlan && <div className="w-28"><Field label="Treadles" {...number('treadles')} hint={`1 to ${MAX_TREADLES}`} /></div>}
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 text-base font-semibold">Size to start with</legend>
        <div className="flex flex-wrap gap-4">
          <div className="w-28"><Field label="Ends" {...number('ends')} hint={`1 to ${count(MAX_THREADS)}`} /></div>
          <div className="w-28"><Field label="Picks" {...number('picks')} hint={`1 to ${count(MAX_THREADS)}`} /></div>
          <p className="self-center text-xs text-muted">More can be added or taken away while drawing.</p>
        </div>
      </fieldset>

      <Choice legend="Starting structure" error={errors.structure}>
        <div className="grid gap-x-6 gap-y-2 sm:grid-cols-2">
          {STRUCTURES.map((s) => (
            <Radio key={s.value} name="structure" checked={structure === s.value} onChange={() => setStructure(s.value)} hint={s.hint}>
              {s.label}
            </Radio>
          ))}
        </div>
      </Choice>
      {structure === 'block' && (
        <div className="w-80">
          <SelectField label="Unit of the block design" value={unit} onChange={(e) => setUnit(e.target.value as ProfileUnitId)} error={errors.unit}
            hint={unitHint(unit)}>
            {PROFILE_UNITS.map((u) => (
              <option key={u.id} value={u.id}>{u.name}</option>
            ))}
          </SelectField>
        </div>
      )}

      <div className="flex items-center gap-3">
        <Button type="submit" variant="primary" busy={create.isPending} busyLabel="Making the draft…">
          Create draft
        </Button>
        <p className="text-sm text-muted">It opens ready to draw; everything here can be changed later.</p>
      </div>
    </form>
  );
}

const count = (n: number) => n.toLocaleString('en-GB').replace(/,/g, '\u2009');

function unitHint(id: ProfileUnitId): string {
  const unit = PROFILE_UNITS.find((u) => u.id === id)!;
  return `Two blocks need ${unit.sharedShafts + 2 * unit.shaftsPerBlock} shafts; each block unit is ${unit.width} ends by ${unit.height} picks.`;
}

function Choice({ legend, error, children }: { legend: string; error: string | undefined; children: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-1.5">
      <legend className="mb-1 text-sm font-medium text-ink">{legend}</legend>
      {children}
      {error && <FieldError message={error} />}
    </fieldset>
  );
}

function Radio({ name, checked, onChange, hint, children }: { name: string; checked: boolean; onChange: () => void; hint?: string; children: ReactNode }) {
  return (
    <label className="flex items-start gap-2 text-sm">
      <input type="radio" name={name} checked={checked} onChange={onChange} className="mt-0.5 size-5 shrink-0" />
      <span>
        <span className="font-medium">{children}</span>
        {hint && <span className="block text-xs text-muted">{hint}</span>}
      </span>
    </label>
  );
}
