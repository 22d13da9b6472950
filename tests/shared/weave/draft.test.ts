import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_PALETTE,
  DEFAULT_SETT,
  DraftError,
  checkDocumentShape,
  createDraft,
  draftDocumentSchema,
  draftSchema,
  emptyDraft,
  parseDraft,
} from '../../../shared/weave/draft';
import { asLists, straightDraw } from '../../../shared/weave/sequences';
import { DRAFT_SCHEMA_VERSION, type Draft } from '../../../shared/weave/types';
import { draftArb } from './arbitraries';

function problemsOf(json: unknown): string[] {
  try {
    parseDraft(json);
  } catch (err) {
    if (err instanceof DraftError) return err.problems.map((p) => p.message);
    throw err;
  }
  return [];
}

const clone = (d: Draft): Draft => structuredClone(d);

/** A way to break a valid draft, and the words the problem must contain. */
type Mutation = { apply: (d: Draft) => void; expected: string };

function mutationArb(d: Draft): fc.Arbitrary<Mutation> {
  const options: fc.Arbitrary<Mutation>[] = [];
  const index = (n: number) => fc.integer({ min: 0, max: n - 1 });
  const ends = d.threading.length;
  const picks = d.control === 'liftplan' ? d.liftplan.length : d.treadling.length;
  if (ends > 0 && d.shafts < 32) {
    options.push(index(ends).map((i) => ({
      apply: (m) => void (m.threading[i] = [d.shafts + 1]),
      expected: `threading end ${i + 1}: shaft ${d.shafts + 1} but the draft has ${d.shafts} shaft`,
    })));
  }
  if (ends > 0) {
    options.push(index(ends).map((i) => ({ apply: (m) => void (m.warpColors[i] = d.palette.length), expected: `warp colours end ${i + 1}: colour ${d.palette.length}` })));
    options.push(index(ends).map((i) => ({ apply: (m) => void (m.threading[i] = [0]), expected: `threading end ${i + 1}: shaft 0` })));
  }
  // An empty list means "defaults", so a short list needs at least one entry left.
  if (ends > 1) options.push(fc.constant({ apply: (m: Draft) => void m.warpColors.pop(), expected: `warp colours: has ${ends - 1} ` }));
  if (picks > 0 && d.control === 'treadling' && d.treadles < 32) {
    options.push(index(picks).map((i) => ({
      apply: (m) => void (m.treadling[i] = [d.treadles + 1]),
      expected: `treadling pick ${i + 1}: treadle ${d.treadles + 1} but the draft has ${d.treadles} treadle`,
    })));
  }
  if (picks > 0 && d.control === 'liftplan') {
    options.push(index(picks).map((i) => ({ apply: (m) => void (m.liftplan[i] = [1, 1]), expected: `lift plan pick ${i + 1}: shaft 1 is listed twice` })));
  }
  if (picks > 0) {
    options.push(index(picks).map((i) => ({ apply: (m) => void (m.weftColors[i] = -1), expected: `weft colours pick ${i + 1}: a colour index cannot be negative` })));
    options.push(index(picks).map((i) => ({
      apply: (m) => void (m.weftLayers = new Array<number>(picks).fill(1).map((v, j) => (j === i ? 0 : v))),
      expected: `weft layers pick ${i + 1}: layer 0`,
    })));
  }
  if (d.treadles > 0) {
    options.push(index(d.treadles).map((i) => ({ apply: (m) => void (m.tieup[i] = [1.5]), expected: `tie-up treadle ${i + 1}: a shaft must be a whole number` })));
  }
  options.push(index(d.palette.length).map((i) => ({ apply: (m) => void (m.palette[i] = 'red'), expected: `palette colour ${i + 1}: "red" is not a colour` })));
  options.push(fc.constant({ apply: (m: Draft) => void (m.shafts = 33), expected: 'shafts: 33 shafts is more than 32' }));
  return fc.oneof(...options);
}

