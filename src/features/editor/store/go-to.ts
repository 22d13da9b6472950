import type { Draft } from '../../../../shared/weave';

/** What the weaver typed in the go-to box: a thread to go to, or a run of threads to select. 0-based. */
export type GoTo =
  | { kind: 'go'; axis: 'ends' | 'picks'; index: number }
  | { kind: 'select'; axis: 'ends' | 'picks'; from: number; to: number };

export const GO_TO_HINT = 'Type an end or pick, like “end 120” or “pick 30”, or a run to select, like “ends 1–48” or “picks 10–20”.';

const PATTERN = /^(?:(?:go\s*to|select)\s+)?(ends?|e|picks?|p)\s*(\d+)(?:\s*(?:-|–|—|to|\.\.)\s*(\d+))?$/i;

/**
 * Reads "end 120", "pick 30", "ends 1–48", "picks 10 to 20" (1-based, as a weaver counts) against
 * the draft's size; a sentence saying what is wrong otherwise.
 *
 * @example parseGoTo('ends 1-48', draft) // { kind: 'select', axis: 'ends', from: 0, to: 47 }
 */
export function parseGoTo(text: string, draft: Draft): GoTo | { error: string } {
  const m = PATTERN.exec(text.trim());
  if (!m) return { error: GO_TO_HINT };
  const axis = m[1].toLowerCase().startsWith('e') ? 'ends' : 'picks';
  const count = axis === 'ends' ? draft.threading.length : draft.control === 'liftplan' ? draft.liftplan.length : draft.treadling.length;
  const a = Number(m[2]);
  const b = m[3] === undefined ? a : Number(m[3]);
  const [low, high] = a <= b ? [a, b] : [b, a];
  if (low < 1 || high > count) {
    return { error: count === 0 ? `The draft has no ${axis} yet.` : `The draft has ${axis} 1 to ${count}.` };
  }
  return m[3] === undefined ? { kind: 'go', axis, index: low - 1 } : { kind: 'select', axis, from: low - 1, to: high - 1 };
}
