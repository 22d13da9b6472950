import { useState, type ReactNode } from 'react';
import { Button } from '../../../components/ui/button';
import { colourName } from '../../../components/ui/colour-swatch';
import { Field, SelectField } from '../../../components/ui/field';
import { planSize, type PlanDocument } from '../../../../shared/plan/plan-schema';

type SizeFrom = NonNullable<PlanDocument['sizeFrom']>;
import { defaultLoomWaste, DEFAULT_ALLOWANCES, DEFAULT_WEFT_ALLOWANCE } from '../../../../shared/plan/warp';
import { dentingLabel } from '../../../../shared/plan/reed';
import { parseYarn } from '../../../../shared/plan/yarn';
import type { Draft, LengthUnit } from '../../../../shared/weave/types';
import { convertPlanUnit, parseDenting } from '../plan-form';
import { percent } from '../format';
import { formatNumber, NumberField } from './number-field';

const WEAVE_LABELS: Record<PlanDocument['weave'], string> = {
  plain: 'Plain weave',
  twill21: '2/1 twill',
  twill22: '2/2 twill',
  twill31: '3/1 twill',
  basket22: '2/2 basket',
  satin5: '5-end satin',
};

export interface MeasuredOffer {
  label: string;
  apply: () => void;
}

interface PlanFormProps {
  plan: PlanDocument;
  draft: Draft;
  onChange: (plan: PlanDocument) => void;
  /** Field errors from the plan schema, keyed by dotted path. */
  errors: Record<string, string>;
  measured: MeasuredOffer | null;
}

function Group({ title, children }: { title: string; children: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-3 rounded-md border border-line bg-surface p-4">
      <legend className="px-1 text-base font-semibold">{title}</legend>
      <div className="grid gap-3 sm:grid-cols-2">{children}</div>
    </fieldset>
  );
}

function UnitSwitch({ unit, onChange }: { unit: LengthUnit; onChange: (u: LengthUnit) => void }) {
  return (
    <div role="radiogroup" aria-label="Units" className="flex gap-1">
      {(['inch', 'cm'] as const).map((u) => (
        <button
          key={u}
          type="button"
          role="radio"
          aria-checked={unit === u}
          onClick={() => onChange(u)}
          className={`min-h-11 rounded-md border px-4 text-sm ${unit === u ? 'border-accent bg-accent-soft font-semibold text-accent-strong' : 'border-field bg-surface'}`}
        >
          {unit === u && <span aria-hidden="true">✓ </span>}
          {u === 'inch' ? 'Inches' : 'Centimetres'}
        </button>
      ))}
    </div>
  );
}

/** A yarn typed as the weaver writes it; wraps per inch typed here move to their own field. */
function YarnField({ label, value, onChange, acceptWraps = false, error }: {
  label: string; value: string | undefined; onChange: (text: string | undefined, wrapsPerInch?: number) => void; acceptWraps?: boolean; error?: string;
}) {
  const [text, setText] = useState(value ?? '');
  const parsed = text.trim() ? parseYarn(text) : null;
  const hint = parsed?.ok && parsed.yarn.kind === 'count'
    ? `Reads as ${formatNumber(parsed.yarn.metresPerKg / 1000, 2)} m per gram.`
    : 'As you would write it: "8/2 cotton", "2/10 worsted", "30 tex", "Nm 2/28".';
  return (
    <Field
      label={label}
      value={text}
      hint={hint}
      error={parsed && !parsed.ok ? parsed.error : error}
      onChange={(e) => {
        const next = e.target.value;
        const r = next.trim() ? parseYarn(next) : null;
        if (r?.ok && r.yarn.kind === 'wraps' && acceptWraps) {
          setText('');
          return onChange(undefined, r.yarn.wrapsPerInch);
        }
        setText(next);
        onChange(r?.ok && r.yarn.kind === 'count' ? next.trim() : undefined);
      }}
    />
  );
}

