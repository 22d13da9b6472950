import type Konva from 'konva';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Image as KonvaImage, Layer, Stage } from 'react-konva';
import {
  applyProfile,
  colourName,
  computeDrawdown,
  expandProfile,
  MAX_PROFILE_COLUMNS,
  MAX_PROFILE_ROWS,
  maxBlocks,
  PROFILE_UNITS,
  profileUnit,
  renderCloth,
  toBlockLiftPlan,
  toBlockTreadling,
  type BlockDesign,
  type Draft,
  type DraftYarn,
  type ProfileUnitId,
} from '../../../../shared/weave';
import { GridBitmap } from '../canvas/bitmap';
import { paintCloth } from '../canvas/paint';
import { useStore } from '../store/create-store';
import { replaceDraft } from '../store/edits';
import { useEditorContext } from './editor-context';

const PREVIEW = 260;

/** A fresh design: two blocks side by side, trading places every two rows. */
const START: BlockDesign = {
  unit: 'double-weave',
  threading: [1, 1, 2, 2, 1, 1, 2, 2],
  treadling: [[1], [1], [2], [2], [1], [1], [2], [2]],
  warpColors: [[0], [1]],
  weftColors: [[0], [1]],
};

/** Blocks the design uses or names. */
const blocksIn = (d: BlockDesign) => Math.max(1, ...d.threading, ...(d.tieup ? d.tieup.flat() : d.treadling.flat()));
/** Most block treadles a block tie-up may have. */
const MAX_BLOCK_TREADLES = 32;

const clamp = (v: number, lo: number, hi: number) => Math.max(lo, Math.min(hi, Math.round(v) || lo));

/** One colour order per set, each colour kept inside the palette. */
function fitOrders(orders: readonly number[][], sets: number, paletteSize: number): number[][] {
  return Array.from({ length: sets }, (_, i) => (orders[i]?.length ? orders[i] : [i % paletteSize]).map((c) => Math.min(c, paletteSize - 1)));
}

/**
 * The block design: a profile (block threading, and a block lift plan or a block tie-up and
 * treadling) with a unit and colour orders per layer, per warp block and per weft block, expanded live. It opens on the design kept with the draft, and "Use as the draft"
 * expands it into the draft (keeping palette, yarns and what was drawn around it) and keeps it.
 */
