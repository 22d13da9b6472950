import fc from 'fast-check';
import type { Profile } from '../../shared/weave/profile';

/** Invented colours: a navy layer on its own, and a cream-and-rust layer. */
export const NAVY = 0;
export const CREAM = 1;
export const RUST = 2;
export const DOUBLE_WEAVE_PALETTE = ['#1f2a44', '#f2e8d5', '#c8553d'];

/**
 * A double-weave profile: layer 1 all navy, layer 2 alternating cream and rust in warp and weft.
 * Default: blocks A and B side by side, two units each, A's layer 1 up for two rows then B's.
 */
export function doubleWeaveProfile(overrides: Partial<Profile> = {}): Profile {
  return {
    name: 'Two-block table mat',
    threading: [1, 1, 2, 2],
    treadling: [[1], [1], [2], [2]],
    palette: DOUBLE_WEAVE_PALETTE,
    warpColors: [[NAVY], [CREAM, RUST]],
    weftColors: [[NAVY], [CREAM, RUST]],
    ...overrides,
  };
}

/** Random double-weave profiles on up to `maxBlocks` blocks, with ends and picks per unit 4 or 8. */
export function arbitraryDoubleWeaveProfile(maxBlocks = 4): fc.Arbitrary<Profile> {
  return fc.integer({ min: 1, max: maxBlocks }).chain((blocks) =>
    fc.record({
      threading: fc.array(fc.integer({ min: 1, max: blocks }), { minLength: 1, maxLength: 10 }),
      treadling: fc.array(fc.subarray(Array.from({ length: blocks }, (_, i) => i + 1)), { minLength: 1, maxLength: 10 }),
      endsPerUnit: fc.constantFrom(4, 8),
      picksPerUnit: fc.constantFrom(4, 8),
    }).map((r) => doubleWeaveProfile(r)),
  );
}
