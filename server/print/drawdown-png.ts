import { arrangementOf, type Draft } from '../../shared/weave';
import { encodePngRgb, encodePngRgbAsync } from './png';
import { cellImage, clothSources, orientCells, threadImage, threadPitch, type CellImage } from './raster';

export type PngView = 'structure' | 'colour' | 'front' | 'back';

export interface DrawdownPngOptions {
  view: PngView;
  /** Pixels per cell side, a whole number from 1 to 64. */
  scale: number;
  /** As in the editor: pick 1 at the top when the threading is above (default). */
  threadingAbove?: boolean;
  /** End 1 on the right (default: as the draft's arrangement says). */
  endOneRight?: boolean;
}

/** Largest picture we make: 40 megapixels is 120 MB of pixels before compression. */
export const MAX_PNG_PIXELS = 40_000_000;

/**
 * The drawdown (a cell per end and pick), or the cloth in colour or either face of a layered cloth
 * drawn thread by thread from the yarn sizes and sett, as a PNG laid out as the editor shows it;
 * the back is mirrored, as the weaver sees it turned over.
 *
 * @example renderDrawdownPng(draft, { view: 'colour', scale: 8 }) // ends 8 pixels apart
 * @throws RangeError for a scale out of range or a picture too big; Error for a face of a one-layer draft.
 */
export function renderDrawdownPng(draft: Draft, options: DrawdownPngOptions): Buffer {
  const out = drawdownPixels(draft, options);
  return encodePngRgb(out.width, out.height, out.rgb);
}

/** As renderDrawdownPng, compressing off the event loop (for the server). */
export function renderDrawdownPngAsync(draft: Draft, options: DrawdownPngOptions): Promise<Buffer> {
  const out = drawdownPixels(draft, options);
  return encodePngRgbAsync(out.width, out.height, out.rgb);
}

function drawdownPixels(draft: Draft, options: DrawdownPngOptions): CellImage {
  const { scale } = options;
  if (!Number.isInteger(scale) || scale < 1 || scale > 64) throw new RangeError(`scale ${scale} is not a whole number from 1 to 64`);
  const src = clothSources(draft);
  const { ends, picks } = src.drawdown;
  if (ends === 0 || picks === 0) throw new RangeError('the draft has no cells to draw');
  const own = arrangementOf(draft);
  const endOneRight = options.endOneRight ?? own.endOne === 'right';
  const flipY = !(options.threadingAbove ?? own.threading === 'above');
  if (options.view !== 'structure') {
    // The cloth thread by thread: `scale` pixels per end, picks spaced by the sett.
    const pitch = threadPitch(src, scale);
    if (ends * picks * pitch.x * pitch.y > MAX_PNG_PIXELS) throw new RangeError(`a picture of ${ends} × ${picks} threads at ${scale} pixels per end is too big; choose a smaller scale`);
    const img = threadImage(src, options.view, scale, { endOneRight });
    return orientCells(img, { start: 0, end: img.width }, { start: 0, end: img.height }, false, flipY);
  }
  if (ends * picks * scale * scale > MAX_PNG_PIXELS) throw new RangeError(`a picture of ${ends} × ${picks} cells at ${scale} pixels per cell is too big; choose a smaller scale`);
  const img = cellImage(src, options.view);
  const flipX = endOneRight;
  return orientCells(img, { start: 0, end: ends }, { start: 0, end: picks }, flipX, flipY, scale);
}
