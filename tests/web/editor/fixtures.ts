import { createDraft, type Draft } from '../../../shared/weave';

/** A straight 4-shaft twill on 8 ends and 8 picks, two colours; override any field. */
export function twill(overrides: Partial<Draft> = {}): Draft {
  return createDraft({
    name: 'Test twill',
    shafts: 4,
    treadles: 4,
    threading: [[1], [2], [3], [4], [1], [2], [3], [4]],
    tieup: [[1, 2], [2, 3], [3, 4], [1, 4]],
    treadling: [[1], [2], [3], [4], [1], [2], [3], [4]],
    palette: ['#223344', '#eeddcc', '#aa3311'],
    ...overrides,
  });
}
