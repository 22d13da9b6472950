import { ARRANGEMENT_NAMES, CLOTH_VIEW_NAMES, LOOM_LIST_NAMES, NAMES, SHAFT_NUMBERING_NAMES } from '../../../../shared/words';
import { useId, useState } from 'react';
import type { PngViewName } from '../../../../shared/api/exports';
import { loomLists, type LoomList, type WorkingOrder } from '../../../../shared/api/plans';
import { buttonClasses } from '../../../components/ui/button';
import { SelectField } from '../../../components/ui/field';
import { pngUrl, printUrl, type NumberRange, type PrintArrangement, type PrintChoices } from '../print-links';

export interface PrintOptionsProps {
  /** `/api/drafts/7` or `/api/shared/<token>`. */
  base: string;
  ends: number;
  picks: number;
  /** Woven in more than one layer: the front and back faces can be exported. */
  layered: boolean;
  /** The draft's own arrangement, to start from. */
  arrangement?: PrintArrangement;
  /** Also offer the draft's WIF and JSON files (not through a public link). */
  files?: boolean;
  /** The draft's repeat (ends × picks); null or equal to the whole draft when it does not repeat. */
  repeat?: { ends: number; picks: number } | null;
}

const LIST_LABELS: Record<LoomList, string> = {
  threading: LOOM_LIST_NAMES.threading,
  sleying: LOOM_LIST_NAMES.sleying,
  tieon: LOOM_LIST_NAMES.tieOn,
  weaving: `${LOOM_LIST_NAMES.weaving} (treadling or lift plan)`,
};
const VIEW_LABELS: Record<PngViewName, string> = {
  colour: `${CLOTH_VIEW_NAMES.colour} view`,
  structure: `${CLOTH_VIEW_NAMES.structure} view`,
  front: `${CLOTH_VIEW_NAMES.front} view`,
  back: `${CLOTH_VIEW_NAMES.back} view`,
};

/** Pictures above this size are not offered (the server allows 16 megapixels). */
const PICTURE_PIXELS = 4_000_000;

/** The largest whole number of pixels per cell (up to 16) that keeps the picture near four megapixels. */
export function pictureScale(ends: number, picks: number): number | null {
  const cells = ends * picks;
  if (cells === 0 || cells > PICTURE_PIXELS * 4) return null;
  return Math.max(1, Math.min(16, Math.floor(Math.sqrt(PICTURE_PIXELS / cells))));
}

/**
 * Print and Export: paper, arrangement, numbering, which lists for the loom and in which working
 * order, then a link that opens the printed draft, and links to pictures and files of the draft.
 */
