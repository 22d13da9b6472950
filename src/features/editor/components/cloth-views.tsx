import type Konva from 'konva';
import { memo, useEffect, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { Image as KonvaImage, Layer, Stage } from 'react-konva';
import type { LengthUnit } from '../../../../shared/weave';
import { GridBitmap } from '../canvas/bitmap';
import { MAX_ZOOM, type ViewFrame, type ViewPicture } from '../canvas/cloth-work';
import { layerLook, type LayerPattern } from '../canvas/paint';
import type { ClothResults } from '../store/cloth-results';
import { useStore } from '../store/create-store';
import { CLOTH_VIEWS, type ClothView } from '../store/editor';
import { ClothRuler, RULER_SIZE } from './cloth-ruler';
import { useEditorContext } from './editor-context';

/** A view's size on the page, in CSS pixels. */
const VIEW_SIZE = 300;
/** Each step of zooming in or out. */
const ZOOM_STEP = 1.25;
/** How far an arrow key moves the cloth, in CSS pixels. */
const KEY_PAN = 40;
/** CSS defines its inch as 96 CSS pixels; the browser maps it to the screen. */
const CSS_PIXELS_PER_INCH = 96;

const THREAD_VIEWS: readonly ClothView[] = ['colour', 'front', 'back'];

const devicePixels = () => (typeof window === 'undefined' ? 1 : window.devicePixelRatio || 1);

/** A view shown whole. */
function fitFrame(): ViewFrame {
  const size = Math.round(VIEW_SIZE * devicePixels());
  return { zoom: 'fit', x: 0, y: 0, width: size, height: size };
}

/** The cloth views the weaver opened, side by side or one at a time, each with its own zoom. */
export function ClothViews() {
  const { editor, cloth } = useEditorContext();
  const result = useStore(cloth, (s) => s.result);
  const panels = useStore(editor.view, (v) => v.panels);
  const oneAtATime = useStore(editor.view, (v) => v.oneAtATime);
  const floatLimit = useStore(editor.view, (v) => v.floatLimit);
  const tiles = useStore(editor.view, (v) => v.tile);
  const shown = oneAtATime ? panels.slice(0, 1) : panels;

  // Every view shown has a frame before its first request goes out (effects run child first).
  useEffect(() => {
    const missing = shown.filter((id) => !cloth.frames.get()[id]);
    if (missing.length) cloth.frames.set((f) => ({ ...f, ...Object.fromEntries(missing.map((id) => [id, fitFrame()])) }));
  }, [shown, cloth]);

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
            // The room a view takes, so the grids above do not jump when it comes.
            <figure key={id} className="flex w-[300px] flex-col gap-1">
              <figcaption className="text-xs font-medium">{CLOTH_VIEWS.find((v) => v.id === id)?.label}</figcaption>
              <p className="grid h-[300px] place-items-center rounded border border-line text-xs text-muted">Working out the view…</p>
            </figure>
          ) : (
            <ViewPanel key={id} id={id} picture={picture} cloth={cloth} overLimit={result?.floatsOverLimit ?? 0} />
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
  cloth: ClothResults;
  /** Floats over the limit, for the floats view's caption. */
  overLimit: number;
}

/** Where the yarn sizes of a thread view came from, in a few words. */
function sizesNote(threads: NonNullable<ViewPicture['threads']>): string {
  const from = (s: string) => (s === 'plan' ? 'the plan' : s === 'yarn names' ? 'the yarn names' : null);
  const warp = from(threads.warpSource);
  const weft = from(threads.weftSource);
  const yarns = warp || weft ? `yarn sizes from ${warp === weft ? warp : [warp && `${warp} (warp)`, weft && `${weft} (weft)`].filter(Boolean).join(' and ')}` : 'no yarn sizes known: threads drawn at 4/5 of their spacing';
  const n = (v: number) => String(Math.round(v * 10) / 10);
  return `${n(threads.endsPerInch)} ends × ${n(threads.picksPerInch)} picks per inch; ${yarns}`;
}

/**
 * One cloth view: the window of its picture worked out off the main thread for the panel's zoom,
 * shown as one bitmap. Drag, the arrow keys or the wheel move the cloth; Ctrl + wheel, + and −
 * zoom; 0 fits the whole; 1 shows the cloth at its actual size, with a ruler.
 */
const ViewPanel = memo(function ViewPanel({ id, picture, cloth, overLimit }: ViewPanelProps) {
  const { editor } = useEditorContext();
  const bitmap = useMemo(() => new GridBitmap(), []);
  const label = CLOTH_VIEWS.find((v) => v.id === id)?.label ?? id;
  const layerRef = useRef<Konva.Layer>(null);
  const hostRef = useRef<HTMLDivElement>(null);
  const frame = useStore(cloth.frames, (f) => f[id]);
  const draftUnit = useStore(editor.doc, (s) => s.draft.sett.unit);
  const [unit, setUnit] = useState<LengthUnit | null>(null);
  const rulerUnit = unit ?? draftUnit;
  const dpr = devicePixels();
  const threadView = THREAD_VIEWS.includes(id);

  // Before the browser paints: the new picture goes in and Konva is told to draw it again.
  useLayoutEffect(() => {
    if (!picture) return;
    if (!picture.bitmap) bitmap.show(picture.width, picture.height, picture.pixels);
    layerRef.current?.batchDraw();
    performance.mark('cloth-view-painted');
  }, [picture, bitmap]);

  const setFrame = (next: ViewFrame) => cloth.frames.set((f) => ({ ...f, [id]: next }));
  const current = (): ViewFrame => cloth.frames.get()[id] ?? fitFrame();
  /** The frame's zoom as a number: the picture's when the worker chose it (fit, actual size). */
  const zoomOf = (f: ViewFrame) => (typeof f.zoom === 'number' ? f.zoom : (picture?.zoom ?? 1));
  /** Keeps the window within the picture at a zoom. */
  const clamp = (f: ViewFrame, zoom: number): ViewFrame => {
    if (!picture) return f;
    const wholeW = (picture.wholeWidth * zoom) / picture.zoom;
    const wholeH = (picture.wholeHeight * zoom) / picture.zoom;
    return { ...f, x: Math.max(0, Math.min(f.x, wholeW - f.width)), y: Math.max(0, Math.min(f.y, wholeH - f.height)) };
  };
  const pan = (dx: number, dy: number) => {
    const f = current();
    setFrame(clamp({ ...f, zoom: zoomOf(f), x: f.x - dx * dpr, y: f.y - dy * dpr }, zoomOf(f)));
  };
  /** Zooms by `factor` keeping the cloth under (cx, cy) (CSS pixels in the view) where it is. */
  const zoomBy = (factor: number, cx = VIEW_SIZE / 2, cy = VIEW_SIZE / 2) => {
    const f = current();
    const z = zoomOf(f);
    const fit = picture ? (picture.zoom * Math.min(f.width / picture.wholeWidth, f.height / picture.wholeHeight)) : z;
    const next = Math.min(MAX_ZOOM, Math.max(Math.min(fit, z), z * factor));
    const ax = (f.x + cx * dpr) / z;
    const ay = (f.y + cy * dpr) / z;
    setFrame(clamp({ ...f, zoom: next, x: ax * next - cx * dpr, y: ay * next - cy * dpr }, next));
  };
  const fit = () => setFrame(fitFrame());
  const actual = () => setFrame({ ...current(), zoom: 'actual', screenPixelsPerInch: CSS_PIXELS_PER_INCH * dpr });

  // Wheel: its own listener, so the page does not scroll under the view.
  const wheel = useRef<(e: WheelEvent) => void>(() => {});
  useLayoutEffect(() => {
    wheel.current = (e) => {
      e.preventDefault();
      const r = hostRef.current!.getBoundingClientRect();
      if (e.ctrlKey || e.metaKey) zoomBy(e.deltaY < 0 ? ZOOM_STEP : 1 / ZOOM_STEP, e.clientX - r.left, e.clientY - r.top);
      else pan(-(e.shiftKey ? e.deltaY : e.deltaX), -(e.shiftKey ? 0 : e.deltaY));
    };
  });
  const shown = picture !== null;
  useEffect(() => {
    const host = hostRef.current;
    if (!host) return;
    const listener = (e: WheelEvent) => wheel.current(e);
    host.addEventListener('wheel', listener, { passive: false });
    return () => host.removeEventListener('wheel', listener);
  }, [shown]);

  const drag = useRef<{ x: number; y: number } | null>(null);
  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    if (e.button !== 0) return;
    drag.current = { x: e.clientX, y: e.clientY };
    e.currentTarget.setPointerCapture?.(e.pointerId);
  };
  const onPointerMove = (e: PointerEvent<HTMLDivElement>) => {
    if (!drag.current) return;
    pan(e.clientX - drag.current.x, e.clientY - drag.current.y);
    drag.current = { x: e.clientX, y: e.clientY };
  };
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const keys: Record<string, () => void> = {
      ArrowLeft: () => pan(KEY_PAN, 0),
      ArrowRight: () => pan(-KEY_PAN, 0),
      ArrowUp: () => pan(0, KEY_PAN),
      ArrowDown: () => pan(0, -KEY_PAN),
      '+': () => zoomBy(ZOOM_STEP),
      '=': () => zoomBy(ZOOM_STEP),
      '-': () => zoomBy(1 / ZOOM_STEP),
      '0': fit,
      ...(threadView ? { '1': actual } : {}),
    };
    const run = keys[e.key];
    if (!run) return;
    e.preventDefault();
    run();
  };

  if (!picture) {
    return (
      <figure className="w-[300px] rounded border border-line bg-surface p-2 text-xs text-muted">
        <figcaption className="font-medium text-ink">{label}</figcaption>
        <p>This draft has one layer. Give ends and picks layers (or expand a double-weave profile) to see both faces.</p>
      </figure>
    );
  }

  // Until the picture for a new zoom or place comes, the one there is moved and scaled to match.
  const f = frame ?? fitFrame();
  const scale = typeof f.zoom === 'number' ? f.zoom / picture.zoom : 1;
  const offsetX = (picture.x * scale - (typeof f.zoom === 'number' ? f.x : picture.x)) / dpr;
  const offsetY = (picture.y * scale - (typeof f.zoom === 'number' ? f.y : picture.y)) / dpr;
  const width = Math.min(VIEW_SIZE, Math.ceil((picture.wholeWidth * scale) / dpr));
  const height = Math.min(VIEW_SIZE, Math.ceil((picture.wholeHeight * scale) / dpr));
  const inches = picture.pixelsPerInch !== null ? (picture.pixelsPerInch * scale) / dpr : null;
  const isActual = f.zoom === 'actual';
  const button = 'rounded border border-field px-1.5 text-xs aria-pressed:bg-accent aria-pressed:text-white';
  return (
    <figure className="flex w-[300px] flex-col gap-1" data-testid={`view-${id}`} data-zoom={picture.zoom}>
      <figcaption className="text-xs font-medium">
        {label}
        {id === 'floats' && (
          <span className="ml-2 font-normal text-muted">
            {overLimit === 0 ? 'no floats over the limit' : `${overLimit} float${overLimit === 1 ? '' : 's'} over the limit (hatched)`}
          </span>
        )}
      </figcaption>
      <div role="group" aria-label={`${label} zoom`} className="flex flex-wrap items-center gap-1">
        <button type="button" className={button} aria-label="Zoom out" onClick={() => zoomBy(1 / ZOOM_STEP)}>
          −
        </button>
        <button type="button" className={button} aria-label="Zoom in" onClick={() => zoomBy(ZOOM_STEP)}>
          +
        </button>
        <button type="button" className={button} aria-pressed={f.zoom === 'fit'} onClick={fit}>
          Whole
        </button>
        {threadView && (
          <>
            <button type="button" className={button} aria-pressed={isActual} onClick={actual}>
              Actual size
            </button>
            <button type="button" className={button} aria-label={`Ruler in ${rulerUnit === 'inch' ? 'inches' : 'centimetres'}: change`} onClick={() => setUnit(rulerUnit === 'inch' ? 'cm' : 'inch')}>
              {rulerUnit === 'inch' ? 'in' : 'cm'}
            </button>
          </>
        )}
      </div>
      <div className="grid w-fit overflow-hidden rounded border border-line" style={{ gridTemplateColumns: inches ? `${RULER_SIZE}px auto` : 'auto' }}>
        {inches && (
          <>
            <span className="bg-surface" />
            <ClothRuler direction="across" length={width} offset={(f.x + 0) / dpr} pixelsPerInch={inches} unit={rulerUnit} />
            <ClothRuler direction="down" length={height} offset={f.y / dpr} pixelsPerInch={inches} unit={rulerUnit} />
          </>
        )}
        <div
          ref={hostRef}
          tabIndex={0}
          role="img"
          aria-roledescription="cloth view"
          aria-label={`${label}: drag or use the arrow keys to move, + and − to zoom, 0 for the whole${threadView ? ', 1 for actual size' : ''}.`}
          className="cursor-grab touch-none outline-none focus-visible:ring-2 focus-visible:ring-accent"
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={() => (drag.current = null)}
          onPointerCancel={() => (drag.current = null)}
          onKeyDown={onKeyDown}
        >
          <Stage width={width} height={height} listening={false}>
            <Layer ref={layerRef} listening={false} imageSmoothingEnabled={scale < 1}>
              <KonvaImage image={picture.bitmap ?? bitmap.canvas} x={offsetX} y={offsetY} scaleX={scale / dpr} scaleY={scale / dpr} />
            </Layer>
          </Stage>
        </div>
      </div>
      {picture.threads && <p className="text-xs text-muted">{sizesNote(picture.threads)}</p>}
      {id === 'layers' && <LayerLegend />}
    </figure>
  );
});

