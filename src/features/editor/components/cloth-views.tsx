import type Konva from 'konva';
import { memo, useEffect, useMemo, useRef } from 'react';
import { Image as KonvaImage, Layer, Stage } from 'react-konva';
import { isLayered, type Draft } from '../../../../shared/weave';
import { GridBitmap } from '../canvas/bitmap';
import type { Derived } from '../canvas/derived';
import { paintCloth, paintFace, paintFloats, paintLayerMap, paintStructure, tile } from '../canvas/paint';
import { useStore } from '../store/create-store';
import { CLOTH_VIEWS, type ClothView } from '../store/editor';
import { useEditorContext } from './editor-context';
import { useSettledDraft } from './use-settled-draft';

const VIEW_WIDTH = 300;
/** Cells a tiled view may hold; past this, fewer repeats are shown (the view is 300 px wide anyway). */
const MAX_TILED_CELLS = 1_500_000;

/** One repeat of a view as pixels (a cell each), or null when the draft has no layers to show. */
function paintView(view: ClothView, draft: Draft, derived: Derived, floatLimit: number): { width: number; height: number; fill: (out: Uint32Array) => void } | null {
  const dd = derived.drawdown(draft);
  const size = { width: dd.ends, height: dd.picks };
  switch (view) {
    case 'structure':
      return { ...size, fill: (out) => paintStructure(out, dd) };
    case 'colour':
      return { ...size, fill: (out) => paintCloth(out, derived.cloth(draft)) };
    case 'floats':
      return { ...size, fill: (out) => paintFloats(out, dd, derived.floats(draft, floatLimit).overLimit) };
    case 'front':
    case 'back':
    case 'layers': {
      if (!isLayered(draft)) return null;
      const sim = derived.layers(draft);
      if (view === 'layers') return { ...size, fill: (out) => paintLayerMap(out, sim.top, dd.ends) };
      const face = view === 'front' ? sim.front : sim.back;
      return { width: face.width, height: face.height, fill: (out) => paintFace(out, face, draft.palette) };
    }
  }
}

/** The cloth views the weaver opened, side by side or one at a time, each tiled and scaled to fit. */
export function ClothViews() {
  const { editor, derived } = useEditorContext();
  const draft = useSettledDraft();
  const panels = useStore(editor.view, (v) => v.panels);
  const oneAtATime = useStore(editor.view, (v) => v.oneAtATime);
  const floatLimit = useStore(editor.view, (v) => v.floatLimit);
  const tiles = useStore(editor.view, (v) => v.tile);
  const shown = oneAtATime ? panels.slice(0, 1) : panels;

  const toggle = (id: ClothView) => {
    const open = panels.includes(id);
    editor.setView({ panels: oneAtATime ? [id] : open ? panels.filter((p) => p !== id) : [...panels, id] });
  };

  return (
    <section aria-labelledby="cloth-views-heading" className="flex flex-col gap-2">
      <h2 id="cloth-views-heading" className="text-sm font-semibold">
        Cloth views
      </h2>
      <div role="group" aria-label="Views to show" className="flex flex-wrap gap-1">
        {CLOTH_VIEWS.map((v) => (
          <button
            key={v.id}
            type="button"
            aria-pressed={panels.includes(v.id)}
            onClick={() => toggle(v.id)}
            className="rounded border border-field px-2 py-1 text-xs aria-pressed:bg-accent aria-pressed:text-white"
          >
            {v.label}
          </button>
        ))}
      </div>
      <div className="flex flex-wrap items-center gap-3 text-xs">
        <label className="flex items-center gap-1">
          <input type="checkbox" checked={oneAtATime} onChange={(e) => editor.setView({ oneAtATime: e.target.checked, panels: panels.slice(0, 1) })} />
          One at a time
        </label>
        <label className="flex items-center gap-1">
          Repeats shown
          <select value={tiles} onChange={(e) => editor.setView({ tile: Number(e.target.value) })} className="rounded border border-field bg-surface px-1">
            {[1, 2, 3, 4].map((n) => (
              <option key={n} value={n}>
                {n} × {n}
              </option>
            ))}
          </select>
        </label>
        <label className="flex items-center gap-1">
          Longest float
          <input
            type="number"
            min={1}
            max={99}
            value={floatLimit}
            onChange={(e) => editor.setView({ floatLimit: Math.max(1, Number(e.target.value) || 1) })}
            className="w-14 rounded border border-field bg-surface px-1"
          />
        </label>
      </div>
      <div className="flex flex-wrap gap-3">
        {draft ? shown.map((id) => <ViewPanel key={id} id={id} draft={draft} derived={derived} floatLimit={floatLimit} tiles={tiles} />) : <p className="text-xs text-muted">Working out the views…</p>}
      </div>
    </section>
  );
}

