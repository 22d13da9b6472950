import { describe, expect, it } from 'vitest';
import { renderCloth } from '../../../shared/weave/cloth';
import { computeDrawdown } from '../../../shared/weave/drawdown';
import { createDraft } from '../../../shared/weave/draft';
import { asLists, repeat, straightDraw, twillTieup } from '../../../shared/weave/sequences';
import type { Draft } from '../../../shared/weave/types';

const DARK = '#202020';
const LIGHT = '#f0f0f0';

/** Rows of '#' (end up) and '.' (pick over), pick 1 first, end 1 leftmost. */
function picture(draft: Draft): string[] {
  const dd = computeDrawdown(draft);
  return Array.from({ length: dd.picks }, (_, p) => Array.from({ length: dd.ends }, (_, e) => (dd.isUp(e, p) ? '#' : '.')).join(''));
}

/** Rows of 'D'/'L' for the colour showing in each cell. */
function colours(draft: Draft): string[] {
  const cloth = renderCloth(draft);
  return Array.from({ length: cloth.height }, (_, p) =>
    Array.from({ length: cloth.width }, (_, e) => (cloth.colorAt(e, p) === DARK ? 'D' : 'L')).join(''),
  );
}

function plainWeave(ends: number, picks: number, warpColors?: number[], weftColors?: number[]): Draft {
  return createDraft({
    shafts: 2,
    treadles: 2,
    threading: asLists(repeat([1, 2], ends / 2)),
    tieup: [[1], [2]],
    treadling: asLists(repeat([1, 2], picks / 2)),
    palette: [DARK, LIGHT],
    ...(warpColors ? { warpColors } : {}),
    ...(weftColors ? { weftColors } : {}),
  });
}

function twill22(ends: number, picks: number, warpColors: number[], weftColors: number[]): Draft {
  return createDraft({
    shafts: 4,
    treadles: 4,
    threading: asLists(straightDraw(4, ends / 4)),
    tieup: twillTieup([2, 2]),
    treadling: asLists(straightDraw(4, picks / 4)),
    palette: [DARK, LIGHT],
    warpColors,
    weftColors,
  });
}

describe('handbook structures', () => {
  it('plain weave is a checkerboard', () => {
    // Source: Watson, Textile Design and Colour (1912); Taylor — plain weave [pub] (from memory).
    const rows = picture(plainWeave(8, 8));
    rows.forEach((row, p) => expect(row).toBe(p % 2 === 0 ? '#.#.#.#.' : '.#.#.#.#'));
  });

  it('2/2 twill on a straight draw steps one end per pick', () => {
    // Source: textbook definition of a regular twill [pub]: on n shafts it repeats on n ends and
    // n picks, and with a straight draw and treadling 1-2-3-4 the diagonal moves one end per pick.
    const draft = twill22(8, 8, new Array(8).fill(0), new Array(8).fill(1));
    const rows = picture(draft);
    expect(rows.slice(0, 4)).toEqual(['##..##..', '.##..##.', '..##..##', '#..##..#']);
    for (let p = 1; p < rows.length; p++) {
      // Each pick is the one before shifted one end to the right (twill line).
      const prev = rows[p - 1];
      expect(rows[p]).toBe(prev.slice(-1) + prev.slice(0, -1));
    }
    expect(rows.slice(4)).toEqual(rows.slice(0, 4));
  });

  it('4 dark, 4 light in warp and weft on a 2/2 twill gives houndstooth', () => {
    // Source: standard definition of houndstooth [pub] — 4 dark, 4 light in warp and weft on 2/2 twill (from memory).
    const order = [0, 0, 0, 0, 1, 1, 1, 1];
    const rows = colours(twill22(16, 16, repeat(order, 2), repeat(order, 2)));
    // Worked out by hand from the twill rows above: dark end over dark pick is dark, light over
    // light is light; where they differ the twill decides, giving the stepped "tooth".
    const repeat8 = ['DDDDLLDD', 'DDDDDLLD', 'DDDDDDLL', 'DDDDLDDL', 'DDLLLLLL', 'LDDLLLLL', 'LLDDLLLL', 'DLLDLLLL'];
    rows.slice(0, 8).forEach((row, p) => expect(row.slice(0, 8)).toBe(repeat8[p]));
    // The 8 × 8 cell repeats in both directions.
    rows.forEach((row, p) => expect(row).toBe(repeat8[p % 8].repeat(2)));
    // Characteristic: the dark-warp/light-weft quarter and its opposite are each half dark, half light,
    // while the like-on-like quarters are solid.
    const quarter = (e0: number, p0: number) => rows.slice(p0, p0 + 4).map((r) => r.slice(e0, e0 + 4)).join('');
    expect(quarter(0, 0)).toBe('D'.repeat(16));
    expect(quarter(4, 4)).toBe('L'.repeat(16));
    expect([...quarter(0, 4)].filter((c) => c === 'D')).toHaveLength(8);
    expect([...quarter(4, 0)].filter((c) => c === 'D')).toHaveLength(8);
  });

  it('1 dark, 1 light in plain weave gives hairlines whose direction follows the phase', () => {
    // Source: colour-and-weave hairlines [edu] — 1 dark 1 light in warp and weft, plain weave;
    // the phase of the colour order against the weave decides warp-wise or weft-wise lines.
    const inPhase = colours(plainWeave(8, 8, repeat([0, 1], 4), repeat([0, 1], 4)));
    // Dark ends are up exactly where picks are dark, so every pick row is one colour: weft-wise lines.
    inPhase.forEach((row, p) => expect(row).toBe((p % 2 === 0 ? 'D' : 'L').repeat(8)));

    const outOfPhase = colours(plainWeave(8, 8, repeat([0, 1], 4), repeat([1, 0], 4)));
    // Shift the weft order by one pick: every end shows one colour all the way up, warp-wise lines.
    outOfPhase.forEach((row) => expect(row).toBe('DLDLDLDL'));
  });
});
