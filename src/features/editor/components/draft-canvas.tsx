import type Konva from 'konva';
import { memo, useEffect, useLayoutEffect, useMemo, useRef, useState, type KeyboardEvent, type PointerEvent } from 'react';
import { Group, Image as KonvaImage, Layer, Rect, Shape, Stage } from 'react-konva';
import type { Draft } from '../../../../shared/weave';
import { changedRects, type StageRect } from '../canvas/damage';
import { DraftPainter } from '../canvas/draft-painter';
import { cellAt, cellPosition, columnX, computeLayout, regionOf, type Layout, type Region } from '../canvas/layout';
import { useStore } from '../store/create-store';
import type { Editor, GridCell, ViewState } from '../store/editor';
import type { RegionId } from '../canvas/layout';
import { showsLayerRows } from '../store/grids';
import { handleKey } from '../store/commands';
import { scrolledBy, wheelPixels, zoomedAbout, zoomedCell } from '../canvas/wheel';
import { useEditorContext } from './editor-context';
import { THEME, withAlpha } from '@/lib/theme';

const LINE = THEME.line;
const LINE_STRONG = THEME.field;
const ACCENT = THEME.accent;
const DANGER = THEME.danger;
const MUTED = THEME.muted;
const SELECTED = withAlpha(THEME.accent, 0.18);

/** The draft's size as one string, so the layout (and React) changes only when a count changes. */
const sizeKey = (d: Draft) =>
  `${d.threading.length}|${d.control === 'liftplan' ? d.liftplan.length : d.treadling.length}|${d.shafts}|${d.treadles}|${d.control}`;

/**
 * The draft's grids on one Konva stage: every grid is one bitmap on a non-listening layer,
 * grid lines and rulers one shape drawing only what is in view, and cursor, selection and
 * highlight on a small second layer. Edits repaint at most once per animation frame.
 */
