import { LOOM_LIST_NAMES, SHAFT_NUMBERING_NAMES } from '../../../../shared/words';
import { useEffect, useEffectEvent, useMemo, useState, type ReactNode } from 'react';
import { ColourSwatch } from '../../../components/ui/colour-swatch';
import type { LoomList, Progress, WorkingOrder } from '../../../../shared/api/plans';
import { defaultPlan, type PlanDocument } from '../../../../shared/plan/plan-schema';
import { parseDraft } from '../../../../shared/weave/draft';
import type { Draft } from '../../../../shared/weave/types';
import type { DraftDetail } from '../../../types/api';
import { afterStep, breakDue, restedActivity } from '../break-reminder';
import { endRange, firstEndAt, groupOfEnd, loomOutputs, pickAt, sharedDents, stepCount, threadingGroupCheck } from '../loom-steps';
import { readLoomCache, writeLoomCache } from '../offline-store';
import { usePlace, type SaveState } from '../use-place';
import { ResultsSection } from './results-section';

const LIST_LABELS: Record<LoomList, string> = { threading: LOOM_LIST_NAMES.threading, sleying: LOOM_LIST_NAMES.sleying, tieon: LOOM_LIST_NAMES.tieOn, weaving: LOOM_LIST_NAMES.weaving };
const BIG = 'min-h-12 min-w-12 rounded-md border px-4 text-base font-medium';

function Choice<T extends string>({ legend, value, options, onChange }: {
  legend: string; value: T; options: [T, string][]; onChange: (v: T) => void;
}) {
  return (
    <fieldset className="flex flex-col gap-1">
      <legend className="text-sm font-medium">{legend}</legend>
      <div className="flex flex-wrap gap-2">
        {options.map(([v, label]) => (
          <button
            key={v}
            type="button"
            aria-pressed={value === v}
            onClick={() => onChange(v)}
            className={`${BIG} ${value === v ? 'border-accent bg-accent-soft font-semibold text-accent-strong' : 'border-field bg-surface'}`}
          >
            {value === v && <span aria-hidden="true">✓ </span>}
            {label}
          </button>
        ))}
      </div>
    </fieldset>
  );
}

const SAVE_WORDS: Record<SaveState, string> = {
  saved: 'Place saved.',
  saving: 'Saving your place…',
  offline: 'Offline: your place is kept on this device and sent when the connection is back.',
  failed: 'Your place could not be saved on the server; it is kept on this device.',
};

