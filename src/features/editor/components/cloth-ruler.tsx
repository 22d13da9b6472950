import type { LengthUnit } from '../../../../shared/weave';

/** Thickness of the ruler, in CSS pixels. */
export const RULER_SIZE = 16;

/** Steps between small ticks, in the unit, finest first; and between numbered ticks. */
const TICKS: Record<LengthUnit, readonly number[]> = { inch: [1 / 8, 1 / 4, 1 / 2, 1, 2, 5, 10], cm: [0.1, 0.5, 1, 2, 5, 10, 20] };
const LABELS = [1, 2, 5, 10, 20, 50, 100];
/** Closest small ticks allowed, and numbers, in CSS pixels. */
const MIN_TICK_GAP = 5;
const MIN_LABEL_GAP = 30;

interface ClothRulerProps {
  /** Along the top edge ('across') or the left edge ('down'). */
  direction: 'across' | 'down';
  /** Length of the ruler in CSS pixels. */
  length: number;
  /** How far into the cloth the ruler starts, in CSS pixels. */
  offset: number;
  /** CSS pixels per inch of cloth. */
  pixelsPerInch: number;
  unit: LengthUnit;
}

/**
 * A ruler in inches or centimetres beside a cloth view, measuring the cloth as drawn: at actual
 * size its inches are the screen's CSS inches (96 CSS pixels each).
 */
export function ClothRuler({ direction, length, offset, pixelsPerInch, unit }: ClothRulerProps) {
  const perUnit = unit === 'inch' ? pixelsPerInch : pixelsPerInch / 2.54;
  const step = TICKS[unit].find((t) => t * perUnit >= MIN_TICK_GAP) ?? TICKS[unit].at(-1)!;
  const label = LABELS.find((l) => l * perUnit >= MIN_LABEL_GAP) ?? LABELS.at(-1)!;
  const first = Math.ceil(offset / (step * perUnit) - 1e-9);
  const last = Math.floor((offset + length) / (step * perUnit) + 1e-9);
  const ticks: { at: number; size: number; text?: string }[] = [];
  for (let i = first; i <= last && ticks.length < 2000; i++) {
    const value = i * step;
    const at = value * perUnit - offset;
    const whole = Math.abs(value - Math.round(value)) < 1e-6;
    const numbered = whole && Math.round(value) % label === 0;
    const half = !whole && Math.abs(value * 2 - Math.round(value * 2)) < 1e-6;
    ticks.push({ at, size: numbered ? 1 : whole ? 0.7 : half ? 0.5 : 0.3, text: numbered ? String(Math.round(value)) : undefined });
  }
  const across = direction === 'across';
  const name = unit === 'inch' ? 'inches' : 'centimetres';
  return (
    <svg
      width={across ? length : RULER_SIZE}
      height={across ? RULER_SIZE : length}
      className="block bg-surface text-muted"
      role="img"
      aria-label={`Ruler in ${name}${across ? ' across the cloth' : ' down the cloth'}`}
      data-testid={`ruler-${direction}`}
    >
      {ticks.map((t) => {
        const p = Math.round(t.at) + 0.5;
        const s = t.size * RULER_SIZE;
        return across ? (
          <g key={t.at}>
            <line x1={p} x2={p} y1={RULER_SIZE - s} y2={RULER_SIZE} stroke="currentColor" />
            {t.text && (
              <text x={p + 2} y={9} fontSize={9} fill="currentColor">
                {t.text}
              </text>
            )}
          </g>
        ) : (
          <g key={t.at}>
            <line y1={p} y2={p} x1={RULER_SIZE - s} x2={RULER_SIZE} stroke="currentColor" />
            {t.text && (
              <text x={1} y={p + 9} fontSize={9} fill="currentColor">
                {t.text}
              </text>
            )}
          </g>
        );
      })}
    </svg>
  );
}