export function DraftCanvas({ readOnly = false }: { readOnly?: boolean }) {
  const { editor, derived } = useEditorContext();
  const { doc, view } = editor;
  const hostRef = useRef<HTMLDivElement>(null);
  const staticLayer = useRef<Konva.Layer>(null);
  const [size, setSize] = useState({ width: 900, height: 560 });
  const painter = useMemo(() => new DraftPainter(derived), [derived]);
  const [bitmapSizes, setBitmapSizes] = useState('');

  // Paint once before the first render so the images exist when Konva first draws them.
  useState(() => {
    const v = view.get();
    painter.paint(doc.get().draft, { shaftsFromTop: v.arrangement.shaftsFromTop, drawdownView: v.drawdownView });
  });

  const sizes = useStore(doc, (s) => sizeKey(s.draft));
  const cell = useStore(view, (v) => v.cell);
  const arrangement = useStore(view, (v) => v.arrangement);
  const scrollX = useStore(view, (v) => v.scrollX);
  const scrollY = useStore(view, (v) => v.scrollY);
  const rulerStep = useStore(view, (v) => v.rulerStep);
  const layerRows = useStore(view, (v) => v.layerRows);
  const layered = useStore(doc, (s) => showsLayerRows(s.draft, false));

  const layout = useMemo(() => {
    void sizes;
    return computeLayout(doc.get().draft, arrangement, cell, size.width, size.height, layerRows || layered);
  }, [doc, sizes, arrangement, cell, size.width, size.height, layerRows, layered]);
  // What the static layer's nodes were last drawn with, for redrawing part of it between renders.
  const drawn = useRef({ layout, scrollX, scrollY });
  useLayoutEffect(() => {
    drawn.current = { layout, scrollX, scrollY };
  }, [layout, scrollX, scrollY]);

  // Keep scroll within the new bounds after zoom or size changes.
  useEffect(() => {
    const v = view.get();
    const x = Math.min(v.scrollX, layout.maxScrollX);
    const y = Math.min(v.scrollY, layout.maxScrollY);
    if (x !== v.scrollX || y !== v.scrollY) editor.setView({ scrollX: x, scrollY: y });
  }, [layout, view, editor]);

  useEffect(() => {
    const el = hostRef.current;
    if (!el || typeof ResizeObserver === 'undefined') return;
    const ro = new ResizeObserver(([entry]) => {
      const w = Math.max(200, Math.floor(entry.contentRect.width));
      const h = Math.max(200, Math.floor(entry.contentRect.height));
      setSize((s) => (s.width === w && s.height === h ? s : { width: w, height: h }));
    });
    ro.observe(el);
    return () => ro.disconnect();
  }, []);

  // Repaint changed grids once per frame, outside React.
  useEffect(() => {
    let frame = 0;
    const flush = () => {
      frame = 0;
      const start = performance.now();
      const v = view.get();
      const sizesBefore = painter.sizes();
      const changed = painter.paint(doc.get().draft, { shaftsFromTop: v.arrangement.shaftsFromTop, drawdownView: v.drawdownView });
      // A bitmap that grew (ends or picks added) needs its crop worked out again.
      if (painter.sizes() !== sizesBefore) setBitmapSizes(painter.sizes());
      const layer = staticLayer.current;
      if (changed.size > 0 && layer) {
        const { layout: shown, scrollX: sx, scrollY: sy } = drawn.current;
        const boxes = [...changed].flatMap((id) => {
          const box = painter.bitmap(id).changed;
          return box ? [{ id, box }] : [];
        });
        const rects = changedRects(shown, boxes, sx, sy, layer.getCanvas().getPixelRatio());
        // A few cells (a drag, a toggle): redraw their boxes only. Larger changes: the whole layer.
        const area = rects.reduce((sum, r) => sum + r.width * r.height, 0);
        if (area < (shown.width * shown.height) / 4) redrawRects(layer, rects);
        else layer.draw();
        // 'repaint': the work of one frame's repaint; 'edit-to-paint': from the key or pointer press.
        performance.measure('repaint', { start, end: performance.now() });
        performance.mark('grids-painted');
        if (performance.getEntriesByName('edit-start', 'mark').length > 0) {
          performance.measure('edit-to-paint', 'edit-start', 'grids-painted');
          performance.clearMarks('edit-start');
        }
      }
    };
    const schedule = () => {
      if (!frame) frame = requestAnimationFrame(flush);
    };
    const offDoc = doc.subscribe(schedule);
    const offView = view.subscribe(schedule);
    return () => {
      offDoc();
      offView();
      if (frame) cancelAnimationFrame(frame);
    };
  }, [doc, view, painter]);

  useLayoutEffect(() => {
    const layer = staticLayer.current;
    if (!layer) return;
    const off = clearBeforeWholeDraws(layer);
    layer.draw();
    performance.mark('drawdown-painted');
    if (performance.getEntriesByName('draft-arrived', 'mark').length > 0) performance.measure('open-to-drawdown', 'draft-arrived', 'drawdown-painted');
    return off;
  }, []);

  // Keep the cursor in view after keyboard moves only: a wheel or trackpad scroll that leaves the
  // cursor behind must stay where the weaver put it.
  const revealed = useRef(view.get().revealCursor);
  useEffect(
    () =>
      view.subscribe(() => {
        const v = view.get();
        if (v.revealCursor === revealed.current) return;
        revealed.current = v.revealCursor;
        const r = regionOf(layout, v.cursor.grid);
        if (!r) return;
        const { cell: c } = layout;
        let { scrollX: sx, scrollY: sy } = v;
        if (r.scrollsX) {
          const left = v.cursor.col * c;
          if (left < sx) sx = left;
          else if (left + c > sx + r.width) sx = Math.min(layout.maxScrollX, left + c - r.width);
        }
        if (r.scrollsY) {
          const top = v.cursor.row * c;
          if (top < sy) sy = top;
          else if (top + c > sy + r.height) sy = Math.min(layout.maxScrollY, top + c - r.height);
        }
        if (sx !== v.scrollX || sy !== v.scrollY) editor.setView({ scrollX: sx, scrollY: sy });
      }),
    [view, layout, editor],
  );

  // Wheel and trackpad: a native listener, since React's is passive and cannot keep the page (or,
  // with Ctrl, the browser's own zoom) from taking the event.
  const current = useRef({ layout, size });
  useLayoutEffect(() => {
    current.current = { layout, size };
  }, [layout, size]);
  useEffect(() => {
    const el = hostRef.current;
    if (!el) return;
    // The zoom between events, so a pinch's many small steps add up.
    let zoom = view.get().cell;
    const onWheel = (e: globalThis.WheelEvent) => {
      const v = view.get();
      const { layout: shown, size: stage } = current.current;
      e.preventDefault();
      if (e.ctrlKey || e.metaKey) {
        if (Math.round(zoom) !== v.cell) zoom = v.cell;
        zoom = zoomedCell(zoom, wheelPixels(e, stage).dy);
        const cell = Math.round(zoom);
        if (cell === v.cell) return;
        const after = computeLayout(doc.get().draft, v.arrangement, cell, stage.width, stage.height, showsLayerRows(doc.get().draft, v.layerRows));
        const box = el.getBoundingClientRect();
        editor.setView({ cell, ...zoomedAbout(shown, after, v, { x: e.clientX - box.left, y: e.clientY - box.top }) });
        return;
      }
      const { dx, dy } = wheelPixels(e, stage);
      // Mirrored, a swipe to the left brings the higher ends (on the left) into view.
      editor.setView(scrolledBy(shown, v, shown.mirrored ? -dx : dx, dy));
    };
    el.addEventListener('wheel', onWheel, { passive: false });
    return () => el.removeEventListener('wheel', onWheel);
  }, [view, doc, editor]);

  const toStage = (e: { clientX: number; clientY: number }) => {
    const rect = hostRef.current!.getBoundingClientRect();
    return { x: e.clientX - rect.left, y: e.clientY - rect.top };
  };
  const cellFromEvent = (e: { clientX: number; clientY: number }): GridCell | null => {
    const p = toStage(e);
    const v = view.get();
    const ref = cellAt(layout, p.x, p.y, v.scrollX, v.scrollY, doc.get().draft.shafts, v.arrangement.shaftsFromTop);
    if (!ref || ref.grid === 'drawdown') return null;
    const pos = cellPosition(ref, doc.get().draft.shafts, v.arrangement.shaftsFromTop);
    return { grid: ref.grid, col: pos.col, row: pos.row };
  };

  const pan = useRef<{ x: number; y: number; sx: number; sy: number } | null>(null);
  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    hostRef.current?.focus();
    if (e.button === 1 || (e.button === 0 && e.altKey && e.shiftKey)) {
      pan.current = { x: e.clientX, y: e.clientY, sx: view.get().scrollX, sy: view.get().scrollY };
      e.currentTarget.setPointerCapture?.(e.pointerId);
      return;
    }
    if (e.button !== 0) return;
    const c = cellFromEvent(e);
    if (!c) return;
    e.currentTarget.setPointerCapture?.(e.pointerId);
    if (readOnly) {
      editor.setView({ cursor: c });
      return;
    }
    performance.mark('edit-start');
    editor.pointerDown(c, { extend: e.shiftKey, add: e.altKey });
  };
  const onPointerMove = (e: PointerEvent<HTMLDivElement>) => {
    if (pan.current) {
      const p = pan.current;
      editor.setView({
        scrollX: Math.max(0, Math.min(layout.maxScrollX, p.sx - (layout.mirrored ? -1 : 1) * (e.clientX - p.x))),
        scrollY: Math.max(0, Math.min(layout.maxScrollY, p.sy - (e.clientY - p.y))),
      });
      return;
    }
    if (e.buttons !== 1 || readOnly) return;
    const c = cellFromEvent(e);
    if (c) editor.pointerMove(c);
  };
  const onPointerUp = () => {
    pan.current = null;
    editor.pointerUp();
  };
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    performance.mark('edit-start');
    if (handleKey(editor, e, { readOnly })) e.preventDefault();
  };

  return (
    <div
      ref={hostRef}
      tabIndex={0}
      role="application"
      aria-roledescription="draft grids"
      aria-label="Draft: threading, tie-up, treadling, colours and drawdown. Arrow keys move, space marks, [ and ] change grid."
      className="relative h-full min-h-[320px] w-full touch-none overflow-hidden rounded-md border border-line bg-surface outline-none focus-visible:ring-2 focus-visible:ring-accent"
      onPointerDown={onPointerDown}
      onPointerMove={onPointerMove}
      onPointerUp={onPointerUp}
      onPointerCancel={onPointerUp}
      onKeyDown={onKeyDown}
      data-testid="draft-canvas"
    >
      <Stage width={size.width} height={size.height} listening={false}>
        <StaticLayer layerRef={staticLayer} layout={layout} painter={painter} bitmapSizes={bitmapSizes} scrollX={scrollX} scrollY={scrollY} rulerStep={rulerStep} />
        <OverlayLayer editor={editor} layout={layout} />
      </Stage>
    </div>
  );
}

