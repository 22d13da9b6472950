import fc from 'fast-check';
import { DRAFT_SCHEMA_VERSION, type Draft } from '../../../shared/weave/types';

/** Ascending 1-based numbers of the bits set in a mask. */
const numbersOf = (mask: number, n: number) => Array.from({ length: n }, (_, i) => i + 1).filter((s) => (mask >>> (s - 1)) & 1);

/** Any subset of 1..n, ascending (n ≤ 32). */
export const subsetOf = (n: number): fc.Arbitrary<number[]> =>
  n === 0 ? fc.constant<number[]>([]) : fc.integer({ min: 0, max: 2 ** n - 1 }).map((m) => numbersOf(m, n));

/** Mostly one shaft per end, as weavers thread; sometimes none or several. */
const threadingEntry = (shafts: number): fc.Arbitrary<number[]> =>
  fc.oneof(
    { weight: 8, arbitrary: fc.integer({ min: 1, max: shafts }).map((s) => [s]) },
    { weight: 1, arbitrary: fc.constant<number[]>([]) },
    { weight: 1, arbitrary: subsetOf(shafts) },
  );

const hex = fc.integer({ min: 0, max: 0xffffff }).map((n) => `#${n.toString(16).padStart(6, '0')}`);

export interface DraftArbOptions {
  maxShafts?: number;
  maxTreadles?: number;
  maxEnds?: number;
  maxPicks?: number;
  /** Force one way of controlling the picks. */
  control?: Draft['control'];
  /** Most layers used; 1 gives single-layer drafts with empty layer lists. */
  maxLayers?: number;
}

/** Valid, fully normalised drafts (every list at its full length), as parseDraft returns them. */
export function draftArb(options: DraftArbOptions = {}): fc.Arbitrary<Draft> {
  const { maxShafts = 8, maxTreadles = 8, maxEnds = 40, maxPicks = 40, maxLayers = 3 } = options;
  return fc
    .record({
      shafts: fc.integer({ min: 1, max: maxShafts }),
      treadles: fc.integer({ min: 0, max: maxTreadles }),
      ends: fc.integer({ min: 0, max: maxEnds }),
      picks: fc.integer({ min: 0, max: maxPicks }),
      paletteSize: fc.integer({ min: 1, max: 6 }),
      control: options.control ? fc.constant(options.control) : fc.constantFrom<Draft['control']>('treadling', 'liftplan'),
      shed: fc.constantFrom<Draft['shed']>('rising', 'sinking'),
      layers: fc.integer({ min: 1, max: maxLayers }),
    })
    .chain((b) => {
      const picksWhere = (c: Draft['control']) => (b.control === c ? b.picks : 0);
      const layerList = (n: number) => (b.layers === 1 ? fc.constant<number[]>([]) : fc.array(fc.integer({ min: 1, max: b.layers }), { minLength: n, maxLength: n }));
      const treadlingPicks = picksWhere('treadling');
      return fc.record({
        schemaVersion: fc.constant(DRAFT_SCHEMA_VERSION),
        name: fc.string({ maxLength: 30 }),
        shafts: fc.constant(b.shafts),
        treadles: fc.constant(b.treadles),
        shed: fc.constant(b.shed),
        control: fc.constant(b.control),
        threading: fc.array(threadingEntry(b.shafts), { minLength: b.ends, maxLength: b.ends }),
        tieup: fc.array(subsetOf(b.shafts), { minLength: b.treadles, maxLength: b.treadles }),
        treadling: fc.array(b.treadles === 0 ? fc.constant<number[]>([]) : subsetOf(Math.min(b.treadles, 8)).map((t) => t.slice(0, 3)), {
          minLength: treadlingPicks,
          maxLength: treadlingPicks,
        }),
        liftplan: fc.array(subsetOf(b.shafts), { minLength: picksWhere('liftplan'), maxLength: picksWhere('liftplan') }),
        palette: fc.array(hex, { minLength: b.paletteSize, maxLength: b.paletteSize }),
        warpColors: fc.array(fc.integer({ min: 0, max: b.paletteSize - 1 }), { minLength: b.ends, maxLength: b.ends }),
        weftColors: fc.array(fc.integer({ min: 0, max: b.paletteSize - 1 }), { minLength: b.picks, maxLength: b.picks }),
        warpLayers: layerList(b.ends),
        weftLayers: layerList(b.picks),
        sett: fc.record({
          warp: fc.integer({ min: 1, max: 2000 }).map((n) => n / 20),
          weft: fc.integer({ min: 1, max: 2000 }).map((n) => n / 20),
          unit: fc.constantFrom<'inch' | 'cm'>('inch', 'cm'),
        }),
        yarns: fc.constant<Draft['yarns']>([]),
        notes: fc.string({ maxLength: 60 }),
      });
    });
}