/** CSS for a layer pattern in the key, drawn like the picture's stripes. */
const PATTERN_ANGLE: Record<LayerPattern, number | null> = { plain: null, diagonal: 135, across: 0, upright: 90 };
const PATTERN_WORDS: Record<LayerPattern, string> = { plain: 'plain', diagonal: 'diagonal stripes', across: 'stripes across', upright: 'upright stripes' };

/** The layer map's key: each layer's number beside its tone and pattern, so colour is never the only sign. */
function LayerLegend() {
  const { editor } = useEditorContext();
  const warp = useStore(editor.doc, (s) => s.draft.warpLayers);
  const weft = useStore(editor.doc, (s) => s.draft.weftLayers);
  const layers = useMemo(() => [...new Set([1, ...warp, ...weft])].sort((a, b) => a - b), [warp, weft]);
  return (
    <ul aria-label="Layer map key" className="flex flex-wrap gap-3 text-xs" data-testid="layer-legend">
      {layers.map((n) => {
        const look = layerLook(n);
        const angle = PATTERN_ANGLE[look.pattern];
        return (
          <li key={n} className="flex items-center gap-1">
            <span
              aria-hidden
              className="inline-block h-3.5 w-3.5 rounded-sm border border-field"
              style={{
                backgroundColor: look.tone,
                backgroundImage: angle === null ? undefined : `repeating-linear-gradient(${angle}deg, ${look.mark} 0 1.5px, transparent 1.5px 5px)`,
              }}
            />
            <span>
              Layer {n} on top ({PATTERN_WORDS[look.pattern]})
            </span>
          </li>
        );
      })}
    </ul>
  );
}