/** Layers being drawn again in part: they clear their own boxes, not the whole canvas. */
const drawingPart = new WeakSet<Konva.Layer>();

/**
 * For a layer made with `clearBeforeDraw={false}`: clears it before every whole draw, so that
 * {@link redrawRects} can draw it in part. (Switching `clearBeforeDraw` around a part draw instead
 * would make Konva schedule a whole draw for the changed setting: two draws a frame.)
 */
function clearBeforeWholeDraws(layer: Konva.Layer): () => void {
  const clear = () => {
    if (!drawingPart.has(layer)) layer.getContext().clear();
  };
  layer.on('beforeDraw', clear);
  return () => layer.off('beforeDraw', clear);
}

/**
 * Draws a layer again inside the given boxes only: each is cleared and the layer's nodes drawn
 * under a clip, so the canvas changes (and the browser composites again) just those pixels.
 */
function redrawRects(layer: Konva.Layer, rects: readonly StageRect[]): void {
  const g = layer.getContext()._context;
  drawingPart.add(layer);
  try {
    for (const r of rects) {
      g.save();
      g.beginPath();
      g.rect(r.x, r.y, r.width, r.height);
      g.clip();
      g.clearRect(r.x, r.y, r.width, r.height);
      layer.drawScene();
      g.restore();
    }
  } finally {
    drawingPart.delete(layer);
  }
}