export function PrintOptions({ base, ends, picks, layered, arrangement, files = false, repeat = null }: PrintOptionsProps) {
  const headingId = useId();
  const repeats = repeat !== null && (repeat.ends < ends || repeat.picks < picks);
  const [choices, setChoices] = useState<PrintChoices>(() => ({
    part: repeats ? 'repeat' : 'whole',
    ends: { from: 1, to: Math.max(1, ends) },
    picks: { from: 1, to: Math.max(1, picks) },
    fitWidth: false,
    paper: 'a4',
    orientation: 'portrait',
    threadingAbove: arrangement?.threadingAbove ?? true,
    treadlingRight: arrangement?.treadlingRight ?? true,
    shaftsFromBottom: arrangement?.shaftsFromBottom ?? true,
    endOneRight: arrangement?.endOneRight ?? false,
    numberEvery: 4,
    lists: [...loomLists],
    workingOrder: { side: 'front', direction: 'right-to-left', shaftNumbering: 'near' },
  }));
  const set = (patch: Partial<PrintChoices>) => setChoices((c) => ({ ...c, ...patch }));
  const order = (patch: Partial<WorkingOrder>) => setChoices((c) => ({ ...c, workingOrder: { ...c.workingOrder, ...patch } }));
  const toggleList = (l: LoomList, on: boolean) =>
    setChoices((c) => ({ ...c, lists: loomLists.filter((x) => (x === l ? on : c.lists.includes(x))) }));
  const scale = pictureScale(ends, picks);
  const views: PngViewName[] = layered ? ['colour', 'structure', 'front', 'back'] : ['colour', 'structure'];

  return (
    <section aria-labelledby={headingId} className="flex flex-col gap-4 text-sm">
      <h2 id={headingId} className="text-lg font-semibold">Print</h2>
      <div className="grid max-w-3xl grid-cols-1 gap-4 sm:grid-cols-3">
        <SelectField label="Paper" value={choices.paper} onChange={(e) => set({ paper: e.target.value as PrintChoices['paper'] })}>
          <option value="a4">A4</option>
          <option value="letter">Letter</option>
        </SelectField>
        <SelectField label="Orientation" value={choices.orientation} onChange={(e) => set({ orientation: e.target.value as PrintChoices['orientation'] })}>
          <option value="portrait">Portrait</option>
          <option value="landscape">Landscape</option>
        </SelectField>
        <SelectField label={NAMES.numbersEvery} value={String(choices.numberEvery)} onChange={(e) => set({ numberEvery: Number(e.target.value) as PrintChoices['numberEvery'] })}>
          <option value="4">4th end and pick</option>
          <option value="8">8th end and pick</option>
          <option value="10">10th end and pick</option>
        </SelectField>
      </div>

      <fieldset className="flex flex-col gap-1">
        <legend className="font-medium">What to print</legend>
        <Radio name={`${headingId}-part`} label={`The whole draft (${ends} ends × ${picks} picks)`} checked={choices.part === 'whole'} onChange={() => set({ part: 'whole' })} />
        {repeats && repeat && (
          <Radio name={`${headingId}-part`} label={`One repeat (${repeat.ends} ends × ${repeat.picks} picks)`} checked={choices.part === 'repeat'} onChange={() => set({ part: 'repeat' })} />
        )}
        <Radio name={`${headingId}-part`} label="Some ends and picks" checked={choices.part === 'range'} onChange={() => set({ part: 'range' })} />
        {choices.part === 'range' && (
          <div className="ml-6 flex flex-wrap gap-4">
            <RangeFields word="Ends" total={ends} value={choices.ends} onChange={(v) => set({ ends: v })} />
            <RangeFields word="Picks" total={picks} value={choices.picks} onChange={(v) => set({ picks: v })} />
          </div>
        )}
        <Check label="Fit the width to one page (smaller cells)" checked={choices.fitWidth} onChange={(v) => set({ fitWidth: v })} />
        <p className="text-xs text-muted">The threading, sleying and tying-on lists always cover the whole warp.</p>
      </fieldset>

      <fieldset className="flex flex-col gap-1">
        <legend className="font-medium">Arrangement</legend>
        <Check label={ARRANGEMENT_NAMES.threadingAbove} checked={choices.threadingAbove} onChange={(v) => set({ threadingAbove: v })} />
        <Check label={ARRANGEMENT_NAMES.treadlingRight} checked={choices.treadlingRight} onChange={(v) => set({ treadlingRight: v })} />
        <Check label={ARRANGEMENT_NAMES.shaftOneAtBottom} checked={choices.shaftsFromBottom} onChange={(v) => set({ shaftsFromBottom: v })} />
        <Check label={ARRANGEMENT_NAMES.endOneRight} checked={choices.endOneRight} onChange={(v) => set({ endOneRight: v })} />
        <p className="text-xs text-muted">These start from the draft&apos;s own arrangement, as the editor shows it.</p>
      </fieldset>

      <fieldset className="flex flex-col gap-1">
        <legend className="font-medium">Lists to work from at the loom</legend>
        {loomLists.map((l) => (
          <Check key={l} label={LIST_LABELS[l]} checked={choices.lists.includes(l)} onChange={(v) => toggleList(l, v)} />
        ))}
        <p className="text-xs text-muted">Sleying and tying on come from the saved plan; without one they are left out.</p>
      </fieldset>

      <div className="grid max-w-3xl grid-cols-1 gap-4 sm:grid-cols-3">
        <SelectField label="Working from" value={choices.workingOrder.side} onChange={(e) => order({ side: e.target.value as WorkingOrder['side'] })}>
          <option value="front">The front of the loom</option>
          <option value="back">The back of the loom</option>
        </SelectField>
        <SelectField label="Direction" value={choices.workingOrder.direction} onChange={(e) => order({ direction: e.target.value as WorkingOrder['direction'] })}>
          <option value="right-to-left">Right to left</option>
          <option value="left-to-right">Left to right</option>
        </SelectField>
        <SelectField label={SHAFT_NUMBERING_NAMES.question} value={choices.workingOrder.shaftNumbering} onChange={(e) => order({ shaftNumbering: e.target.value as WorkingOrder['shaftNumbering'] })}>
          <option value="near">{SHAFT_NUMBERING_NAMES.near}</option>
          <option value="far">{SHAFT_NUMBERING_NAMES.far}</option>
        </SelectField>
      </div>

      <p>
        <a className={buttonClasses('primary')} href={printUrl(base, choices)} target="_blank" rel="noopener">
          Print
        </a>
        <span className="ml-3 text-muted">Opens the printable draft (PDF) in a new tab.</span>
      </p>

      <div className="flex flex-col gap-1">
        <h3 className="font-medium">Export</h3>
        <ul className="flex flex-wrap gap-x-4 gap-y-1">
          {scale !== null &&
            views.map((v) => (
              <li key={v}>
                <a href={pngUrl(base, v, scale, choices)} download>
                  {VIEW_LABELS[v]} (PNG, {ends * scale} × {picks * scale} pixels)
                </a>
              </li>
            ))}
          {files && (
            <>
              <li><a href={`${base}/export.wif`} download>Weaving Information File (WIF)</a></li>
              <li><a href={`${base}/export.json`} download>Shedwright draft (JSON)</a></li>
            </>
          )}
        </ul>
        {scale === null && <p className="text-muted">This draft is too big for a picture; print it instead.</p>}
      </div>
    </section>
  );
}

