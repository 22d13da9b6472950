import type Konva from 'konva';
import { useEffect, useMemo, useRef, useState } from 'react';
import { Image as KonvaImage, Layer, Stage } from 'react-konva';
import { computeDrawdown, expandProfile, maxBlocks, PROFILE_UNITS, profileUnit, renderCloth, type Draft, type Profile, type ProfileUnitId } from '../../../../shared/weave';
import { GridBitmap } from '../canvas/bitmap';
import { paintCloth } from '../canvas/paint';
import { useStore } from '../store/create-store';
import { replaceDraft } from '../store/edits';
import { useEditorContext } from './editor-context';

const PREVIEW = 260;

interface BlockDesign {
  unit: ProfileUnitId;
  blocks: number;
  /** Block per profile column. */
  threading: number[];
  /** Blocks showing the pattern, per profile row. */
  treadling: number[][];
  /** Palette index per warp set and per weft set of the unit. */
  warpColors: number[];
  weftColors: number[];
}

const START: BlockDesign = {
  unit: 'double-weave',
  blocks: 2,
  threading: [1, 1, 2, 2, 1, 1, 2, 2],
  treadling: [[1], [1], [2], [2], [1], [1], [2], [2]],
  warpColors: [0, 1],
  weftColors: [0, 1],
};