describe('parseDraft', () => {
  it('accepts every generated valid draft and returns it unchanged', () => {
    fc.assert(
      fc.property(draftArb({ maxShafts: 32, maxTreadles: 32 }), (draft) => {
        expect(parseDraft(JSON.parse(JSON.stringify(draft)))).toEqual(draft);
      }),
    );
  });

  it('rejects a mutated draft with a message naming the position', () => {
    const withMutation = draftArb({ maxShafts: 31, maxTreadles: 8 }).chain((d) => mutationArb(d).map((m) => ({ d, m })));
    fc.assert(
      fc.property(withMutation, ({ d, m }) => {
        const broken = clone(d);
        m.apply(broken);
        const problems = problemsOf(broken);
        expect(problems.some((p) => p.startsWith(m.expected)), `${problems.join(' | ')} should include ${m.expected}`).toBe(true);
      }),
    );
  });

  it('lists every problem at once, not only the first', () => {
    const problems = problemsOf({
      schemaVersion: 1,
      shafts: 8,
      threading: [...asLists(straightDraw(8, 4)), [1], [2], [3], [4], [9]],
      treadles: 2,
      tieup: [[1], [2, 2]],
      treadling: [[3]],
      palette: ['#000000'],
      weftColors: [4],
      colour: 'blue',
    });
    expect(problems).toEqual(
      expect.arrayContaining([
        'threading end 37: shaft 9 but the draft has 8 shafts',
        'tie-up treadle 2: shaft 2 is listed twice',
        'treadling pick 1: treadle 3 but the draft has 2 treadles',
        'weft colours pick 1: colour 4 is not in the palette (its colours are numbered 0 to 0)',
        'draft: unknown field "colour"',
      ]),
    );
    expect(problems).toHaveLength(5);
  });

  it('names missing fields and a version it does not read', () => {
    expect(problemsOf({})).toEqual(['schemaVersion: is missing', 'shafts: is missing', 'threading: is missing']);
    expect(problemsOf({ schemaVersion: DRAFT_SCHEMA_VERSION + 1, shafts: 4, threading: [] })).toEqual([
      `schemaVersion: ${DRAFT_SCHEMA_VERSION + 1} is not a version this program reads (it reads ${DRAFT_SCHEMA_VERSION})`,
    ]);
    expect(problemsOf('not a draft')).toEqual(['draft: a draft must be a JSON object']);
  });

  it('enforces the limits: 1–32 shafts, 0–32 treadles, at most 20000 ends and picks', () => {
    expect(problemsOf({ schemaVersion: 1, shafts: 0, threading: [] })).toEqual(['shafts: a draft needs at least 1 shaft']);
    expect(problemsOf({ schemaVersion: 1, shafts: 4, treadles: 33, threading: [] })[0]).toMatch(/^treadles: 33 treadles is more than 32/);
    expect(problemsOf({ schemaVersion: 1, shafts: 4, threading: new Array(20_001).fill([1]) })).toEqual([
      'threading: has 20001 entries; a draft can have at most 20000',
    ]);
    expect(problemsOf({ schemaVersion: 1, shafts: 4, threading: new Array(20_000).fill([1]) })).toEqual([]);
  });

  it('requires one colour per end, or none, rather than repeating a short colour order', () => {
    const base = { schemaVersion: 1, shafts: 2, threading: [[1], [2], [1], [2]] };
    expect(problemsOf({ ...base, warpColors: [0, 1] })).toEqual([
      'warp colours: has 2 entries but the draft has 4 ends (give one per end, or leave it empty)',
    ]);
    expect(parseDraft({ ...base, warpColors: [] }).warpColors).toEqual([0, 0, 0, 0]);
  });

  it('fills defaults for omitted optional fields', () => {
    const d = parseDraft({ schemaVersion: 1, shafts: 4, threading: [[1], [2]], treadles: 1, treadling: [[1], []] });
    expect(d).toEqual({
      schemaVersion: DRAFT_SCHEMA_VERSION, // a format-1 document, upgraded
      name: 'Untitled draft',
      shafts: 4,
      treadles: 1,
      shed: 'rising',
      control: 'treadling',
      threading: [[1], [2]],
      tieup: [[]],
      treadling: [[1], []],
      liftplan: [],
      palette: [...DEFAULT_PALETTE],
      warpColors: [0, 0],
      weftColors: [1, 1],
      warpLayers: [],
      weftLayers: [],
      sett: { ...DEFAULT_SETT },
      yarns: [],
      notes: '',
    });
    // A lift plan alone controls the picks.
    expect(parseDraft({ schemaVersion: 1, shafts: 2, threading: [], liftplan: [[1]] }).control).toBe('liftplan');
    expect(problemsOf({ schemaVersion: 1, shafts: 2, threading: [], liftplan: [[1]], treadles: 1, treadling: [[1]] })).toEqual([
      'control: is missing, and the draft has both a treadling and a lift plan: say which one the picks follow',
    ]);
  });

  it('normalises palette colours to lower case', () => {
    expect(parseDraft({ schemaVersion: 1, shafts: 1, threading: [], palette: ['#ABCDEF'] }).palette).toEqual(['#abcdef']);
  });
});

