import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { alignDrafts, alignThreads, compareDrafts, comparisonImage, COMPARE_COLOURS, computeDrawdown, DRAFT_SCHEMA_VERSION, type Draft } from '../../../shared/weave';
import { contrastRatio } from '../../helpers/contrast';
import { draftArb } from './arbitraries';

/** Slow oracle: every cell of the larger size, one isUp at a time. */
function changedCells(a: Draft, b: Draft): number {
  const da = computeDrawdown(a);
  const db = computeDrawdown(b);
  let n = 0;
  for (let p = 0; p < Math.max(da.picks, db.picks); p++) {
    for (let e = 0; e < Math.max(da.ends, db.ends); e++) if (da.isUp(e, p) !== db.isUp(e, p)) n++;
  }
  return n;
}

const pair = fc.tuple(draftArb({ maxEnds: 70, maxPicks: 40 }), draftArb({ maxEnds: 70, maxPicks: 40 }));

describe('compareDrafts', () => {
  it('finds nothing between a draft and itself', () => {
    fc.assert(fc.property(draftArb({ maxEnds: 70 }), (d) => {
      expect(compareDrafts(d, structuredClone(d))).toEqual({ ends: [], picks: [], tieup: [], cells: 0 });
    }), { seed: 11, numRuns: 150 });
  });

  it('counts changed drawdown cells as the cell-by-cell oracle does, in either order', () => {
    fc.assert(fc.property(pair, ([a, b]) => {
      const forward = compareDrafts(a, b);
      expect(forward.cells).toBe(changedCells(a, b));
      const back = compareDrafts(b, a);
      expect(back.cells).toBe(forward.cells);
      expect(back.ends).toEqual(forward.ends);
      expect(back.picks).toEqual(forward.picks);
      expect(back.tieup).toEqual(forward.tieup);
    }), { seed: 12, numRuns: 150 });
  });

  it('names exactly the end whose threading moved to another shaft', () => {
    const arb = draftArb({ maxShafts: 8, maxEnds: 50 }).filter((d) => d.threading.length > 0 && d.shafts > 1)
      .chain((d) => fc.tuple(fc.constant(d), fc.integer({ min: 0, max: d.threading.length - 1 })));
    fc.assert(fc.property(arb, ([d, end]) => {
      const moved = structuredClone(d);
      const current = d.threading[end];
      const other = current.length === 1 && current[0] === 1 ? 2 : 1;
      moved.threading[end] = [other];
      expect(compareDrafts(d, moved).ends).toEqual([end]);
      expect(compareDrafts(d, moved).picks).toEqual([]);
    }), { seed: 13, numRuns: 100 });
  });

  it('lists a tie-up cell that was tied or untied, and the picks whose lift it changes', () => {
    const arb = draftArb({ control: 'treadling', maxTreadles: 6 }).filter((d) => d.treadles > 0)
      .chain((d) => fc.tuple(fc.constant(d), fc.integer({ min: 1, max: d.treadles }), fc.integer({ min: 1, max: d.shafts })));
    fc.assert(fc.property(arb, ([d, treadle, shaft]) => {
      const changed = structuredClone(d);
      const tied = changed.tieup[treadle - 1];
      changed.tieup[treadle - 1] = tied.includes(shaft) ? tied.filter((s) => s !== shaft) : [...tied, shaft].sort((x, y) => x - y);
      const result = compareDrafts(d, changed);
      expect(result.tieup).toEqual([{ treadle, shaft }]);
      // A pick changes exactly when the treadles pressed on it make a different lift now.
      const lifts = (x: Draft, p: number) => new Set(x.treadling[p].flatMap((t) => x.tieup[t - 1]));
      const expected = d.treadling.map((_, p) => p).filter((p) => {
        const before = lifts(d, p);
        const after = lifts(changed, p);
        return before.size !== after.size || [...before].some((s) => !after.has(s));
      });
      expect(result.picks).toEqual(expected);
    }), { seed: 14, numRuns: 100 });
  });

  it('counts every end and pick as changed when only the palette is recoloured', () => {
    const d: Draft = {
      schemaVersion: DRAFT_SCHEMA_VERSION, name: 'tabby', shafts: 2, treadles: 2, shed: 'rising', control: 'treadling',
      threading: [[1], [2], [1], [2]], tieup: [[1], [2]], treadling: [[1], [2]], liftplan: [],
      palette: ['#000000', '#ffffff'], warpColors: [0, 0, 0, 0], weftColors: [1, 1], warpLayers: [], weftLayers: [],
      sett: { warp: 10, weft: 10, unit: 'inch' }, yarns: [], notes: '',
    };
    const recoloured = { ...d, palette: ['#aa0000', '#ffffff'] };
    expect(compareDrafts(d, recoloured)).toEqual({ ends: [0, 1, 2, 3], picks: [], tieup: [], cells: 0 });
  });
});

describe('comparisonImage', () => {
  it('paints changed cells in the change colours and the rest faint, one pixel per cell', () => {
    fc.assert(fc.property(pair, ([a, b]) => {
      const img = comparisonImage(a, b);
      const da = computeDrawdown(a);
      const db = computeDrawdown(b);
      expect(img.rgb.length).toBe(img.width * img.height * 3);
      let strong = 0;
      for (let p = 0; p < img.height; p++) {
        for (let e = 0; e < img.width; e++) {
          const px = Array.from(img.rgb.subarray((p * img.width + e) * 3, (p * img.width + e) * 3 + 3));
          const up = [da.isUp(e, p), db.isUp(e, p)];
          const key = up[0] === up[1] ? (up[0] ? 'same-up' : 'same-down') : up[1] ? 'now-up' : 'now-down';
          expect(px).toEqual([...COMPARE_COLOURS[key]]);
          if (up[0] !== up[1]) strong++;
        }
      }
      expect(strong).toBe(changedCells(a, b));
    }), { seed: 15, numRuns: 60 });
  });
});