/** Block design: a profile (block threading and treadling) expanded live with a unit from the engine. */
export function ProfilePanel() {
  const { editor } = useEditorContext();
  const palette = useStore(editor.doc, (s) => s.draft.palette);
  const [design, setDesign] = useState<BlockDesign>(START);
  const unit = profileUnit(design.unit);
  const most = Math.min(8, maxBlocks(unit));

  const expanded = useMemo((): { draft: Draft } | { error: string } => {
    const setColour = (list: number[], sets: number) => Array.from({ length: sets }, (_, i) => [Math.min(list[i] ?? 0, palette.length - 1)]);
    const profile: Profile = {
      threading: design.threading,
      treadling: design.treadling,
      palette,
      warpColors: setColour(design.warpColors, unit.warpSets.length),
      weftColors: setColour(design.weftColors, unit.weftSets.length),
    };
    try {
      return { draft: expandProfile(profile, design.unit) };
    } catch (e) {
      return { error: e instanceof Error ? e.message : String(e) };
    }
  }, [design, palette, unit]);

  const update = (patch: Partial<BlockDesign>) => setDesign((d) => ({ ...d, ...patch }));
  const cols = design.threading.length;
  const blockRows = Array.from({ length: design.blocks }, (_, b) => design.blocks - b);

  return (
    <section aria-labelledby="profile-heading" className="flex flex-col gap-2 text-xs">
      <h2 id="profile-heading" className="text-sm font-semibold">
        Block design
      </h2>
      <div className="flex flex-wrap items-center gap-2">
        <label className="flex items-center gap-1">
          Unit
          <select value={design.unit} onChange={(e) => update({ unit: e.target.value as ProfileUnitId, blocks: Math.min(design.blocks, maxBlocks(profileUnit(e.target.value as ProfileUnitId))) })} className="rounded border border-field bg-surface px-1">
            {PROFILE_UNITS.map((u) => (
              <option key={u.id} value={u.id}>
                {u.name}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-1">
          Blocks
          <input type="number" min={1} max={most} value={design.blocks} onChange={(e) => {
              const n = Math.max(1, Math.min(most, Number(e.target.value) || 1));
              update({ blocks: n, threading: design.threading.map((b) => Math.min(b, n)), treadling: design.treadling.map((row) => row.filter((b) => b <= n)) });
            }} className="w-12 rounded border border-field bg-surface px-1" />
        </label>
        <label className="flex items-center gap-1">
          Profile columns
          <input
            type="number"
            min={1}
            max={48}
            value={cols}
            onChange={(e) => {
              const n = Math.max(1, Math.min(48, Number(e.target.value) || 1));
              update({ threading: Array.from({ length: n }, (_, i) => design.threading[i] ?? 1), treadling: Array.from({ length: n }, (_, i) => design.treadling[i] ?? []) });
            }}
            className="w-12 rounded border border-field bg-surface px-1"
          />
        </label>
      </div>
      <p className="text-muted">{unit.description}</p>
      <table className="border-collapse" aria-label="Profile threading: the block of each column">
        <tbody>
          {blockRows.map((b) => (
            <tr key={b}>
              <th scope="row" className="pr-1 text-right font-normal text-muted">
                Block {b}
              </th>
              {design.threading.map((block, c) => (
                <td key={c} className="p-0">
                  <button
                    type="button"
                    aria-label={`Column ${c + 1}, block ${b}`}
                    aria-pressed={block === b}
                    onClick={() => update({ threading: design.threading.map((x, i) => (i === c ? b : x)) })}
                    className="block h-4 w-4 border border-line bg-surface aria-pressed:bg-ink"
                  />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <table className="border-collapse" aria-label="Profile treadling: the blocks showing the pattern in each row">
        <tbody>
          {design.treadling.map((row, r) => (
            <tr key={r}>
              <th scope="row" className="pr-1 text-right font-normal text-muted">
                Row {r + 1}
              </th>
              {Array.from({ length: design.blocks }, (_, b) => b + 1).map((b) => (
                <td key={b} className="p-0">
                  <button
                    type="button"
                    aria-label={`Row ${r + 1}, block ${b} shows the pattern`}
                    aria-pressed={row.includes(b)}
                    onClick={() =>
                      update({ treadling: design.treadling.map((x, i) => (i !== r ? x : x.includes(b) ? x.filter((v) => v !== b) : [...x, b].sort((p, q) => p - q))) })
                    }
                    className="block h-4 w-4 border border-line bg-surface aria-pressed:bg-ink"
                  />
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
      <div className="flex flex-wrap gap-2">
        {unit.warpSets.map((set, i) => (
          <ColourChoice key={`w${i}`} label={`Warp, ${set}`} palette={palette} value={design.warpColors[i] ?? 0} onChange={(v) => update({ warpColors: Object.assign([...design.warpColors], { [i]: v }) })} />
        ))}
        {unit.weftSets.map((set, i) => (
          <ColourChoice key={`f${i}`} label={`Weft, ${set}`} palette={palette} value={design.weftColors[i] ?? 0} onChange={(v) => update({ weftColors: Object.assign([...design.weftColors], { [i]: v }) })} />
        ))}
      </div>
      {'error' in expanded ? (
        <p role="alert" className="flex gap-1 font-medium text-danger">
          <span aria-hidden="true">⚠</span>
          {expanded.error}
        </p>
      ) : (
        <>
          <ExpandedPreview draft={expanded.draft} />
          <p className="text-muted">
            {expanded.draft.threading.length} ends, {expanded.draft.liftplan.length || expanded.draft.treadling.length} picks on {expanded.draft.shafts} shafts.
          </p>
          <button type="button" className="self-start rounded-md bg-accent px-3 py-1.5 font-medium text-white hover:bg-accent-strong" onClick={() => editor.doc.apply(replaceDraft, { draft: { ...expanded.draft, name: editor.doc.get().draft.name } })}>
            Use as the draft
          </button>
        </>
      )}
    </section>
  );
}

function ColourChoice({ label, palette, value, onChange }: { label: string; palette: readonly string[]; value: number; onChange: (v: number) => void }) {
  return (
    <label className="flex items-center gap-1">
      {label}
      <select value={value} onChange={(e) => onChange(Number(e.target.value))} className="rounded border border-field bg-surface px-1">
        {palette.map((hex, i) => (
          <option key={i} value={i}>
            Colour {i + 1} ({hex})
          </option>
        ))}
      </select>
    </label>
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