interface ViewPanelProps {
  id: ClothView;
  draft: Draft;
  derived: Derived;
  floatLimit: number;
  tiles: number;
}

/** One cloth view: a single bitmap on a small stage, repainted when what it draws changes. */
const ViewPanel = memo(function ViewPanel({ id, draft, derived, floatLimit, tiles }: ViewPanelProps) {
  const bitmap = useMemo(() => new GridBitmap(), []);
  const label = CLOTH_VIEWS.find((v) => v.id === id)?.label ?? id;
  const picture = useMemo(() => {
    const view = paintView(id, draft, derived, floatLimit);
    if (!view || view.width === 0 || view.height === 0) return null;
    const n = Math.max(1, Math.min(tiles, Math.floor(Math.sqrt(MAX_TILED_CELLS / (view.width * view.height)))));
    const one = new Uint32Array(view.width * view.height);
    view.fill(one);
    bitmap.paint(view.width * n, view.height * n, (out) => tile(out, one, view.width, view.height, n, n));
    return { width: view.width * n, height: view.height * n, repeats: n };
  }, [id, draft, derived, floatLimit, tiles, bitmap]);
  const layerRef = useRef<Konva.Layer>(null);
  // The bitmap is repainted in place, so Konva is told to draw it again.
  useEffect(() => {
    layerRef.current?.batchDraw();
  }, [picture]);
  const overLimit = id === 'floats' ? derived.floats(draft, floatLimit).overLimit.length : 0;

  if (!picture) {
    return (
      <figure className="w-[300px] rounded border border-line bg-surface p-2 text-xs text-muted">
        <figcaption className="font-medium text-ink">{label}</figcaption>
        <p>This draft has one layer. Give ends and picks layers (or expand a double-weave profile) to see both faces.</p>
      </figure>
    );
  }
  const scale = Math.min(8, VIEW_WIDTH / picture.width);
  const height = Math.min(360, picture.height * scale);
  return (
    <figure className="flex w-[300px] flex-col gap-1" data-testid={`view-${id}`}>
      <figcaption className="text-xs font-medium">
        {label}
        {picture.repeats < tiles && <span className="ml-2 font-normal text-muted">({picture.repeats} × {picture.repeats}: the draft is large)</span>}
        {id === 'floats' && (
          <span className="ml-2 font-normal text-muted">
            {overLimit === 0 ? 'no floats over the limit' : `${overLimit} float${overLimit === 1 ? '' : 's'} over the limit (hatched)`}
          </span>
        )}
      </figcaption>
      <div className="overflow-hidden rounded border border-line">
        <Stage width={VIEW_WIDTH} height={height} listening={false}>
          {/* Shrunk, the cloth is averaged as the eye sees it from a distance, so no thread drops out; enlarged, cells stay crisp. */}
          <Layer ref={layerRef} listening={false} imageSmoothingEnabled={scale < 1}>
            <KonvaImage image={bitmap.canvas} scaleX={scale} scaleY={scale} />
          </Layer>
        </Stage>
      </div>
    </figure>
  );
});
