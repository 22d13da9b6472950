import fc from 'fast-check';
import { afterAll, describe, expect, it } from 'vitest';
import { DraftError, fromWif, parseDraft, toWif, WifError, type Draft } from '../../../shared/weave';
import { MAX_SHAFTS, MAX_THREADS } from '../../../shared/weave/types';
import { draftArb } from './arbitraries';

/*
 * Bad input for the two importers: whatever arrives, parseDraft gives a valid draft or a DraftError,
 * and fromWif a valid draft or a WifError; never another exception, and never slowly. Each input is
 * timed on its own: the importers are synchronous, so a slow input is caught by its time, not a timer.
 */

/** Longest one input may take; the largest inputs here are a few MB of text or 10^5-element arrays. */
const BOUND_MS = 3000;
const counts = { parseDraft: 0, fromWif: 0 };

afterAll(() => {
  console.log(`importers fuzz: parseDraft ${counts.parseDraft} inputs, fromWif ${counts.fromWif} inputs`);
});

/** A valid draft, as stored (JSON, where -0 becomes 0), parses back to itself. */
function expectValidDraft(d: Draft) {
  const stored = JSON.parse(JSON.stringify(d)) as unknown;
  expect(parseDraft(stored)).toEqual(stored);
}

/**
 * Runs one importer on one input: it must return a valid draft or throw its own error type (with a
 * message), within the time bound.
 */
function checkImporter<I>(importer: keyof typeof counts, run: (input: I) => Draft, own: typeof DraftError | typeof WifError, input: I) {
  counts[importer] += 1;
  const started = performance.now();
  let result: Draft | undefined;
  try {
    result = run(input);
  } catch (err) {
    if (!(err instanceof own)) throw new Error(`${importer} threw ${String(err)} instead of a ${own.name}`, { cause: err });
    else expect(err.message.length).toBeGreaterThan(0);
  }
  expect(performance.now() - started).toBeLessThan(BOUND_MS);
  if (result) expectValidDraft(result);
}

const checkParseDraft = (input: unknown) => checkImporter('parseDraft', parseDraft, DraftError, input);
const checkFromWif = (text: string) => checkImporter('fromWif', fromWif, WifError, text);

/** An array nested `depth` deep, built without recursion so the test itself cannot overflow. */
function nested(depth: number, leaf: unknown = 1): unknown {
  let v: unknown = leaf;
  for (let i = 0; i < depth; i++) v = [v];
  return v;
}

// ---------------------------------------------------------------- JSON documents

/** Values of the wrong kind, out-of-range numbers, long and malformed text, and deep nesting. */
const junk: fc.Arbitrary<unknown> = fc.oneof(
  fc.constantFrom<unknown>(null, undefined, true, false, '', '1', '#zzzzzz', [], {}, [[]], [null], [{}], { length: 3 }),
  fc.constantFrom(0, -0, -1, 0.5, 1.5, 33, 2 ** 31, 2 ** 53, 2 ** 53 + 2, -(2 ** 53), 1e21, 1e308, -1e308, Number.MAX_VALUE,
    Number.MIN_VALUE, Number.EPSILON, NaN, Infinity, -Infinity, MAX_THREADS + 1),
  fc.double(),
  fc.integer(),
  fc.string({ unit: 'binary', maxLength: 50 }),
  fc.integer({ min: 1000, max: 200_000 }).map((n) => 'x'.repeat(n)),
  // Lone surrogates: text no UTF-8 encoder can write as it stands.
  fc.constantFrom('\uD800', '\uDFFF', 'a\uD834b', '\u0000', '\uFEFF', '\u202E'),
  // Deeper nesting is tried outside fast-check, whose report of a failing value would itself overflow.
  fc.integer({ min: 2, max: 1000 }).map((d) => nested(d)),
  fc.anything({ maxDepth: 3 }),
);