interface StaticProps {
  layerRef: React.RefObject<Konva.Layer | null>;
  layout: Layout;
  painter: DraftPainter;
  /** Changes when a bitmap changes size, so the crops are worked out again. */
  bitmapSizes: string;
  scrollX: number;
  scrollY: number;
  rulerStep: number;
}

/**
 * Bitmaps, grid lines and rulers: re-rendered only for layout, scroll and ruler changes. Each
 * bitmap is cropped to the cells in view, so drawing costs the view's size, not the draft's.
 */
const StaticLayer = memo(function StaticLayer({ layerRef, layout, painter, scrollX, scrollY, rulerStep }: StaticProps) {
  const { cell } = layout;
  return (
    <Layer ref={layerRef} listening={false} imageSmoothingEnabled={false} clearBeforeDraw={false}>
      {layout.regions.map((r) => {
        const b = painter.bitmap(r.id);
        const sx = r.scrollsX ? scrollX : 0;
        const sy = r.scrollsY ? scrollY : 0;
        const c0 = Math.floor(sx / cell);
        const r0 = Math.floor(sy / cell);
        const c1 = Math.min(b.width, Math.ceil((sx + r.width) / cell));
        const r1 = Math.min(b.height, Math.ceil((sy + r.height) / cell));
        if (c1 <= c0 || r1 <= r0) return null;
        return (
          <Group key={r.id} clipX={r.x} clipY={r.y} clipWidth={r.width} clipHeight={r.height}>
            {/* End 1 on the right: the ends' grids are drawn reflected in their band. */}
            <Group {...(layout.mirrored && r.scrollsX ? { scaleX: -1, x: 2 * layout.endRuler.x + layout.endRuler.width } : {})}>
              <KonvaImage
                image={b.canvas}
                crop={{ x: c0, y: r0, width: c1 - c0, height: r1 - r0 }}
                x={r.x + c0 * cell - sx}
                y={r.y + r0 * cell - sy}
                width={(c1 - c0) * cell}
                height={(r1 - r0) * cell}
                perfectDrawEnabled={false}
              />
            </Group>
          </Group>
        );
      })}
      <Shape
        perfectDrawEnabled={false}
        sceneFunc={(ctx) => drawLinesAndRulers(ctx._context, layout, scrollX, scrollY, rulerStep)}
      />
    </Layer>
  );
});

