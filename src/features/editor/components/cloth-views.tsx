import type Konva from 'konva';
import { memo, useLayoutEffect, useMemo, useRef } from 'react';
import { Image as KonvaImage, Layer, Stage } from 'react-konva';
import { GridBitmap } from '../canvas/bitmap';
import type { ViewPicture } from '../canvas/cloth-work';
import { useStore } from '../store/create-store';
import { CLOTH_VIEWS, type ClothView } from '../store/editor';
import { useEditorContext } from './editor-context';

const VIEW_WIDTH = 300;

/** The cloth views the weaver opened, side by side or one at a time, each tiled and scaled to fit. */
export function ClothViews() {
  const { editor, cloth } = useEditorContext();
  const result = useStore(cloth, (s) => s.result);
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
        {shown.map((id) => {
          const picture = result?.pictures[id];
          return picture === undefined ? (
            // The room a square draft's view takes, so the grids above do not jump when it comes.
            <figure key={id} className="flex w-[300px] flex-col gap-1">
              <figcaption className="text-xs font-medium">{CLOTH_VIEWS.find((v) => v.id === id)?.label}</figcaption>
              <p className="grid h-[300px] place-items-center rounded border border-line text-xs text-muted">Working out the view…</p>
            </figure>
          ) : (
            <ViewPanel key={id} id={id} picture={picture} tiles={tiles} overLimit={result?.floatsOverLimit ?? 0} />
          );
        })}
      </div>
    </section>
  );
}

interface ViewPanelProps {
  id: ClothView;
  /** Null when the draft has no layers for this view. */
  picture: ViewPicture | null;
  tiles: number;
  /** Floats over the limit, for the floats view's caption. */
  overLimit: number;
}

/** One cloth view: a picture worked out off the main thread, shown as one bitmap on a small stage. */
const ViewPanel = memo(function ViewPanel({ id, picture, tiles, overLimit }: ViewPanelProps) {
  const bitmap = useMemo(() => new GridBitmap(), []);
  const label = CLOTH_VIEWS.find((v) => v.id === id)?.label ?? id;
  const layerRef = useRef<Konva.Layer>(null);
  // Before the browser paints: the new picture goes in and Konva is told to draw it again.
  useLayoutEffect(() => {
    if (!picture) return;
    bitmap.show(picture.width, picture.height, picture.pixels);
    layerRef.current?.batchDraw();
    performance.mark('cloth-view-painted');
  }, [picture, bitmap]);

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