const DRAFT_KEYS = ['schemaVersion', 'name', 'shafts', 'treadles', 'shed', 'control', 'threading', 'tieup', 'treadling', 'liftplan',
  'palette', 'warpColors', 'weftColors', 'warpLayers', 'weftLayers', 'sett', 'yarns', 'notes', 'blocks', '__proto__', 'constructor'];

/** A valid draft with one part replaced: a whole field, one list element, or something inside one. */
const mutatedDraft: fc.Arbitrary<unknown> = fc
  .record({ draft: draftArb({ maxShafts: 32, maxTreadles: 32, maxEnds: 30, maxPicks: 30 }), key: fc.constantFrom(...DRAFT_KEYS), value: junk, where: fc.nat(), depth: fc.constantFrom(0, 1, 2) })
  .map(({ draft, key, value, where, depth }) => {
    const doc = JSON.parse(JSON.stringify(draft)) as Record<string, unknown>;
    const field = doc[key];
    if (depth > 0 && Array.isArray(field) && field.length > 0) {
      const i = where % field.length;
      const inner = field[i];
      if (depth === 2 && Array.isArray(inner) && inner.length > 0) inner[where % inner.length] = value;
      else field[i] = value;
    } else if (key === '__proto__' || key === 'constructor') {
      // The way such a key arrives from JSON: an own property, not the prototype.
      Object.defineProperty(doc, key, { value, enumerable: true, configurable: true, writable: true });
    } else {
      doc[key] = value;
    }
    return doc;
  });

/**
 * Lists longer than the engine's 20 000 ends, or with every shaft on every end, up to about what the
 * API's 2 MB body limit lets through (config bodyLimit): 200 000 one-number entries, or 21 000 of 32.
 */
const hugeDraft: fc.Arbitrary<unknown> = fc
  .record({ width: fc.constantFrom(1, 32), key: fc.constantFrom('threading', 'treadling', 'liftplan', 'warpColors', 'tieup') })
  .chain((r) => fc.integer({ min: MAX_THREADS - 2, max: r.width === 1 ? 200_000 : MAX_THREADS + 1000 }).map((n) => ({ ...r, n })))
  .map(({ n, width, key }) => {
    const entry = key === 'warpColors' ? 0 : Array.from({ length: width }, (_, i) => (i % MAX_SHAFTS) + 1);
    return { schemaVersion: 1, name: 'huge', shafts: MAX_SHAFTS, treadles: 32, control: 'liftplan', [key]: new Array(n).fill(entry) };
  });

describe('parseDraft on bad input', () => {
  it('any JavaScript value at all: a draft or a DraftError', () => {
    fc.assert(fc.property(fc.anything({ maxDepth: 5, withNullPrototype: true, withObjectString: true, withSparseArray: true }), checkParseDraft), { numRuns: 1500 });
  });

  it('anything JSON.parse can give, including "__proto__" keys', () => {
    fc.assert(fc.property(fc.json({ maxDepth: 6 }), (text) => checkParseDraft(JSON.parse(text))), { numRuns: 1000 });
  });

  it('valid drafts with one part replaced by junk', () => {
    fc.assert(fc.property(mutatedDraft, checkParseDraft), { numRuns: 2000 });
  }, 60_000);

  it('huge lists and deep nesting', () => {
    fc.assert(fc.property(hugeDraft, checkParseDraft), { numRuns: 40 });
    for (const depth of [1000, 10_000, 100_000]) {
      checkParseDraft(nested(depth));
      checkParseDraft({ schemaVersion: 1, shafts: 4, threading: nested(depth) });
      checkParseDraft({ schemaVersion: 1, shafts: 4, threading: [nested(depth)], yarns: [nested(depth, {})] });
    }
  }, 120_000);
});

// ---------------------------------------------------------------- WIF text