/** Grid lines for the cells in view (a heavier line every ruler step), and end and pick numbers. */
function drawLinesAndRulers(g: CanvasRenderingContext2D, layout: Layout, scrollX: number, scrollY: number, step: number): void {
  const { cell } = layout;
  for (const r of layout.regions) {
    const sx = r.scrollsX ? scrollX : 0;
    const sy = r.scrollsY ? scrollY : 0;
    const firstCol = Math.floor(sx / cell);
    const lastCol = Math.min(r.cols, Math.ceil((sx + r.width) / cell));
    const firstRow = Math.floor(sy / cell);
    const lastRow = Math.min(r.rows, Math.ceil((sy + r.height) / cell));
    const right = Math.min(r.x + r.width, r.x + r.cols * cell - sx);
    const bottom = Math.min(r.y + r.height, r.y + r.rows * cell - sy);
    g.save();
    g.beginPath();
    g.rect(r.x, r.y, r.width, r.height);
    g.clip();
    if (layout.mirrored && r.scrollsX) {
      g.translate(2 * layout.endRuler.x + layout.endRuler.width, 0);
      g.scale(-1, 1);
    }
    for (const strong of [false, true]) {
      // Thin lines only when cells are big enough to tell apart; ruler lines always.
      if (!strong && cell < 5) continue;
      g.beginPath();
      for (let c = firstCol; c <= lastCol; c++) {
        const isStep = r.id !== 'tieup' && r.scrollsX && c % step === 0;
        if (isStep !== strong) continue;
        const x = Math.round(r.x + c * cell - sx) + 0.5;
        g.moveTo(x, r.y);
        g.lineTo(x, bottom);
      }
      for (let row = firstRow; row <= lastRow; row++) {
        const isStep = r.scrollsY && row % step === 0;
        if (isStep !== strong) continue;
        const y = Math.round(r.y + row * cell - sy) + 0.5;
        g.moveTo(r.x, y);
        g.lineTo(right, y);
      }
      g.strokeStyle = strong ? LINE_STRONG : LINE;
      g.lineWidth = 1;
      g.stroke();
    }
    g.restore();
  }

  g.fillStyle = MUTED;
  g.font = '10px "IBM Plex Sans", system-ui, sans-serif';
  g.textBaseline = 'middle';
  g.textAlign = 'center';
  // Numbers need room: skip steps until labels are far enough apart (28 px across, 14 px down).
  const er = layout.endRuler;
  drawNumbers(g, { x: er.x - 20, y: er.y, width: er.width + 40, height: er.height }, er.width, scrollX, cell, step, 28, (n, at) =>
    g.fillText(String(n), layout.mirrored ? er.x + er.width - at : er.x + at, er.y + er.height / 2),
  );
  const pr = layout.pickRuler;
  drawNumbers(g, pr, pr.height, scrollY, cell, step, 14, (n, at) => g.fillText(String(n), pr.x + pr.width / 2, pr.y + at));
}