/** The At the loom page once the draft and plan are in hand. */
export function LoomGuide({ detail, savedPlan, serverPlace, offline }: {
  detail: Pick<DraftDetail, 'id' | 'name' | 'document'>; savedPlan: PlanDocument | null; serverPlace: Progress | null | undefined; offline: boolean;
}) {
  const draft = useMemo(() => parseDraft(detail.document), [detail.document]);
  const plan = savedPlan ?? defaultPlan(draft.sett.unit);
  const { place, move, saveState } = usePlace(detail.id, serverPlace);
  const [tieOnEnds, setTieOnEnds] = useState<number | undefined>(() => readLoomCache(detail.id).tieOnEnds);
  const outputs = useMemo(() => loomOutputs(draft, plan, place.settings, tieOnEnds), [draft, plan, place.settings, tieOnEnds]);
  const list = place.list;
  const count = stepCount(outputs, list);
  const position = Math.min(Math.max(place.positions[list] ?? 0, 0), Math.max(count - 1, 0));
  const [activity, setActivity] = useState(restedActivity);
  // The working order is chosen once, before the first step; after that it folds away (a tap opens it).
  const [orderOpen, setOrderOpen] = useState(() => Date.parse(place.movedAt) <= 0);

  const go = (to: number) => {
    if (to < 0 || to >= count || to === position) return;
    if (to > position) {
      setActivity((a) => afterStep(a, Date.now()));
    }
    setOrderOpen(false);
    move(list, to, place.settings);
  };
  const forward = () => go(position + 1);
  const back = () => go(position - 1);

  // A foot switch that types a key works like the buttons.
  const step = useEffectEvent((by: 1 | -1) => go(position + by));
  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      const t = e.target as HTMLElement | null;
      if (t && (t.isContentEditable || ['INPUT', 'TEXTAREA', 'SELECT'].includes(t.tagName))) return;
      const onButton = t?.tagName === 'BUTTON' || t?.tagName === 'A';
      // Foot switches and page turners send Page Down / Page Up (or Enter) as often as arrows.
      if (e.key === 'ArrowRight' || e.key === 'PageDown' || ((e.key === ' ' || e.key === 'Enter') && !onButton)) {
        e.preventDefault();
        step(1);
      } else if (e.key === 'ArrowLeft' || e.key === 'PageUp' || (e.key === 'Backspace' && !onButton)) {
        e.preventDefault();
        step(-1);
      }
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, []);

  // Turning round (side or direction) keeps the weaver on the same end, wherever its group now falls.
  const setOrder = (patch: Partial<WorkingOrder>) => {
    const settings = { ...place.settings, ...patch };
    const end = firstEndAt(outputs, list, position);
    const to = end === undefined ? position : groupOfEnd(loomOutputs(draft, plan, settings, tieOnEnds), list, end) ?? position;
    move(list, to, settings);
  };
  const unitWord = plan.unit === 'inch' ? 'inch' : 'cm';
  const stepWord = list === 'weaving' ? 'pick' : 'group';

  return (
    <div className="mx-auto flex max-w-3xl flex-col gap-5 text-base">
      <div className="flex flex-col gap-1">
        <h2 className="text-2xl font-semibold">At the loom</h2>
        <p role="status" className="text-sm text-muted">
          {offline ? 'Working from the copy kept on this device. ' : ''}
          {SAVE_WORDS[saveState]}
        </p>
        {!savedPlan && <p className="text-sm">No plan is saved for this draft yet, so the guide uses a common-practice plan. Save a plan first for your own widths and reed.</p>}
      </div>

      <Choice legend="List" value={list} options={Object.entries(LIST_LABELS) as [LoomList, string][]} onChange={(l) => move(l, place.positions[l] ?? 0, place.settings)} />

      <details className="rounded-md border border-line bg-surface p-3" open={orderOpen} onToggle={(e) => setOrderOpen(e.currentTarget.open)}>
        <summary className="min-h-8 cursor-pointer text-sm font-medium">
          Working order: from the {place.settings.side}, {place.settings.direction.replace(/-/g, ' ')}, shaft 1 {place.settings.shaftNumbering === 'near' ? 'nearest me' : 'farthest from me'}
        </summary>
        <div className="mt-2 flex flex-col gap-3">
          <Choice legend="Working from" value={place.settings.side} options={[['front', 'Front of the loom'], ['back', 'Back of the loom']]} onChange={(side) => setOrder({ side })} />
          <Choice legend="Direction" value={place.settings.direction} options={[['right-to-left', 'Right to left'], ['left-to-right', 'Left to right']]} onChange={(direction) => setOrder({ direction })} />
          <Choice legend={SHAFT_NUMBERING_NAMES.question} value={place.settings.shaftNumbering} options={[['near', SHAFT_NUMBERING_NAMES.near], ['far', SHAFT_NUMBERING_NAMES.far]]} onChange={(shaftNumbering) => setOrder({ shaftNumbering })} />
          {list === 'tieon' && (
            <label className="flex flex-col gap-1 text-sm font-medium">
              Ends per bundle
              <input
                type="number"
                min={1}
                className="min-h-12 w-32 rounded-md border border-field px-3 text-base"
                value={tieOnEnds ?? outputs.tieOn[0]?.items.length ?? ''}
                onChange={(e) => {
                  const n = Number(e.target.value);
                  const v = Number.isInteger(n) && n >= 1 ? n : undefined;
                  setTieOnEnds(v);
                  writeLoomCache(detail.id, { tieOnEnds: v });
                }}
              />
            </label>
          )}
        </div>
      </details>

      {breakDue(activity) && (
        <div role="alert" className="flex flex-col gap-2 rounded-md border border-accent bg-accent-soft p-4">
          <p>
            <strong>Time for a short break.</strong> Stand up, roll your shoulders, stretch your back and wrists, and look at
            something far away for a minute. Set the bench so you reach the heddles without twisting or hunching.
          </p>
          <div><button type="button" className={`${BIG} border-field bg-surface`} onClick={() => setActivity(restedActivity)}>I have had a break</button></div>
        </div>
      )}

      <section aria-labelledby="loom-step-heading" className="flex flex-col gap-3 rounded-md border border-line bg-surface p-4">
        {count === 0 ? (
          <p>This list is empty for this draft.</p>
        ) : (
          <>
            <h2 id="loom-step-heading" className="text-xl font-semibold tabular-nums">
              {LIST_LABELS[list]}: {stepWord} {position + 1} of {count}
            </h2>
            <div
              role="progressbar"
              aria-label={`${LIST_LABELS[list]} progress`}
              aria-valuemin={0}
              aria-valuemax={count}
              aria-valuenow={position + 1}
              aria-valuetext={`${stepWord} ${position + 1} of ${count}`}
              className="h-3 w-full overflow-hidden rounded-full border border-field bg-sunken"
            >
              <div className="h-full bg-accent" style={{ width: `${((position + 1) / count) * 100}%` }} />
            </div>
            <StepBody list={list} position={position} outputs={outputs} draft={draft} unitWord={unitWord} order={place.settings} />
            {(list === 'threading' || list === 'sleying') && (
              <QuickCheck list={list} index={position} outputs={outputs} draft={draft} order={place.settings} />
            )}
          </>
        )}
        <div className="flex flex-wrap gap-3">
          <button type="button" className={`${BIG} border-field bg-surface`} onMouseDown={(e) => e.preventDefault()} onClick={back} disabled={position === 0}>
            <span aria-hidden="true">← </span>Back
          </button>
          <button
            type="button"
            className={`${BIG} flex-1 border-accent bg-accent text-white disabled:opacity-60`}
            onMouseDown={(e) => e.preventDefault()}
            onClick={forward}
            disabled={position >= count - 1}
          >
            {list === 'weaving' ? 'Next pick' : 'Next group'}<span aria-hidden="true"> →</span>
          </button>
        </div>
        <p className="text-xs text-muted">Keys: space, Enter, Page Down or → for the next {stepWord}; Page Up, ← or backspace to go back.</p>
      </section>


      <ResultsSection draftId={detail.id} unit={plan.unit} />
    </div>
  );
}