const SECTIONS = ['WIF', 'CONTENTS', 'TEXT', 'WEAVING', 'WARP', 'WEFT', 'COLOR PALETTE', 'COLOR TABLE', 'THREADING', 'TIEUP',
  'TREADLING', 'LIFTPLAN', 'WARP COLORS', 'WEFT COLORS', 'NOTES', 'PRIVATE SHEDWRIGHT WARP LAYERS', 'PRIVATE SHEDWRIGHT WEFT LAYERS'];
const KEYS = ['Version', 'Shafts', 'Treadles', 'Threads', 'Rising Shed', 'Range', 'Entries', 'Color', 'Spacing', 'Units', 'Title', 'Date'];

/** Numbers a reader can choke on: signs, decimals, hex, exponents, and far beyond any limit. */
const numberText = fc.oneof(
  fc.integer({ min: -5, max: 40 }).map(String),
  fc.constantFrom('0', '-0', '+3', '1.5', '0x10', '1e3', '99999999999999999999', '9007199254740993', '20001', '1e309', 'NaN', 'Infinity', '', ' '),
);
const listText = fc.array(numberText, { maxLength: 40 }).map((parts) => parts.join(','));
const valueText = fc.oneof(numberText, listText, fc.string({ maxLength: 30 }), fc.constantFrom('true', 'no', '"quoted', '"a"', "'x'", '0,255', '255,0', 'Decipoints', 'Centimeters'),
  fc.integer({ min: 1000, max: 100_000 }).map((n) => '1,'.repeat(n)));
const keyText = fc.oneof(fc.constantFrom(...KEYS), fc.integer({ min: -2, max: 25_000 }).map(String), fc.string({ maxLength: 10 }), fc.constant('99999999999999999999'));
const sectionName = fc.oneof({ weight: 4, arbitrary: fc.constantFrom(...SECTIONS) }, { weight: 1, arbitrary: fc.string({ maxLength: 12 }) });
const line = fc.oneof(
  { weight: 6, arbitrary: fc.tuple(keyText, valueText).map(([k, v]) => `${k}=${v}`) },
  { weight: 2, arbitrary: sectionName.map((s) => `[${s}]`) },
  { weight: 1, arbitrary: fc.constantFrom('', ';comment', '[', ']', '=', '==', '[WIF', 'no equals sign', '\uFEFF[WIF]') },
);
const eol = fc.constantFrom('\n', '\r\n', '\r');

/** Lines in WIF's shape with junk in them, starting with [WIF] most of the time. */
const wifLike = fc.tuple(fc.boolean(), fc.array(line, { maxLength: 60 }), eol)
  .map(([header, lines, nl]) => [...(header ? ['[WIF]', 'Version=1.1'] : []), ...lines].join(nl));

/** A file this engine wrote, then damaged line by line. */
const damagedWif = fc.tuple(draftArb({ maxShafts: 32, maxTreadles: 32 }), fc.array(fc.tuple(fc.nat(), fc.constantFrom('drop', 'repeat', 'swap', 'junk', 'cut'), line), { minLength: 1, maxLength: 6 }))
  .map(([draft, edits]) => {
    const lines = toWif(draft, { date: new Date(Date.UTC(2025, 0, 1)) }).split('\n');
    for (const [at, op, junkLine] of edits) {
      const i = at % lines.length;
      if (op === 'drop') lines.splice(i, 1);
      else if (op === 'repeat') lines.splice(i, 0, lines[i]);
      else if (op === 'swap') [lines[i], lines[(i + 1) % lines.length]] = [lines[(i + 1) % lines.length], lines[i]];
      else if (op === 'junk') lines[i] = junkLine;
      else lines[i] = lines[i].slice(0, at % (lines[i].length + 1));
    }
    return lines.join('\n');
  });

/** Bytes that are not valid UTF-8 (or are UTF-16), read the ways an upload might be decoded. */
const badEncoding = fc.tuple(fc.uint8Array({ maxLength: 400 }), fc.constantFrom('utf-8', 'latin1', 'utf-16le'), fc.boolean())
  .map(([bytes, encoding, prefix]) => {
    const body = Buffer.concat([prefix ? Buffer.from('[WIF]\nVersion=1.1\n[WEAVING]\nShafts=') : Buffer.alloc(0), Buffer.from(bytes)]);
    return new TextDecoder(encoding === 'latin1' ? 'latin1' : encoding).decode(body);
  });

