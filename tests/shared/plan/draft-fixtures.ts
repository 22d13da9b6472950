import { createDraft } from '../../../shared/weave/draft';
import type { Draft } from '../../../shared/weave/types';

/**
 * A four-shaft lift-plan draft, straight draw and plain weave, in three colours (dark warp,
 * light weft); pass overrides for what a test cares about.
 */
export function makeDraft(overrides: Partial<Draft> = {}): Draft {
  const threading = overrides.threading ?? STRAIGHT_4;
  const liftplan = overrides.liftplan ?? PLAIN_LIFTS;
  return createDraft({
    name: 'Test cloth',
    control: 'liftplan',
    liftplan,
    palette: ['#1f3a5f', '#f2e8d5', '#b5482e'],
    warpColors: threading.map(() => 0),
    weftColors: liftplan.map(() => 1),
    sett: { warp: 24, weft: 24, unit: 'inch' },
    ...overrides,
    threading,
  });
}

/** Straight draw on four shafts. */
export const STRAIGHT_4 = [[1], [2], [3], [4]];
/** 2/2 twill lifts for a straight draw, stepping one shaft per pick. */
export const TWILL_22_LIFTS = [[1, 2], [2, 3], [3, 4], [4, 1]];
/** Plain weave lifts on a straight draw. */
export const PLAIN_LIFTS = [[1, 3], [2, 4]];