function Ends({ children }: { children: ReactNode }) {
  return <ol className="flex flex-col divide-y divide-line text-lg">{children}</ol>;
}

function StepBody({ list, position, outputs, draft, unitWord, order }: {
  list: LoomList; position: number; outputs: ReturnType<typeof loomOutputs>; draft: Draft; unitWord: string; order: WorkingOrder;
}) {
  const layered = draft.warpLayers.some((l) => l > 1);
  if (list === 'threading') {
    const group = outputs.threading[position];
    // Ends the quick check flags carry a mark and words in the list itself, not a colour alone.
    const flagged = new Set(threadingGroupCheck(draft, group, order).flatMap((c) => c.odd));
    return (
      <ol className="grid grid-cols-[repeat(auto-fill,minmax(10.5rem,1fr))] gap-1 text-base">
        {group.items.map((s) => (
          <li key={s.end} className={`flex flex-col rounded border px-2 py-1 ${flagged.has(s.end) ? 'border-2 border-danger' : 'border-line'}`}>
            <span className="font-semibold tabular-nums">
              {flagged.has(s.end) && <span aria-hidden="true">⚠ </span>}End {s.end}: {s.shafts.length === 0 ? 'no shaft' : `shaft ${s.shafts.join(' + ')}`}
              {s.dent !== undefined && <span className="font-normal text-muted"> · dent {s.dent}</span>}
            </span>
            <span className="flex flex-wrap items-center gap-x-2 text-sm">
              <ColourSwatch draft={draft} color={s.color} />
              {layered && <span>layer {s.layer}</span>}
              {s.selvedge && <span>selvedge</span>}
              {flagged.has(s.end) && <strong>check this end</strong>}
            </span>
          </li>
        ))}
      </ol>
    );
  }
  if (list === 'sleying') {
    const group = outputs.sleying[position];
    return (
      <Ends>
        {group.items.map((d) => (
          <li key={d.dent} className="flex flex-wrap items-center gap-x-4 gap-y-1 py-2">
            <span className="w-24 font-semibold tabular-nums">Dent {d.dent}</span>
            {d.ends.length === 0 ? (
              <span>leave empty</span>
            ) : (
              d.ends.map((e) => (
                <span key={e.end} className="inline-flex items-center gap-2">
                  end {e.end} <ColourSwatch draft={draft} color={e.color} />
                  {layered && <span>layer {e.layer}</span>}
                </span>
              ))
            )}
          </li>
        ))}
      </Ends>
    );
  }
  if (list === 'tieon') {
    const group = outputs.tieOn[position];
    return (
      <p className="text-lg">
        Tie ends <strong className="tabular-nums">{endRange(group.items)}</strong> together ({group.items.length} ends). Tie
        bundles from the middle outwards, then check the tension by hand before tightening.
      </p>
    );
  }
  const w = outputs.weaving;
  const step = pickAt(w, outputs.warp.totalPicks, position);
  if (!step) return <p>No picks in this draft.</p>;
  const { row } = step;
  return (
    <div className="flex flex-col gap-2 text-lg">
      <p className="tabular-nums">
        Repeat {step.repeat} of {step.repeats} · pick {step.pickInDraft} of {w.picksInSequence} in the draft
        {row.times > 1 ? ` (${row.times} picks alike: ${row.fromPick}–${row.toPick})` : ''}
      </p>
      <p>
        {row.treadles ? <>Press treadle {row.treadles.join(' + ')}: </> : null}
        raise shaft{row.raised.length === 1 ? '' : 's'} <strong>{row.raised.join(', ') || 'none'}</strong>
      </p>
      <p className="inline-flex items-center gap-2">Weft: <ColourSwatch draft={draft} color={row.color} />{row.layer > 1 || draft.weftLayers.some((l) => l > 1) ? ` · layer ${row.layer}` : ''}</p>
      <p className="text-sm text-muted">{outputs.picksReason} Beat for {Math.round(w.picksPerUnit * 10) / 10} picks per {unitWord}; measure now and then, with the warp under the same tension.</p>
    </div>
  );
}