/** Thread numbers every `step` (or a multiple of it) along a ruler, clipped to its box. */
function drawNumbers(
  g: CanvasRenderingContext2D,
  clip: { x: number; y: number; width: number; height: number },
  length: number,
  scroll: number,
  cell: number,
  step: number,
  room: number,
  label: (n: number, at: number) => void,
): void {
  g.save();
  g.beginPath();
  g.rect(clip.x, clip.y, clip.width, clip.height);
  g.clip();
  const every = step * Math.max(1, Math.ceil(room / (step * cell)));
  const first = Math.floor(scroll / cell / every) * every;
  for (let n = Math.max(every, first); n * cell - scroll <= length + cell; n += every) label(n, (n - 0.5) * cell - scroll);
  g.restore();
}

function cellBox(layout: Layout, r: Region, col: number, row: number, v: Pick<ViewState, 'scrollX' | 'scrollY'>) {
  return {
    x: columnX(layout, r, col, v.scrollX),
    y: r.y + row * layout.cell - (r.scrollsY ? v.scrollY : 0),
  };
}

/** Cursor, selection and the end or pick picked from Checks: a few shapes, redrawn on their own layer. */
function OverlayLayer({ editor, layout }: { editor: Editor; layout: Layout }) {
  const cursor = useStore(editor.view, (v) => v.cursor);
  const selection = useStore(editor.view, (v) => v.selection);
  const highlight = useStore(editor.view, (v) => v.highlight);
  const scrollX = useStore(editor.view, (v) => v.scrollX);
  const scrollY = useStore(editor.view, (v) => v.scrollY);
  const scroll = { scrollX, scrollY };
  const { cell } = layout;
  const shapes: React.ReactNode[] = [];
  const clipTo = (r: Region, key: string, children: React.ReactNode) => (
    <Group key={key} clipX={r.x - 2} clipY={r.y - 2} clipWidth={r.width + 4} clipHeight={r.height + 4}>
      {children}
    </Group>
  );

  if (selection) {
    const r = regionOf(layout, selection.grid);
    if (r) {
      const c0 = Math.min(selection.from.col, selection.to.col);
      const r0 = Math.min(selection.from.row, selection.to.row);
      const c1 = Math.max(selection.from.col, selection.to.col);
      const r1 = Math.max(selection.from.row, selection.to.row);
      // Mirrored, the last column of the run is the leftmost.
      const p = cellBox(layout, r, layout.mirrored && r.scrollsX ? c1 : c0, r0, scroll);
      shapes.push(
        clipTo(r, 'sel', <Rect x={p.x} y={p.y} width={(c1 - c0 + 1) * cell} height={(r1 - r0 + 1) * cell} fill={SELECTED} stroke={ACCENT} strokeWidth={1} dash={[4, 3]} />),
      );
    }
  }
  const cr = regionOf(layout, cursor.grid);
  if (cr) {
    const p = cellBox(layout, cr, cursor.col, cursor.row, scroll);
    shapes.push(clipTo(cr, 'cursor', <Rect x={p.x - 1} y={p.y - 1} width={cell + 2} height={cell + 2} stroke={ACCENT} strokeWidth={2} />));
  }
  if (highlight) {
    // A dashed band across every grid the end (or pick) runs through: a mark, not just a colour.
    const ids: RegionId[] = highlight.axis === 'ends' ? ['warpLayers', 'warpColors', 'threading', 'drawdown'] : ['weftLayers', 'weftColors', 'treadling', 'liftplan', 'drawdown'];
    for (const id of ids) {
      const r = regionOf(layout, id);
      if (!r) continue;
      const p = highlight.axis === 'ends' ? cellBox(layout, r, highlight.index, 0, scroll) : cellBox(layout, r, 0, highlight.index, scroll);
      const box =
        highlight.axis === 'ends'
          ? { x: p.x, y: r.y, width: cell, height: r.height }
          : { x: r.x, y: p.y, width: r.width, height: cell };
      shapes.push(clipTo(r, `hl-${id}`, <Rect {...box} stroke={DANGER} strokeWidth={2} dash={[3, 2]} />));
    }
  }
  return <Layer listening={false}>{shapes}</Layer>;
}