describe('fromWif on bad input', () => {
  it('arbitrary text, including lone surrogates: a draft or a WifError', () => {
    fc.assert(fc.property(fc.string({ unit: 'binary', maxLength: 300 }), checkFromWif), { numRuns: 1000 });
  });

  it('bad encodings', () => {
    fc.assert(fc.property(badEncoding, checkFromWif), { numRuns: 1000 });
  });

  it('WIF-shaped lines full of junk', () => {
    fc.assert(fc.property(wifLike, checkFromWif), { numRuns: 2000 });
  }, 60_000);

  it('files this engine wrote, damaged', () => {
    fc.assert(fc.property(damagedWif, checkFromWif), { numRuns: 1000 });
  }, 60_000);

  it('huge section and entry counts', () => {
    const full = Array.from({ length: MAX_SHAFTS }, (_, i) => i + 1).join(',');
    const numbered = (n: number, value: string) => Array.from({ length: n }, (_, i) => `${i + 1}=${value}`).join('\n');
    const head = `[WIF]\nVersion=1.1\n[WEAVING]\nShafts=${MAX_SHAFTS}\nTreadles=32\n`;
    const inputs = [
      // Every end on every shaft, and a full lift plan: the most numbers a valid-sized file can carry.
      `${head}[WARP]\nThreads=${MAX_THREADS}\n[THREADING]\n${numbered(MAX_THREADS, full)}\n[WEFT]\nThreads=${MAX_THREADS}\n[LIFTPLAN]\n${numbered(MAX_THREADS, full)}\n`,
      `${head}[TIEUP]\n${numbered(32, full)}\n[TREADLING]\n${numbered(MAX_THREADS, Array.from({ length: 32 }, (_, i) => i + 1).join(','))}\n`,
      `${head}[THREADING]\n${numbered(MAX_THREADS + 1, '1')}\n`,
      `${head}[THREADING]\n1=${'1,'.repeat(1_000_000)}\n`,
      `${head}${Array.from({ length: 20_000 }, (_, i) => `[SECTION ${i}]\nkey=value`).join('\n')}\n`,
      `${head}${'[THREADING]\n'.repeat(50_000)}`,
      `${head}[COLOR PALETTE]\nEntries=1024\nRange=0,255\n[COLOR TABLE]\n${numbered(1024, '255,255,255')}\n`,
      `${head}[NOTES]\n${numbered(50_000, 'x'.repeat(40))}\n`,
      `${head}[TEXT]\nTitle=${'\uD800'.repeat(100_000)}\n`,
      '[WIF]\n'.repeat(200_000),
    ];
    for (const text of inputs) checkFromWif(text);
  }, 120_000);
});

describe('defects this fuzzing found in the WIF reader, kept as regressions', () => {
  it('a numbered key beyond any limit, in a section whose size comes from its highest key, is a WifError', () => {
    expect(() => fromWif('[WIF]\nVersion=1.1\n[PRIVATE SHEDWRIGHT WEFT LAYERS]\n99999999999999999999=1\n')).toThrow(WifError);
  });

  it('a lift plan with every shaft on every pick reads without overflowing the stack', () => {
    const full = Array.from({ length: MAX_SHAFTS }, (_, i) => i + 1).join(',');
    const picks = Array.from({ length: MAX_THREADS }, (_, i) => `${i + 1}=${full}`).join('\n');
    expect(fromWif(`[WIF]\n[WEAVING]\nShafts=${MAX_SHAFTS}\n[WEFT]\nThreads=${MAX_THREADS}\n[LIFTPLAN]\n${picks}\n`).liftplan).toHaveLength(MAX_THREADS);
  });
});