function QuickCheck({ list, index, outputs, draft, order }: {
  list: 'threading' | 'sleying'; index: number; outputs: ReturnType<typeof loomOutputs>; draft: Draft; order: WorkingOrder;
}) {
  let body: ReactNode;
  if (list === 'threading') {
    const checks = threadingGroupCheck(draft, outputs.threading[index], order);
    body = (
      <ul className="flex flex-col gap-2">
        {checks.map((c) => (
          <li key={c.shaft}>
            {c.color !== undefined ? (
              <>
                Raise shaft {c.shaft} alone: every end on it should be <ColourSwatch draft={draft} color={c.color} />
                {c.layer !== undefined && draft.warpLayers.some((l) => l > 1) ? ` (layer ${c.layer})` : ''}. In this group: end{c.ends.length === 1 ? '' : 's'} {c.ends.join(', ')}.
              </>
            ) : (
              <>Raise shaft {c.shaft} alone: its ends mix colours ({c.mix.map((m) => <ColourSwatch key={m} draft={draft} color={m} className="mr-2" />)}). In this group: ends {c.ends.join(', ')}.</>
            )}
            {c.odd.length > 0 && (
              <strong className="block"><span aria-hidden="true">⚠ </span>As drawn, end{c.odd.length === 1 ? '' : 's'} {c.odd.join(', ')} will not match: check the draft.</strong>
            )}
          </li>
        ))}
      </ul>
    );
  } else {
    const group = outputs.sleying[index];
    const shared = sharedDents(group);
    const short = group.items.filter((d) => d.ends.length > 0 && d.ends.length < d.planned);
    body = (
      <ul className="flex flex-col gap-1">
        {shared.map((d) => <li key={d.dent}>These ends should share dent {d.dent}: {d.ends.map((e) => e.end).join(', ')}.</li>)}
        {short.map((d) => <li key={`s${d.dent}`}>Dent {d.dent} holds {d.ends.length} of {d.planned}: the layer rule closes it early.</li>)}
        {shared.length === 0 && <li>One end per dent in this group: look along the reed for a skipped or doubled dent.</li>}
      </ul>
    );
  }
  return (
    <section aria-label="Quick check" className="rounded-md border border-ok bg-ok-soft p-4">
      <h2 className="font-semibold">Quick check: group {index + 1}</h2>
      {body}
    </section>
  );
}
