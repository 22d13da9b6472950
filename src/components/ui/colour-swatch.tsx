import type { Draft } from '../../../shared/weave/types';

/**
 * A palette colour in words: the name of the draft's yarn shown in that colour when it has one,
 * else its number (1-based, as the weaver counts).
 */
export function colourName(draft: Pick<Draft, 'yarns'>, color: number): string {
  const yarn = draft.yarns.find((y) => y.color === color);
  return yarn ? `${yarn.name} (colour ${color + 1})` : `Colour ${color + 1}`;
}

/** A colour chip with its name beside it, so the colour is never the only sign. */
export function ColourSwatch({ draft, color, className = '' }: { draft: Pick<Draft, 'yarns' | 'palette'>; color: number; className?: string }) {
  return (
    <span className={`inline-flex items-center gap-1.5 ${className}`}>
      <span
        aria-hidden="true"
        className="inline-block size-4 shrink-0 rounded-sm border border-field"
        style={{ backgroundColor: draft.palette[color] ?? 'transparent' }}
      />
      <span>{colourName(draft, color)}</span>
    </span>
  );
}
