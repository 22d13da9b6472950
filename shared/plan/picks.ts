/**
 * The one sentence every view uses for the picks to weave, so two different pick counts never
 * appear for the same cloth without the reason between them.
 */
import type { PickCount } from './warp';

/**
 * "560 picks, as in the draft", "1190 picks: the draft's 80 picks 14 times, then picks 1–70 once
 * more", "1160 picks: the draft's 560 picks and 20 for hems, for each of 2 pieces". Numbers are
 * written plainly (no separators) so they read the same in every view.
 */
export function picksReason(p: PickCount): string {
  if (p.draft === 0) return 'The draft has no picks yet.';
  if (p.total === p.draft) return `${p.total} picks, as in the draft.`;
  const samples = p.samplePicks ? `, and ${p.samplePicks} for samples` : '';
  if (p.whole) {
    const hems = p.hemPicks ? ` and ${p.hemPicks} for hems` : '';
    const pieces = p.pieces > 1 ? `, for each of ${p.pieces} pieces` : '';
    return `${p.total} picks: the draft's ${p.draft} picks${hems}${pieces}${samples}.`;
  }
  const times = Math.floor(p.total / p.draft);
  const extra = p.total % p.draft;
  const whole = times > 0 ? `the draft's ${p.draft} picks ${times === 1 ? 'once' : `${times} times`}` : `picks 1–${extra} of the draft's ${p.draft}`;
  const rest = times > 0 && extra > 0 ? `, then picks 1–${extra} once more` : '';
  return `${p.total} picks to weave the length: ${whole}${rest}.`;
}
