import { useEffect, useRef } from 'react';
import { pickCount, renderCloth, type Draft } from '../../../shared/weave';

/**
 * The start of a draft's cloth in colour (at most `cells` × `cells`), drawn from the document in the
 * browser: one bitmap, each cell `scale` pixels.
 */
export function ClothPreview({ draft, label, cells = 120, scale = 3 }: { draft: Draft; label: string; cells?: number; scale?: number }) {
  const ref = useRef<HTMLCanvasElement>(null);
  const ends = Math.min(cells, draft.threading.length);
  const picks = Math.min(cells, pickCount(draft));
  useEffect(() => {
    const canvas = ref.current;
    const ctx = canvas?.getContext('2d');
    if (!canvas || !ctx || ends === 0 || picks === 0) return;
    const crop: Draft = {
      ...draft,
      threading: draft.threading.slice(0, ends),
      warpColors: draft.warpColors.slice(0, ends),
      treadling: draft.treadling.slice(0, picks),
      liftplan: draft.liftplan.slice(0, picks),
      weftColors: draft.weftColors.slice(0, picks),
    };
    const image = new ImageData(new Uint8ClampedArray(renderCloth(crop).toRGBA()), ends, picks);
    const cellCanvas = new OffscreenCanvas(ends, picks);
    cellCanvas.getContext('2d')!.putImageData(image, 0, 0);
    ctx.imageSmoothingEnabled = false;
    ctx.drawImage(cellCanvas, 0, 0, ends * scale, picks * scale);
  }, [draft, ends, picks, scale]);
  if (ends === 0 || picks === 0) return <p className="text-sm text-muted">No cloth yet: the draft has no ends or no picks.</p>;
  return <canvas ref={ref} role="img" aria-label={label} width={ends * scale} height={picks * scale} className="max-w-full rounded-md border border-line" />;
}