describe('checkDocumentShape (the quick check of the number lists)', () => {
  // Mostly sound entries, now and then one value at or past a limit (shafts 1–32, layers 1–16, colours
  // from 0), a fraction, an unsafe whole number, text, null, a list or an object: so that a list is often
  // wrong in just one place.
  const limit = fc.constantFrom(0, -1, 16, 17, 32, 33);
  const odd = fc.constantFrom(0.5, 1.5, 2 ** 53, 2 ** 60, 1e308, '1', null, true, {}, [1]);
  const entry = fc.oneof({ arbitrary: fc.integer({ min: 1, max: 8 }), weight: 12 }, { arbitrary: limit, weight: 2 }, { arbitrary: odd, weight: 1 });
  const notAList = fc.constantFrom('x', null, 3, {});
  const list = fc.oneof({ arbitrary: fc.array(entry, { maxLength: 6 }), weight: 12 }, { arbitrary: notAList, weight: 1 });
  const listOfLists = fc.oneof({ arbitrary: fc.array(list, { maxLength: 6 }), weight: 12 }, { arbitrary: notAList, weight: 1 });
  const field = fc.constantFrom('threading', 'tieup', 'treadling', 'liftplan', 'warpColors', 'weftColors', 'warpLayers', 'weftLayers', 'extra');

  it('accepts exactly what draftDocumentSchema accepts, with the same data', () => {
    fc.assert(fc.property(draftArb(), fc.array(fc.tuple(field, list, listOfLists), { maxLength: 3 }), (draft, changes) => {
      const json: Record<string, unknown> = JSON.parse(JSON.stringify(draft));
      for (const [name, flat, nested] of changes) {
        json[name] = ['threading', 'tieup', 'treadling', 'liftplan'].includes(name) ? nested : flat;
      }
      const quick = checkDocumentShape(json);
      const full = draftDocumentSchema.safeParse(json);
      expect(quick.success).toBe(full.success);
      if (full.success) expect(quick.data).toEqual(full.data);
      else expect(quick.error?.issues).toEqual(full.error.issues);
    }), { numRuns: 1500, seed: 11 });
  });

  it('refuses lists longer than the limits and holes in a list', () => {
    const sparse: number[][] = [[1]];
    sparse[2] = [1];
    for (const threading of [Array.from({ length: 20_001 }, () => [1]), sparse]) {
      expect(checkDocumentShape({ schemaVersion: 1, shafts: 2, threading }).success).toBe(false);
      expect(draftDocumentSchema.safeParse({ schemaVersion: 1, shafts: 2, threading }).success).toBe(false);
    }
  });
});

describe('draftSchema', () => {
  it('reports the same problems as zod issues', () => {
    const result = draftSchema.safeParse({ schemaVersion: 1, shafts: 8, threading: [[9]] });
    expect(result.success).toBe(false);
    expect(result.error?.issues.map((i) => i.message)).toEqual(['threading end 1: shaft 9 but the draft has 8 shafts']);
    expect(draftSchema.parse({ schemaVersion: 1, shafts: 2, threading: [[1]] }).warpColors).toEqual([0]);
  });
});

describe('createDraft and emptyDraft', () => {
  it('builds valid drafts with defaults', () => {
    const e = emptyDraft(8, 10);
    expect([e.shafts, e.treadles, e.tieup.length, e.threading.length]).toEqual([8, 10, 10, 0]);
    const d = createDraft({ shafts: 2, threading: [[1], [2]], treadles: 2, tieup: [[1], [2]], treadling: [[1], [2]] });
    expect(d.weftColors).toEqual([1, 1]);
    expect(() => createDraft({ shafts: 2, threading: [[3]] })).toThrow(DraftError);
  });
});

describe('docs/draft-format.md', () => {
  it('gives examples that parse to the same 2/2 twill', async () => {
    const { readFile } = await import('node:fs/promises');
    const text = await readFile(new URL('../../../docs/draft-format.md', import.meta.url), 'utf8');
    const blocks = [...text.matchAll(/```json\n([\s\S]*?)```/g)].map((m) => parseDraft(JSON.parse(m[1])));
    expect(blocks).toHaveLength(2);
    const [full, short] = blocks;
    expect(full.threading.slice(0, 4)).toEqual(short.threading);
    expect(full.tieup).toEqual(short.tieup);
    expect(full.weftColors).toEqual([1, 1, 1, 1, 2, 1, 1, 1]);
  });
});