function Check({ label, checked, onChange }: { label: string; checked: boolean; onChange: (v: boolean) => void }) {
  return (
    <label className="flex items-center gap-2">
      <input type="checkbox" checked={checked} onChange={(e) => onChange(e.target.checked)} />
      {label}
    </label>
  );
}

function Radio({ name, label, checked, onChange }: { name: string; label: string; checked: boolean; onChange: () => void }) {
  return (
    <label className="flex items-center gap-2">
      <input type="radio" name={name} checked={checked} onChange={onChange} />
      {label}
    </label>
  );
}

/** First and last end (or pick) of a range, kept inside 1 … total and first ≤ last. */
function RangeFields({ word, total, value, onChange }: { word: string; total: number; value: NumberRange; onChange: (v: NumberRange) => void }) {
  const top = Math.max(1, total);
  const clamp = (n: number) => Math.min(top, Math.max(1, Math.round(Number.isFinite(n) ? n : 1)));
  return (
    <fieldset className="flex items-end gap-2">
      <legend className="sr-only">{word}</legend>
      <label className="flex flex-col text-xs font-medium">
        {word} from
        <input type="number" min={1} max={top} className="w-24 rounded-md border border-field px-2 py-1 text-sm" value={value.from}
          onChange={(e) => { const from = clamp(e.target.valueAsNumber); onChange({ from, to: Math.max(from, value.to) }); }} />
      </label>
      <label className="flex flex-col text-xs font-medium">
        to
        <input type="number" min={1} max={top} className="w-24 rounded-md border border-field px-2 py-1 text-sm" value={value.to}
          onChange={(e) => { const to = clamp(e.target.valueAsNumber); onChange({ from: Math.min(value.from, to), to }); }} />
      </label>
    </fieldset>
  );
}