export function ProfilePanel() {
  const { editor } = useEditorContext();
  const palette = useStore(editor.doc, (s) => s.draft.palette);
  const yarns = useStore(editor.doc, (s) => s.draft.yarns);
  const stored = useStore(editor.doc, (s) => s.draft.profile);
  const [design, setDesign] = useState<BlockDesign>(stored ?? START);
  const [blocks, setBlocks] = useState(() => blocksIn(stored ?? START));
  const [summary, setSummary] = useState('');
  // The design kept with the draft changed (used, undone, restored): open that one.
  const [seen, setSeen] = useState(stored);
  if (seen !== stored) {
    setSeen(stored);
    if (stored) {
      setDesign(stored);
      setBlocks(blocksIn(stored));
    }
  }
  const unit = profileUnit(design.unit);
  const most = maxBlocks(unit);

  const fitted = useMemo(
    (): BlockDesign => ({
      ...design,
      warpColors: fitOrders(design.warpColors, unit.warpSets.length, palette.length),
      weftColors: fitOrders(design.weftColors, unit.weftSets.length, palette.length),
      blockWarpColors: design.blockWarpColors?.map((o) => (o.length > 0 ? fitOrders(o, unit.warpSets.length, palette.length) : [])),
      blockWeftColors: design.blockWeftColors?.map((o) => (o.length > 0 ? fitOrders(o, unit.weftSets.length, palette.length) : [])),
    }),
    [design, unit, palette.length],
  );
  const expanded = useMemo((): { draft: Draft } | { error: string } => {
    try {
      return { draft: expandProfile({ ...fitted, palette }, fitted.unit) };
    } catch (e) {
      return { error: e instanceof Error ? e.message : String(e) };
    }
  }, [fitted, palette]);

  const update = (patch: Partial<BlockDesign>) => setDesign((d) => ({ ...d, ...patch }));
  const setBlockCount = (n: number) => {
    const b = clamp(n, 1, most);
    setBlocks(b);
    const fewer = (rows: number[][]) => rows.map((row) => row.filter((x) => x <= b));
    update({
      threading: design.threading.map((x) => Math.min(x, b)),
      ...(design.tieup ? { tieup: fewer(design.tieup) } : { treadling: fewer(design.treadling), blockWeftColors: design.blockWeftColors?.slice(0, b) }),
      blockWarpColors: design.blockWarpColors?.slice(0, b),
    });
  };
  const treadled = design.tieup !== undefined;
  const treadles = design.tieup?.length ?? 0;
  const setTreadleCount = (n: number) => {
    const t = clamp(n, 1, MAX_BLOCK_TREADLES);
    const tieup = design.tieup ?? [];
    update({
      tieup: Array.from({ length: t }, (_, i) => tieup[i] ?? []),
      treadling: design.treadling.map((row) => row.filter((x) => x <= t)),
      blockWeftColors: design.blockWeftColors?.slice(0, t),
    });
  };
  /** Weft blocks: a row's block treadle under a tie-up, else the first block it shows. */
  const weftBlocks = treadled ? treadles : blocks;
  const rowChoices = Array.from({ length: treadled ? treadles : blocks }, (_, i) => i + 1);
  const use = () => {
    try {
      const result = applyProfile(editor.doc.get().draft, fitted);
      editor.doc.apply(replaceDraft, { draft: result.draft });
      setSummary(result.summary);
      editor.setView({ message: result.summary });
    } catch (e) {
      setSummary(e instanceof Error ? e.message : String(e));
    }
  };

  const blockNumbers = Array.from({ length: blocks }, (_, b) => b + 1);
  return (
    <section aria-labelledby="profile-heading" className="flex flex-col gap-2 text-xs" data-testid="block-design">
      <h2 id="profile-heading" className="text-sm font-semibold">
        Block design {stored && <span className="font-normal text-muted">(kept with this draft)</span>}
      </h2>
      <div className="flex flex-wrap items-center gap-2">
        <label className="flex items-center gap-1">
          Unit
          <select
            value={design.unit}
            onChange={(e) => {
              const id = e.target.value as ProfileUnitId;
              const next = profileUnit(id);
              update({ unit: id, endsPerUnit: undefined, picksPerUnit: undefined });
              if (blocks > maxBlocks(next)) setBlockCount(maxBlocks(next));
            }}
            className="rounded border border-field bg-surface px-1"
          >
            {PROFILE_UNITS.map((u) => (
              <option key={u.id} value={u.id}>
                {u.name}
              </option>
            ))}
          </select>
        </label>
        <NumberField label="Blocks" value={blocks} min={1} max={most} onChange={setBlockCount} />
        <label className="flex items-center gap-1">
          Rows as
          <select
            value={treadled ? 'treadling' : 'liftplan'}
            onChange={(e) => setDesign((d) => (e.target.value === 'treadling' ? toBlockTreadling(d) : toBlockLiftPlan(d)))}
            className="rounded border border-field bg-surface px-1"
          >
            <option value="liftplan">a block lift plan</option>
            <option value="treadling">a block tie-up and treadling</option>
          </select>
        </label>
        {treadled && <NumberField label="Block treadles" value={treadles} min={1} max={MAX_BLOCK_TREADLES} onChange={setTreadleCount} />}
        <NumberField
          label="Profile columns"
          value={design.threading.length}
          min={1}
          max={MAX_PROFILE_COLUMNS}
          onChange={(v) => {
            const n = clamp(v, 1, MAX_PROFILE_COLUMNS);
            update({ threading: Array.from({ length: n }, (_, i) => design.threading[i] ?? design.threading[i % design.threading.length] ?? 1) });
          }}
        />
        <NumberField
          label="Profile rows"
          value={design.treadling.length}
          min={1}
          max={MAX_PROFILE_ROWS}
          onChange={(v) => {
            const n = clamp(v, 1, MAX_PROFILE_ROWS);
            update({ treadling: Array.from({ length: n }, (_, i) => design.treadling[i] ?? design.treadling[i % Math.max(1, design.treadling.length)] ?? []) });
          }}
        />
        <NumberField label="Ends per column" value={design.endsPerUnit ?? unit.width} min={unit.width} max={64} step={unit.width} onChange={(v) => update({ endsPerUnit: clamp(v / unit.width, 1, Math.floor(64 / unit.width)) * unit.width })} />
        <NumberField label="Picks per row" value={design.picksPerUnit ?? unit.height} min={unit.height} max={64} step={unit.height} onChange={(v) => update({ picksPerUnit: clamp(v / unit.height, 1, Math.floor(64 / unit.height)) * unit.height })} />
      </div>
      <p className="text-muted">
        {unit.description} Up to {most} blocks on 32 shafts.
      </p>

      <div className="overflow-x-auto">
        <table className="border-collapse" aria-label="Profile threading: the block of each column">
          <tbody>
            {[...blockNumbers].reverse().map((b) => (
              <tr key={b}>
                <th scope="row" className="sticky left-0 bg-surface pr-1 text-right font-normal whitespace-nowrap text-muted">
                  Block {b}
                </th>
                {design.threading.map((block, c) => (
                  <td key={c} className="p-0">
                    <button
                      type="button"
                      aria-label={`Column ${c + 1}, block ${b}`}
                      aria-pressed={block === b}
                      onClick={() => update({ threading: design.threading.map((x, i) => (i === c ? b : x)) })}
                      className="block size-6 border border-field bg-surface aria-pressed:bg-ink"
                    />
                  </td>
                ))}
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      <FillColumns columns={design.threading.length} blocks={blocks} onFill={(from, to, b) => update({ threading: design.threading.map((x, i) => (i >= from && i <= to ? b : x)) })} />

      {design.tieup && (
        <div className="overflow-x-auto">
          <ToggleTable
            label="Block tie-up: the blocks each block treadle shows the pattern in"
            rows={design.tieup}
            rowName={(t) => `Treadle ${t + 1}`}
            choices={blockNumbers}
            cellName={(t, b) => `Treadle ${t + 1} shows the pattern in block ${b}`}
            onChange={(tieup) => update({ tieup })}
          />
        </div>
      )}
      <div className="max-h-64 overflow-auto">
        <ToggleTable
          label={treadled ? 'Block treadling: the block treadles pressed in each row' : 'Profile rows: the blocks showing the pattern (layer 1 on top) in each row'}
          rows={design.treadling}
          rowName={(r) => `Row ${r + 1}`}
          choices={rowChoices}
          cellName={(r, b) => (treadled ? `Row ${r + 1}, treadle ${b} pressed` : `Row ${r + 1}, block ${b} shows the pattern`)}
          onChange={(treadling) => update({ treadling })}
        />
      </div>
      <FillRows
        rows={design.treadling.length}
        choices={rowChoices.length}
        what={treadled ? 'treadle' : 'block'}
        onFill={(from, to, b, show) => update({ treadling: design.treadling.map((x, i) => (i < from || i > to ? x : show === x.includes(b) ? x : toggled(x, b))) })}
      />

      <fieldset className="flex flex-col gap-1">
        <legend className="font-medium">Colour orders (each repeats over its layer’s threads)</legend>
        {unit.warpSets.map((set, i) => (
          <ColourOrder key={`w${i}`} label={`Warp, ${set}`} palette={palette} yarns={yarns} order={fitted.warpColors[i]} onChange={(o) => update({ warpColors: replaced(fitted.warpColors, i, o) })} />
        ))}
        {unit.weftSets.map((set, i) => (
          <ColourOrder key={`f${i}`} label={`Weft, ${set}`} palette={palette} yarns={yarns} order={fitted.weftColors[i]} onChange={(o) => update({ weftColors: replaced(fitted.weftColors, i, o) })} />
        ))}
        {blockNumbers.map((b) => (
          <OwnColourOrders
            key={`w${b}`}
            label={`Block ${b} has its own warp colour order`}
            name={`Block ${b} warp`}
            sets={unit.warpSets}
            defaults={fitted.warpColors}
            perBlock={fitted.blockWarpColors}
            count={blocks}
            block={b}
            palette={palette}
            yarns={yarns}
            onChange={(blockWarpColors) => update({ blockWarpColors })}
          />
        ))}
        {Array.from({ length: weftBlocks }, (_, i) => i + 1).map((b) => (
          <OwnColourOrders
            key={`f${b}`}
            label={`${treadled ? `Rows on treadle ${b}` : `Rows where block ${b} is the first to show the pattern`} have their own weft colour order`}
            name={treadled ? `Treadle ${b} weft` : `Block ${b} weft`}
            sets={unit.weftSets}
            defaults={fitted.weftColors}
            perBlock={fitted.blockWeftColors}
            count={weftBlocks}
            block={b}
            palette={palette}
            yarns={yarns}
            onChange={(blockWeftColors) => update({ blockWeftColors })}
          />
        ))}
      </fieldset>

      {'error' in expanded ? (
        <p role="alert" className="flex gap-1 font-medium text-danger">
          <span aria-hidden="true">⚠</span>
          {expanded.error}
        </p>
      ) : (
        <>
          <ExpandedPreview draft={expanded.draft} />
          <p className="text-muted">
            {expanded.draft.threading.length} ends, {expanded.draft.liftplan.length} picks on {expanded.draft.shafts} shafts.
          </p>
          <button type="button" className="self-start rounded-md bg-accent px-3 py-1.5 font-medium text-white hover:bg-accent-strong" onClick={use}>
            Use as the draft
          </button>
        </>
      )}
      <p role="status" className="text-muted" data-testid="block-design-summary">
        {summary}
      </p>
    </section>
  );
}

const toggled = (row: readonly number[], b: number) => (row.includes(b) ? row.filter((v) => v !== b) : [...row, b].sort((p, q) => p - q));
const replaced = <T,>(list: readonly T[], i: number, value: T): T[] => list.map((v, k) => (k === i ? value : v));

function NumberField({ label, value, min, max, step = 1, onChange }: { label: string; value: number; min: number; max: number; step?: number; onChange: (v: number) => void }) {
  return (
    <label className="flex items-center gap-1">
      {label}
      <input type="number" min={min} max={max} step={step} value={value} onChange={(e) => onChange(Number(e.target.value))} className="w-14 rounded border border-field bg-surface px-1" />
    </label>
  );
}

/** Fills a range of profile columns with one block. */
function FillColumns({ columns, blocks, onFill }: { columns: number; blocks: number; onFill: (from: number, to: number, block: number) => void }) {
  const [range, setRange] = useState({ from: 1, to: columns, block: 1 });
  const r = { from: clamp(range.from, 1, columns), to: clamp(range.to, 1, columns), block: clamp(range.block, 1, blocks) };
  return (
    <div className="flex flex-wrap items-center gap-1" role="group" aria-label="Fill profile columns">
      <NumberField label="Columns" value={r.from} min={1} max={columns} onChange={(from) => setRange({ ...r, from })} />
      <NumberField label="to" value={r.to} min={1} max={columns} onChange={(to) => setRange({ ...r, to })} />
      <NumberField label="block" value={r.block} min={1} max={blocks} onChange={(block) => setRange({ ...r, block })} />
      <button type="button" className="rounded border border-field px-2 hover:bg-sunken" onClick={() => onFill(Math.min(r.from, r.to) - 1, Math.max(r.from, r.to) - 1, r.block)}>
        Fill columns
      </button>
    </div>
  );
}

/** Shows or hides the pattern of one block (presses or lets go one block treadle) over a range of profile rows. */
function FillRows({ rows, choices, what, onFill }: { rows: number; choices: number; what: 'block' | 'treadle'; onFill: (from: number, to: number, block: number, show: boolean) => void }) {
  const [range, setRange] = useState({ from: 1, to: rows, block: 1 });
  const r = { from: clamp(range.from, 1, rows), to: clamp(range.to, 1, rows), block: clamp(range.block, 1, choices) };
  const fill = (show: boolean) => onFill(Math.min(r.from, r.to) - 1, Math.max(r.from, r.to) - 1, r.block, show);
  return (
    <div className="flex flex-wrap items-center gap-1" role="group" aria-label="Fill profile rows">
      <NumberField label="Rows" value={r.from} min={1} max={rows} onChange={(from) => setRange({ ...r, from })} />
      <NumberField label="to" value={r.to} min={1} max={rows} onChange={(to) => setRange({ ...r, to })} />
      <NumberField label={what} value={r.block} min={1} max={choices} onChange={(block) => setRange({ ...r, block })} />
      <button type="button" className="rounded border border-field px-2 hover:bg-sunken" onClick={() => fill(true)}>
        {what === 'block' ? 'Show' : 'Press'}
      </button>
      <button type="button" className="rounded border border-field px-2 hover:bg-sunken" onClick={() => fill(false)}>
        {what === 'block' ? 'Hide' : 'Let go'}
      </button>
    </div>
  );
}

interface OwnColourOrdersProps {
  /** The check box's words. */
  label: string;
  /** What each order is called, before its set ("Block 2 warp"). */
  name: string;
  sets: readonly string[];
  /** The design's own orders, copied when the block is given its own. */
  defaults: readonly number[][];
  /** Per block, its own orders ([] for none); undefined when no block has any. */
  perBlock: readonly number[][][] | undefined;
  count: number;
  /** 1-based. */
  block: number;
  palette: readonly string[];
  yarns: readonly DraftYarn[];
  onChange: (perBlock: number[][][] | undefined) => void;
}

/** One block's own colour orders (warp or weft), switched on and off with a check box. */
function OwnColourOrders({ label, name, sets, defaults, perBlock, count, block, palette, yarns, onChange }: OwnColourOrdersProps) {
  const own = perBlock?.[block - 1] ?? [];
  const setOwn = (orders: number[][]) => {
    const list = Array.from({ length: count }, (_, i) => perBlock?.[i] ?? []);
    list[block - 1] = orders;
    onChange(list.some((o) => o.length > 0) ? list : undefined);
  };
  return (
    <div className="flex flex-col gap-1">
      <label className="flex items-center gap-1">
        <input type="checkbox" checked={own.length > 0} onChange={(e) => setOwn(e.target.checked ? defaults.map((o) => [...o]) : [])} />
        {label}
      </label>
      {own.length > 0 && sets.map((set, i) => <ColourOrder key={i} label={`${name}, ${set}`} palette={palette} yarns={yarns} order={own[i]} onChange={(o) => setOwn(replaced(own, i, o))} />)}
    </div>
  );
}

/** Rows of numbers chosen among `choices` (blocks or treadles), one button per row and choice, pressed when the row holds it. */
function ToggleTable({ label, rows, rowName, choices, cellName, onChange }: { label: string; rows: readonly number[][]; rowName: (row: number) => string; choices: readonly number[]; cellName: (row: number, choice: number) => string; onChange: (rows: number[][]) => void }) {
  return (
    <table className="border-collapse" aria-label={label}>
      <tbody>
        {rows.map((row, r) => (
          <tr key={r}>
            <th scope="row" className="pr-1 text-right font-normal whitespace-nowrap text-muted">
              {rowName(r)}
            </th>
            {choices.map((c) => (
              <td key={c} className="p-0">
                <button
                  type="button"
                  aria-label={cellName(r, c)}
                  aria-pressed={row.includes(c)}
                  onClick={() => onChange(rows.map((x, i) => (i !== r ? x : toggled(x, c))))}
                  className="block size-6 border border-field bg-surface aria-pressed:bg-ink"
                />
              </td>
            ))}
          </tr>
        ))}
      </tbody>
    </table>
  );
}

/** A repeating colour order: one choice per place, with places added and taken away. */
function ColourOrder({ label, palette, yarns, order, onChange }: { label: string; palette: readonly string[]; yarns: readonly DraftYarn[]; order: number[]; onChange: (order: number[]) => void }) {
  return (
    <div className="flex flex-wrap items-center gap-1" role="group" aria-label={`${label}: colour order`}>
      <span className="min-w-24">{label}</span>
      {order.map((c, i) => (
        <span key={i} className="flex items-center">
          <span aria-hidden="true" className="inline-block h-3 w-3 rounded-sm border border-line" style={{ background: palette[c] }} />
          <select aria-label={`${label}, place ${i + 1}`} value={c} onChange={(e) => onChange(replaced(order, i, Number(e.target.value)))} className="min-h-6 max-w-28 rounded border border-field bg-surface px-0.5">
            {palette.map((_, k) => (
              <option key={k} value={k}>
                {colourName({ yarns }, k)}
              </option>
            ))}
          </select>
        </span>
      ))}
      <button type="button" aria-label={`${label}: add a place`} className="min-h-6 min-w-6 rounded border border-field px-1 hover:bg-sunken" onClick={() => onChange([...order, order[order.length - 1] ?? 0])}>
        +
      </button>
      {order.length > 1 && (
        <button type="button" aria-label={`${label}: remove the last place`} className="min-h-6 min-w-6 rounded border border-field px-1 hover:bg-sunken" onClick={() => onChange(order.slice(0, -1))}>
          −
        </button>
      )}
    </div>
  );
}

/** The expanded draft's cloth, live, as one bitmap. */
function ExpandedPreview({ draft }: { draft: Draft }) {
  const bitmap = useMemo(() => new GridBitmap(), []);
  const layer = useRef<Konva.Layer>(null);
  const size = useMemo(() => {
    const dd = computeDrawdown(draft);
    bitmap.paint(dd.ends, dd.picks, (out) => paintCloth(out, renderCloth(draft, dd)));
    return { width: dd.ends, height: dd.picks };
  }, [draft, bitmap]);
  useEffect(() => {
    layer.current?.batchDraw();
  }, [size]);
  const scale = Math.min(8, PREVIEW / Math.max(1, size.width));
  return (
    <div className="overflow-hidden rounded border border-line" data-testid="profile-preview">
      <Stage width={PREVIEW} height={Math.min(PREVIEW, size.height * scale)} listening={false}>
        <Layer ref={layer} listening={false} imageSmoothingEnabled={false}>
          <KonvaImage image={bitmap.canvas} scaleX={scale} scaleY={scale} />
        </Layer>
      </Stage>
    </div>
  );
}