/** The weaver's inputs to a plan. Every change goes up at once, so the results follow as they type. */
export function PlanForm({ plan, draft, onChange, errors, measured }: PlanFormProps) {
  const u = plan.unit;
  const unitWord = u === 'inch' ? 'in' : 'cm';
  const set = (patch: Partial<PlanDocument>) => onChange({ ...plan, ...patch });
  const setAllowance = (key: keyof PlanDocument['allowances']) => (v: number | undefined) =>
    set({ allowances: { ...plan.allowances, [key]: v ?? DEFAULT_ALLOWANCES[key] } });
  const setLists = (patch: Partial<PlanDocument['lists']>) => set({ lists: { ...plan.lists, ...patch } });
  const [dentingText, setDentingText] = useState(plan.denting ? dentingLabel(plan.denting) : '');
  const dentingResult = parseDenting(dentingText);
  const colours = [...new Set([...draft.warpColors, ...draft.weftColors])].sort((a, b) => a - b);
  const sizeFrom = planSize(plan, draft).from;

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-3">
        <span className="text-sm font-medium">Measure in</span>
        <UnitSwitch unit={u} onChange={(to) => onChange(convertPlanUnit(plan, to))} />
      </div>

      <Group title="Cloth">
        <SelectField
          label="Size from"
          value={sizeFrom}
          hint={sizeFrom === 'draft' ? 'The draft is the whole piece: its ends and picks give the size on the loom.' : undefined}
          onChange={(e) => {
            const from = e.target.value as SizeFrom;
            set({ sizeFrom: from, ...(from === 'loom' && !plan.onLoom ? { onLoom: { widthInReed: plan.finishedWidth, wovenLength: plan.finishedLength } } : {}) });
          }}
        >
          <option value="finished">The finished size I want</option>
          <option value="loom">What is on the loom</option>
          <option value="draft">The draft: it is the whole piece (a mat, a panel)</option>
        </SelectField>
        {sizeFrom === 'finished' && (
          <>
            <NumberField label={`Finished width (${unitWord})`} value={plan.finishedWidth} onChange={(v) => v !== undefined && set({ finishedWidth: v })} error={errors.finishedWidth} />
            <NumberField label={`Finished length per piece (${unitWord})`} value={plan.finishedLength} onChange={(v) => v !== undefined && set({ finishedLength: v })} error={errors.finishedLength} />
          </>
        )}
        {sizeFrom === 'loom' && plan.onLoom && (
          <>
            <NumberField label={`Width in the reed (${unitWord})`} value={plan.onLoom.widthInReed} onChange={(v) => v !== undefined && plan.onLoom && set({ onLoom: { ...plan.onLoom, widthInReed: v } })} error={errors['onLoom.widthInReed']} />
            <NumberField label={`Length to weave per piece (${unitWord})`} value={plan.onLoom.wovenLength} onChange={(v) => v !== undefined && plan.onLoom && set({ onLoom: { ...plan.onLoom, wovenLength: v } })} error={errors['onLoom.wovenLength']} />
          </>
        )}
        <NumberField label="Pieces" value={plan.pieces} onChange={(v) => v !== undefined && set({ pieces: v })} error={errors.pieces} />
        <NumberField label={`Hems per piece, both ends (${unitWord})`} value={plan.hems} onChange={(v) => set({ hems: v ?? 0 })} optional error={errors.hems} />
        <NumberField label={`Fringe per piece, both ends (${unitWord})`} value={plan.fringe} onChange={(v) => set({ fringe: v ?? 0 })} optional error={errors.fringe} />
        <NumberField label={`Samples (${unitWord} woven)`} value={plan.samples} onChange={(v) => set({ samples: v ?? 0 })} optional error={errors.samples} />
        <SelectField label="Loom" value={plan.loom} onChange={(e) => set({ loom: e.target.value as PlanDocument['loom'] })}>
          <option value="floor">Floor loom</option>
          <option value="table">Table loom</option>
        </SelectField>
        <NumberField
          label={`Loom waste (${unitWord})`}
          value={plan.loomWaste}
          optional
          placeholder={formatNumber(defaultLoomWaste(plan.loom, u), 1)}
          hint="Blank uses the usual waste for the loom."
          onChange={(v) => set({ loomWaste: v })}
          error={errors.loomWaste}
        />
      </Group>

      <Group title="Yarns">
        <YarnField
          label="Warp yarn"
          value={plan.warpYarn.text}
          acceptWraps
          onChange={(text, wraps) => set({ warpYarn: { ...plan.warpYarn, text }, ...(wraps ? { wrapsPerInch: wraps } : {}) })}
          error={errors['warpYarn.text']}
        />
        <YarnField label="Weft yarn" value={plan.weftYarn.text} onChange={(text) => set({ weftYarn: { ...plan.weftYarn, text } })} error={errors['weftYarn.text']} />
        <NumberField
          label="Wraps per inch of the warp yarn"
          value={plan.wrapsPerInch}
          optional
          hint="Wrap the yarn round a ruler, side by side, for one inch."
          onChange={(v) => set({ wrapsPerInch: v })}
          error={errors.wrapsPerInch}
        />
        {colours.length > 1 && (
          <details className="sm:col-span-2">
            <summary className="cursor-pointer text-sm font-medium">A different yarn for some colours</summary>
            <div className="mt-2 grid gap-3 sm:grid-cols-2">
              {colours.map((c) => (
                <YarnField
                  key={c}
                  label={`Yarn for ${colourName(draft, c)}`}
                  value={plan.warpYarn.byColor[String(c)]}
                  onChange={(text) => {
                    const byColor = { ...plan.warpYarn.byColor };
                    if (text) byColor[String(c)] = text;
                    else delete byColor[String(c)];
                    set({ warpYarn: { ...plan.warpYarn, byColor }, weftYarn: { ...plan.weftYarn, byColor } });
                  }}
                />
              ))}
            </div>
          </details>
        )}
      </Group>

      <Group title="Structure and sett">
        <SelectField label="Weave" value={plan.weave} onChange={(e) => set({ weave: e.target.value as PlanDocument['weave'] })}>
          {Object.entries(WEAVE_LABELS).map(([k, label]) => <option key={k} value={k}>{label}</option>)}
        </SelectField>
        <SelectField label="Layers" value={plan.layers} hint="Two for double weave: the sett doubles." onChange={(e) => set({ layers: Number(e.target.value) })}>
          {[1, 2, 3, 4].map((n) => <option key={n} value={n}>{n === 1 ? 'One cloth' : `${n} layers`}</option>)}
        </SelectField>
        <NumberField
          label={`Ends per ${unitWord}`}
          value={plan.sett}
          optional
          placeholder="the draft's"
          onChange={(v) => set({ sett: v })}
          error={errors.sett}
        />
        <NumberField label={`Picks per ${unitWord}`} value={plan.picksPerUnit} optional placeholder="the draft's" onChange={(v) => set({ picksPerUnit: v })} error={errors.picksPerUnit} />
      </Group>

      <Group title="Allowances">
        <NumberField label="Take-up (%)" scale={100} value={plan.allowances.takeUp} optional onChange={setAllowance('takeUp')} error={errors['allowances.takeUp']} />
        <NumberField label="Draw-in (%)" scale={100} value={plan.allowances.drawIn} optional onChange={setAllowance('drawIn')} error={errors['allowances.drawIn']} />
        <NumberField label="Shrinkage in length (%)" scale={100} value={plan.allowances.lengthShrinkage} optional onChange={setAllowance('lengthShrinkage')} error={errors['allowances.lengthShrinkage']} />
        <NumberField label="Shrinkage in width (%)" scale={100} value={plan.allowances.widthShrinkage} optional onChange={setAllowance('widthShrinkage')} error={errors['allowances.widthShrinkage']} />
        <NumberField label="Extra weft per pick (%)" scale={100} value={plan.weftAllowance} optional onChange={(v) => set({ weftAllowance: v ?? DEFAULT_WEFT_ALLOWANCE })} error={errors.weftAllowance} />
        <div className="flex flex-wrap items-end gap-2 sm:col-span-2">
          <Button onClick={() => set({ allowances: { ...DEFAULT_ALLOWANCES }, weftAllowance: DEFAULT_WEFT_ALLOWANCE })}>
            Common practice ({percent(DEFAULT_ALLOWANCES.takeUp)} each)
          </Button>
          {measured && <Button variant="primary" onClick={measured.apply}>{measured.label}</Button>}
        </div>
      </Group>

      <Group title="Ends">
        <NumberField label="Ends in one repeat" value={plan.repeatEnds} optional placeholder={String(draft.threading.length)} onChange={(v) => set({ repeatEnds: v })} error={errors.repeatEnds} />
        <SelectField label="Round the repeats" value={plan.rounding} onChange={(e) => set({ rounding: e.target.value as PlanDocument['rounding'] })}>
          <option value="nearest">To the nearest</option>
          <option value="up">Up</option>
          <option value="down">Down</option>
        </SelectField>
        <NumberField label="Balancing ends" value={plan.balanceEnds} optional hint="Ends from the start of the repeat, so the pattern ends as it began." onChange={(v) => set({ balanceEnds: v ?? 0 })} error={errors.balanceEnds} />
        <NumberField label="Selvedge ends each side" value={plan.selvedgeEndsPerSide} optional onChange={(v) => set({ selvedgeEndsPerSide: v ?? 0 })} error={errors.selvedgeEndsPerSide} />
        <NumberField label="Ends per bout" value={plan.boutEnds} optional placeholder="one bout" onChange={(v) => set({ boutEnds: v })} error={errors.boutEnds} />
        <PackageFields plan={plan} onChange={(packageSize) => set({ packageSize })} />
      </Group>

      <Group title="Reed and sleying">
        <NumberField label="Reed dents" value={plan.reed.dents} onChange={(v) => v !== undefined && set({ reed: { ...plan.reed, dents: v } })} error={errors['reed.dents']} />
        <SelectField label="Dents counted" value={plan.reed.per} onChange={(e) => set({ reed: { ...plan.reed, per: e.target.value as PlanDocument['reed']['per'] } })}>
          <option value="inch">per inch</option>
          <option value="10cm">per 10 cm</option>
          <option value="cm">per cm</option>
        </SelectField>
        <NumberField
          label={`Reed width (${unitWord})`}
          value={plan.reedWidth}
          optional
          placeholder="not given"
          hint="The dented width of the reed: the plan then finds the dent to start at so the warp is centred."
          onChange={(v) => set({ reedWidth: v })}
          error={errors.reedWidth}
        />
        <Field
          label="Ends per dent"
          value={dentingText}
          placeholder="planned from the sett"
          hint='Repeating, e.g. "2" or "2-2-1"; blank plans it from the sett.'
          error={dentingResult.ok ? errors.denting : dentingResult.error}
          onChange={(e) => {
            setDentingText(e.target.value);
            const r = parseDenting(e.target.value);
            if (r.ok) set({ denting: r.pattern });
          }}
        />
        <label className="flex min-h-11 items-center gap-2 text-sm">
          <input type="checkbox" className="size-5" checked={plan.lists.layerRule} onChange={(e) => setLists({ layerRule: e.target.checked })} />
          Layer rule: at most one end of each layer per dent, in layer order
        </label>
        {plan.lists.layerRule && (
          <>
            <Field
              label="Layer order in a dent"
              defaultValue={(plan.lists.layerOrder ?? []).join(', ')}
              placeholder="1, 2"
              onChange={(e) => {
                const order = e.target.value.split(/[\s,]+/).filter(Boolean).map(Number);
                setLists({ layerOrder: order.length > 0 && order.every((n) => Number.isInteger(n) && n >= 1) ? order : undefined });
              }}
            />
            <NumberField label="Reverse the order every … repeats" value={plan.lists.flipEvery} optional placeholder="never" onChange={(v) => setLists({ flipEvery: v })} error={errors['lists.flipEvery']} />
          </>
        )}
      </Group>

      <fieldset className="flex flex-col gap-2 rounded-md border border-line bg-surface p-4">
        <legend className="px-1 text-base font-semibold">Notes</legend>
        <label className="sr-only" htmlFor="plan-notes">Plan notes</label>
        <textarea
          id="plan-notes"
          className="min-h-24 rounded-md border border-field p-2 text-sm"
          value={plan.notes}
          onChange={(e) => set({ notes: e.target.value })}
          placeholder="Finishing, dyeing, where the yarn came from…"
        />
      </fieldset>
    </div>
  );
}

function PackageFields({ plan, onChange }: { plan: PlanDocument; onChange: (p: PlanDocument['packageSize']) => void }) {
  const size = plan.packageSize;
  const amount = size ? ('length' in size ? size.length : size.mass) : undefined;
  const [unit, setUnit] = useState<string>(size?.unit ?? 'g');
  const make = (value: number | undefined, unitValue: string): PlanDocument['packageSize'] => {
    if (value === undefined || !(value > 0)) return undefined;
    return unitValue === 'm' || unitValue === 'yd'
      ? { length: value, unit: unitValue }
      : { mass: value, unit: unitValue as 'g' | 'oz' | 'kg' | 'lb' };
  };
  return (
    <>
      <NumberField label="Skein or cone size" value={amount} optional placeholder="none" onChange={(v) => onChange(make(v, unit))} />
      <SelectField label="Skein or cone measured in" value={unit} onChange={(e) => { setUnit(e.target.value); onChange(make(amount, e.target.value)); }}>
        {['g', 'oz', 'kg', 'lb', 'm', 'yd'].map((x) => <option key={x} value={x}>{x}</option>)}
      </SelectField>
    </>
  );
}
