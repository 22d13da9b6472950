import { useState } from 'react';
import { colourName } from '../../../../shared/weave';
import { useStore } from '../store/create-store';
import { fillLayers, type LayerFillArgs } from '../store/edits';
import { showsLayerRows } from '../store/grids';
import { useEditorContext } from './editor-context';

const LAYER_CHOICES = [1, 2, 3, 4];

/**
 * Layers: the warp and weft layer rows beside the colour rows, the layer drawing paints, and quick
 * fills (alternate 1-2, by colour, by shaft). Threads of a single-layer draft are all layer 1.
 */
export function LayersPanel({ readOnly = false }: { readOnly?: boolean }) {
  const { editor } = useEditorContext();
  const layerRows = useStore(editor.view, (v) => v.layerRows);
  const paintLayer = useStore(editor.view, (v) => v.layer);
  const shown = useStore(editor.doc, (s) => showsLayerRows(s.draft, layerRows));
  const palette = useStore(editor.doc, (s) => s.draft.palette);
  const yarns = useStore(editor.doc, (s) => s.draft.yarns);
  const shafts = useStore(editor.doc, (s) => s.draft.shafts);
  const [byColour, setByColour] = useState({ colour: 0, layer: 2 });
  const [byShaft, setByShaft] = useState({ low: 1, high: Math.max(1, Math.floor(shafts / 2)), layer: 1 });

  const fill = (args: LayerFillArgs, done: string) => editor.setView({ message: editor.doc.apply(fillLayers, args) ? done : 'The layers were already so.' });
  const ends = () => editor.doc.get().draft.threading.length;
  const picks = () => {
    const d = editor.doc.get().draft;
    return d.control === 'liftplan' ? d.liftplan.length : d.treadling.length;
  };
  const select = 'rounded border border-field bg-surface px-1';
  const button = 'rounded border border-field px-2 hover:bg-sunken';

  return (
    <section aria-labelledby="layers-heading" className="flex flex-col gap-2 text-xs">
      <h2 id="layers-heading" className="text-sm font-semibold">
        Layers
      </h2>
      <label className="flex items-center gap-1">
        <input type="checkbox" checked={shown} disabled={shown && !layerRows} onChange={(e) => editor.setView({ layerRows: e.target.checked })} />
        Show the layer rows beside the colour orders{shown && !layerRows ? ' (this draft has layers)' : ''}
      </label>
      {!readOnly && (
        <>
          <label className="flex items-center gap-1">
            Drawing in a layer row paints layer
            <LayerSelect label="Layer to paint" value={paintLayer} onChange={(v) => editor.setView({ layer: v, layerRows: true })} />
          </label>
          <div className="flex flex-wrap items-center gap-1" role="group" aria-label="Alternate layers">
            <button type="button" className={button} onClick={() => fill({ axis: 'ends', by: { kind: 'alternate', from: 0, to: ends() - 1 } }, 'Ends alternate layers 1 and 2.')}>
              Ends alternate 1-2
            </button>
            <button type="button" className={button} onClick={() => fill({ axis: 'picks', by: { kind: 'alternate', from: 0, to: picks() - 1 } }, 'Picks alternate layers 1 and 2.')}>
              Picks alternate 1-2
            </button>
          </div>
          <div className="flex flex-wrap items-center gap-1" role="group" aria-label="Layers by colour">
            Every thread of
            <select aria-label="Colour" value={byColour.colour} onChange={(e) => setByColour({ ...byColour, colour: Number(e.target.value) })} className={select}>
              {palette.map((_, i) => (
                <option key={i} value={i}>
                  {colourName({ yarns }, i)}
                </option>
              ))}
            </select>
            is layer
            <LayerSelect label="Layer for that colour" value={byColour.layer} onChange={(v) => setByColour({ ...byColour, layer: v })} />
            <button type="button" className={button} onClick={() => fill({ axis: 'ends', by: { kind: 'colour', ...byColour } }, `Every end of ${colourName({ yarns }, byColour.colour)} is layer ${byColour.layer}.`)}>
              Ends
            </button>
            <button type="button" className={button} onClick={() => fill({ axis: 'picks', by: { kind: 'colour', ...byColour } }, `Every pick of ${colourName({ yarns }, byColour.colour)} is layer ${byColour.layer}.`)}>
              Picks
            </button>
          </div>
          <div className="flex flex-wrap items-center gap-1" role="group" aria-label="Layers by shaft">
            Ends on shafts
            <input aria-label="From shaft" type="number" min={1} max={shafts} value={byShaft.low} onChange={(e) => setByShaft({ ...byShaft, low: Number(e.target.value) || 1 })} className={`${select} w-12`} />
            to
            <input aria-label="To shaft" type="number" min={1} max={shafts} value={byShaft.high} onChange={(e) => setByShaft({ ...byShaft, high: Number(e.target.value) || 1 })} className={`${select} w-12`} />
            are layer
            <LayerSelect label="Layer for those shafts" value={byShaft.layer} onChange={(v) => setByShaft({ ...byShaft, layer: v })} />
            <button
              type="button"
              className={button}
              onClick={() => {
                const low = Math.min(byShaft.low, byShaft.high);
                const high = Math.max(byShaft.low, byShaft.high);
                fill({ axis: 'ends', by: { kind: 'shaft', low, high, layer: byShaft.layer } }, `Ends on shafts ${low}–${high} are layer ${byShaft.layer}.`);
              }}
            >
              Set
            </button>
          </div>
        </>
      )}
    </section>
  );
}

function LayerSelect({ label, value, onChange }: { label: string; value: number; onChange: (layer: number) => void }) {
  return (
    <select aria-label={label} value={value} onChange={(e) => onChange(Number(e.target.value))} className="rounded border border-field bg-surface px-1">
      {LAYER_CHOICES.map((l) => (
        <option key={l} value={l}>
          {l}
        </option>
      ))}
    </select>
  );
}