describe('the difference image reads without colour vision', () => {
  // WCAG 2.2 SC 1.4.11: the parts of a picture that carry meaning 3:1 against what they must be told
  // apart from. The two unchanged tones only hint at the structure and may be closer.
  it('keeps every change at least 3:1 from the unchanged tones and from the other change', () => {
    const c = COMPARE_COLOURS;
    const pairs = [
      [c['now-down'], c['same-up']], [c['now-down'], c['same-down']], [c['now-up'], c['same-up']],
      [c['now-up'], c['same-down']], [c['now-up'], c['now-down']],
    ] as const;
    for (const [a, b] of pairs) expect(contrastRatio(a, b)).toBeGreaterThanOrEqual(3);
    // The pair that once sat too close: changed-to-under against unchanged-over was 1.24:1.
    expect(contrastRatio(c['now-down'], c['same-up'])).toBeCloseTo(3.21, 2);
  });
});

describe('alignDrafts', () => {
  /** A longest common subsequence's length by the textbook table (the oracle for the alignment's matches). */
  function lcsLength(a: readonly string[], b: readonly string[]): number {
    const t = Array.from({ length: a.length + 1 }, () => new Array<number>(b.length + 1).fill(0));
    for (let i = 1; i <= a.length; i++) {
      for (let j = 1; j <= b.length; j++) t[i][j] = a[i - 1] === b[j - 1] ? t[i - 1][j - 1] + 1 : Math.max(t[i - 1][j], t[i][j - 1]);
    }
    return t[a.length][b.length];
  }

  it('accounts for every thread once, and keeps exactly a longest common subsequence unchanged', () => {
    const keys = fc.array(fc.constantFrom('a', 'b', 'c'), { maxLength: 30 });
    fc.assert(fc.property(keys, keys, (a, b) => {
      const r = alignThreads(a, b);
      const keptInB = b.length - r.inserted.length - r.changed.length;
      const keptInA = a.length - r.removed.length - r.changed.length;
      expect(keptInB).toBe(keptInA);
      expect(keptInB).toBe(lcsLength(a, b));
      expect(new Set([...r.inserted, ...r.changed]).size).toBe(r.inserted.length + r.changed.length);
      expect(r.inserted.every((j) => j >= 0 && j < b.length) && r.removed.every((i) => i >= 0 && i < a.length)).toBe(true);
    }), { seed: 16, numRuns: 300 });
  });

  it('reads 48 ends put into the middle of a draft as 48 inserted ends, and nothing else changed', () => {
    const d = straightTwillOf(377);
    const grown = structuredClone(d);
    const block = Array.from({ length: 48 }, (_, i) => [((i * 3) % 4) + 1]);
    grown.threading.splice(200, 0, ...block);
    grown.warpColors.splice(200, 0, ...block.map(() => 1));
    const aligned = alignDrafts(d, grown);
    expect(aligned.ends).toEqual({ inserted: Array.from({ length: 48 }, (_, i) => 200 + i), removed: [], changed: [] });
    expect(aligned.picks).toEqual({ inserted: [], removed: [], changed: [] });
    // Place by place, the inserted ends and the 48 pushed past the old last end all differ.
    expect(compareDrafts(d, grown).ends.length).toBe(96);
    // The other way round the same ends are removed.
    expect(alignDrafts(grown, d).ends).toEqual({ inserted: [], removed: Array.from({ length: 48 }, (_, i) => 200 + i), changed: [] });
  });

  it('pairs a changed end with the end it replaced, and lines picks up the same way', () => {
    const d = straightTwillOf(24);
    const edited = structuredClone(d);
    edited.threading[5] = [edited.threading[5][0] === 1 ? 2 : 1];
    edited.treadling.splice(3, 2);
    const aligned = alignDrafts(d, edited);
    expect(aligned.ends).toEqual({ inserted: [], removed: [], changed: [5] });
    expect(aligned.picks.inserted).toEqual([]);
    expect(aligned.picks.removed).toHaveLength(2);
  });
});

/** A 4-shaft straight twill, `ends` wide and 16 picks long, in two colours. */
function straightTwillOf(ends: number): Draft {
  return {
    schemaVersion: DRAFT_SCHEMA_VERSION, name: 'twill', shafts: 4, treadles: 4, shed: 'rising', control: 'treadling',
    threading: Array.from({ length: ends }, (_, e) => [(e % 4) + 1]), tieup: [[1, 2], [2, 3], [3, 4], [4, 1]],
    treadling: Array.from({ length: 16 }, (_, p) => [(p % 4) + 1]), liftplan: [],
    palette: ['#000000', '#ffffff'], warpColors: Array.from({ length: ends }, () => 0), weftColors: Array.from({ length: 16 }, () => 1),
    warpLayers: [], weftLayers: [], sett: { warp: 10, weft: 10, unit: 'inch' }, yarns: [], notes: '',
  };
}
