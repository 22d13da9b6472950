import type { Draft, Drawdown } from '../../../../shared/weave';
import { GridBitmap, pixel } from './bitmap';
import type { Derived } from './derived';
import { GROW_MARGIN, type RegionId } from './layout';
import { paintCloth, paintColorOrder, paintLayerRow, paintPickRows, paintShaftColumns, paintStructure, TONES } from './paint';

export interface PaintSettings {
  shaftsFromTop: boolean;
  drawdownView: 'structure' | 'colour';
}

/**
 * Keeps one bitmap per grid and repaints a grid only when the parts of the draft it shows changed
 * (by identity, which immer keeps for untouched lists). Returns the grids it repainted.
 */
export class DraftPainter {
  readonly bitmaps = new Map<RegionId, GridBitmap>();
  private inputs = new Map<string, readonly unknown[]>();
  private derived: Derived;
  /** The drawdown the drawdown bitmap shows, to repaint only the cells whose interlacement changed. */
  private shown: Drawdown | null = null;
  private pixels = new Map<string, number>();

  constructor(derived: Derived) {
    this.derived = derived;
  }

  bitmap(id: RegionId): GridBitmap {
    let b = this.bitmaps.get(id);
    if (!b) this.bitmaps.set(id, (b = new GridBitmap()));
    return b;
  }

  private changed(id: string, keys: readonly unknown[]): boolean {
    const last = this.inputs.get(id);
    if (last && last.length === keys.length && last.every((v, i) => v === keys[i])) return false;
    this.inputs.set(id, keys);
    return true;
  }

  /** Width and height of every bitmap, to tell when the stage must re-crop them. */
  sizes(): string {
    return [...this.bitmaps].map(([id, b]) => `${id}:${b.width}x${b.height}`).join(' ');
  }

  /** Repaints what changed since the last call. */
  paint(draft: Draft, settings: PaintSettings): Set<RegionId> {
    const done = new Set<RegionId>();
    const ends = draft.threading.length;
    const lift = draft.control === 'liftplan';
    const picks = lift ? draft.liftplan.length : draft.treadling.length;
    const { shaftsFromTop, drawdownView } = settings;

    if (this.changed('threading', [draft.threading, draft.shafts, shaftsFromTop])) {
      const w = ends + GROW_MARGIN;
      if (this.bitmap('threading').paint(w, draft.shafts, (out) => paintShaftColumns(out, w, draft.threading, draft.shafts, shaftsFromTop))) done.add('threading');
    }
    if (!lift && this.changed('tieup', [draft.tieup, draft.shafts, draft.treadles, shaftsFromTop])) {
      const w = Math.max(1, draft.treadles);
      if (this.bitmap('tieup').paint(w, draft.shafts, (out) => paintShaftColumns(out, w, draft.tieup, draft.shafts, shaftsFromTop))) done.add('tieup');
    }
    if (!lift && this.changed('treadling', [draft.treadling, draft.treadles])) {
      const w = Math.max(1, draft.treadles);
      if (this.bitmap('treadling').paint(w, picks + GROW_MARGIN, (out) => paintPickRows(out, w, draft.treadling))) done.add('treadling');
    }
    if (lift && this.changed('liftplan', [draft.liftplan, draft.shafts])) {
      if (this.bitmap('liftplan').paint(draft.shafts, picks + GROW_MARGIN, (out) => paintPickRows(out, draft.shafts, draft.liftplan))) done.add('liftplan');
    }
    if (this.changed('warpColors', [draft.warpColors, draft.palette])) {
      if (this.bitmap('warpColors').paint(ends + GROW_MARGIN, 1, (out) => paintColorOrder(out, draft.warpColors, draft.palette))) done.add('warpColors');
    }
    if (this.changed('weftColors', [draft.weftColors, draft.palette])) {
      if (this.bitmap('weftColors').paint(1, picks + GROW_MARGIN, (out) => paintColorOrder(out, draft.weftColors, draft.palette))) done.add('weftColors');
    }
    if (this.changed('warpLayers', [draft.warpLayers, ends])) {
      if (this.bitmap('warpLayers').paint(ends + GROW_MARGIN, 1, (out) => paintLayerRow(out, draft.warpLayers, ends))) done.add('warpLayers');
    }
    if (this.changed('weftLayers', [draft.weftLayers, picks])) {
      if (this.bitmap('weftLayers').paint(1, picks + GROW_MARGIN, (out) => paintLayerRow(out, draft.weftLayers, picks))) done.add('weftLayers');
    }
    const dd = this.derived.drawdown(draft);
    const colourKeys = drawdownView === 'colour' ? [draft.palette, draft.warpColors, draft.weftColors, drawdownView] : [drawdownView];
    const colourSame = !this.changed('drawdown-colours', colourKeys);
    const last = this.shown;
    if (last !== dd) {
      const bitmap = this.bitmap('drawdown');
      const painted =
        colourSame && last && last.ends === dd.ends && last.picks === dd.picks && bitmap.width === dd.ends && bitmap.height === dd.picks
          ? this.patchDrawdown(bitmap, last, dd, draft, drawdownView)
          : this.paintDrawdown(bitmap, dd, draft, drawdownView);
      if (painted) done.add('drawdown');
    } else if (!colourSame && this.paintDrawdown(this.bitmap('drawdown'), dd, draft, drawdownView)) {
      done.add('drawdown');
    }
    this.shown = dd;
    return done;
  }

  private paintDrawdown(bitmap: GridBitmap, dd: Drawdown, draft: Draft, view: PaintSettings['drawdownView']): boolean {
    const fill = view === 'colour' ? (out: Uint32Array) => paintCloth(out, this.derived.cloth(draft)) : (out: Uint32Array) => paintStructure(out, dd);
    return bitmap.paint(dd.ends, dd.picks, fill);
  }

  /**
   * Repaints only the cells whose interlacement changed (toggling one threading cell changes one
   * column), taking each cell's colour from the engine's cloth.
   */
  private patchDrawdown(bitmap: GridBitmap, before: Drawdown, after: Drawdown, draft: Draft, view: PaintSettings['drawdownView']): boolean {
    const cloth = view === 'colour' ? this.derived.cloth(draft) : null;
    const colourOf = (hex: string) => {
      let word = this.pixels.get(hex);
      if (word === undefined) this.pixels.set(hex, (word = pixel(hex)));
      return word;
    };
    const { stride, picks } = after;
    const a = before.bits;
    const b = after.bits;
    return bitmap.patch((set) => {
      for (let p = 0; p < picks; p++) {
        const row = p * stride;
        for (let w = 0; w < stride; w++) {
          let diff = (a[row + w] ^ b[row + w]) >>> 0;
          while (diff !== 0) {
            const bit = 31 - Math.clz32(diff);
            diff = (diff & ~(1 << bit)) >>> 0;
            const e = (w << 5) + bit;
            const up = ((b[row + w] >>> bit) & 1) === 1;
            set(e, p, cloth ? colourOf(cloth.colorAt(e, p)) : up ? TONES.warpUp : TONES.weftUp);
          }
        }
      }
    });
  }
}
