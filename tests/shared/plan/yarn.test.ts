// Check values come from the published sources named beside each one (a standard, a book or an article);
// a fact of the trade with no published source says "common practice".
// (the standards and articles themselves were not re-read for these tests).
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { unit } from 'mathjs';
import {
  COUNT_SYSTEMS,
  allCounts,
  convertCount,
  fromMetresPerKg,
  massKg,
  parseYarn,
  toMetresPerKg,
  type CountSystem,
  type ParsedYarn,
} from '../../../shared/plan/yarn';

/** Reads a count and returns its yd/lb, failing the test on a parse error. */
function ydPerLb(text: string): number {
  return fromMetresPerKg('ydPerLb', count(text).metresPerKg);
}
function count(text: string): Extract<ParsedYarn, { kind: 'count' }> {
  const r = parseYarn(text);
  if (!r.ok) throw new Error(r.error);
  if (r.yarn.kind !== 'count') throw new Error('expected a count');
  return r.yarn;
}

describe('count systems against ASTM D2260 Table 1', () => {
  it('Ne 10 is worsted 15', () => {
    // Source: ASTM D2260 Table 1 — ASTM's own example
    expect(convertCount(10, 'ne', 'worsted')).toBeCloseTo(15, 10);
  });

  it('30 tex is Ne 19.7', () => {
    // Source: ASTM D2260 Table 1 — ASTM's own example
    expect(convertCount(30, 'tex', 'ne')).toBeCloseTo(19.7, 1);
  });

  it('keeps the relations of the table', () => {
    // Source: ASTM D2260 Table 1 — relations between the systems, for a few counts.
    for (const ne of [1, 4, 8, 19.7, 60]) {
      const mpk = toMetresPerKg('ne', ne);
      expect(fromMetresPerKg('ydPerLb', mpk)).toBeCloseTo(840 * ne, 8); // yd/lb = 840·Ne
      expect(fromMetresPerKg('worsted', mpk)).toBeCloseTo(1.5 * ne, 10); // worsted = 1.5·Ne
      expect(fromMetresPerKg('run', mpk)).toBeCloseTo(0.525 * ne, 10); // run = 0.525·Ne
      expect(fromMetresPerKg('lea', mpk)).toBeCloseTo(2.8 * ne, 10); // lea = 2.8·Ne
      const nm = fromMetresPerKg('nm', mpk);
      expect(ne / nm).toBeCloseTo(0.590541, 6); // Ne = 0.590541·Nm
      expect(fromMetresPerKg('ydPerLb', mpk) / nm).toBeCloseTo(496.055, 3); // yd/lb = 496.055·Nm
      const tex = fromMetresPerKg('tex', mpk);
      expect(tex * ne).toBeCloseTo(590.541, 3); // tex = 590.541 / Ne
      expect(tex * nm).toBeCloseTo(1000, 8); // tex = 1000 / Nm
      expect(fromMetresPerKg('denier', mpk) / tex).toBeCloseTo(9, 10); // denier = 9·tex
    }
  });

  it('tex is grams per 1000 m', () => {
    // Source: ISO 1144 (tex system definition): 1000 m of a 30 tex yarn weighs 30 g.
    expect(massKg(1000, toMetresPerKg('tex', 30)) * 1000).toBeCloseTo(30, 10);
    // Source: ASTM D2260 Table 1 — denier is grams per 9000 m.
    expect(massKg(9000, toMetresPerKg('denier', 150)) * 1000).toBeCloseTo(150, 10);
  });
});

describe('independent re-derivation with mathjs units', () => {
  // Reference: mathjs unit definitions (yard, pound, metre, kilogram), independent of our constants.
  const mPerKgFromYdLb = (yd: number) => unit(yd, 'yd').toNumber('m') / unit(1, 'lb').toNumber('kg');

  it('yd/lb ↔ m/kg agree with mathjs', () => {
    for (const yd of [840, 1260, 3360, 8400]) {
      expect(toMetresPerKg('ydPerLb', yd)).toBeCloseTo(mPerKgFromYdLb(yd), 6);
    }
  });

  it('Nm and cotton count agree with mathjs', () => {
    // Nm = km per kg; Ne = 840-yd hanks per lb (ASTM D2260 definitions), converted by mathjs.
    const nePerNm = (unit(1, 'km').toNumber('yd') / 840) / unit(1, 'kg').toNumber('lb');
    expect(convertCount(1, 'nm', 'ne')).toBeCloseTo(nePerNm, 10);
    const texOfNe = (ne: number) => unit(1, 'kg').toNumber('g') / (unit(840 * ne, 'yd').toNumber('km') / unit(1, 'lb').toNumber('kg'));
    expect(convertCount(10, 'ne', 'tex')).toBeCloseTo(texOfNe(10), 8);
  });

  it('every system agrees with mathjs for a 2/10 worsted', () => {
    const mpk = mPerKgFromYdLb(2800);
    const counts = allCounts(mpk);
    expect(counts.worsted).toBeCloseTo(5, 8);
    expect(counts.tex).toBeCloseTo(unit(1, 'kg').toNumber('g') / (mpk / 1000), 8);
  });
});

describe('plied yarns from a weaver’s text', () => {
  it.each([
    // Source: ASTM D2260, Table 1 — plied: yd/lb = standard × size ÷ plies (ASTM D2260 bases)
    ['8/2 cotton', 3360],
    ['10/2 cotton', 4200],
    ['20/2 cotton', 8400],
    ['3/2 cotton', 1260],
    ['20/2 linen', 3000],
    ['2/10 worsted', 2800],
    ['Ne 8/2', 3360],
    ['cotton 10/2', 4200],
  ])('%s = %d yd/lb', (text, expected) => {
    expect(ydPerLb(text)).toBeCloseTo(expected, 6);
  });

  it('reads metric count in both orders', () => {
    expect(count('Nm 2/28').count).toBeCloseTo(14, 10);
    expect(count('Nm 28/2').count).toBeCloseTo(14, 10);
    expect(count('nm 8/2')).toMatchObject({ size: 8, plies: 2, count: 4 });
  });

  it('reads direct counts, yd/lb, m/kg and wraps', () => {
    expect(count('30 tex').metresPerKg).toBeCloseTo(1e6 / 30, 8);
    expect(count('tex 30x2').count).toBe(60);
    expect(count('150 denier').count).toBe(150);
    expect(count('150d').system).toBe('denier');
    expect(count('3360 yd/lb').metresPerKg).toBeCloseTo(toMetresPerKg('ne', 4), 8);
    expect(count('6774 m/kg').metresPerKg).toBe(6774);
    expect(count('14 m/g').count).toBe(14);
    expect(count('3 run').system).toBe('run');
    expect(parseYarn('12 WPI')).toEqual({ ok: true, yarn: { kind: 'wraps', wrapsPerInch: 12 } });
    const cm = parseYarn('5 wraps per cm');
    expect(cm.ok && cm.yarn.kind === 'wraps' && cm.yarn.wrapsPerInch).toBeCloseTo(12.7, 10);
  });

  it('lets the weaver override the ply order', () => {
    const r = parseYarn('2/8 cotton', 'plies-first');
    expect(r.ok && r.yarn.kind === 'count' && r.yarn.count).toBe(4);
  });

  it.each(['8/2', 'cotton', '8/2 wombat', '30/2 tex', '0 tex', '2.5/2 worsted x', '12/2 wpi', '8/2.5 cotton', '3360/2 yd/lb'])(
    'refuses "%s" with a message',
    (text) => {
      const r = parseYarn(text);
      expect(r.ok).toBe(false);
      if (!r.ok) expect(r.error.length).toBeGreaterThan(10);
    },
  );
});

describe('properties', () => {
  const system = fc.constantFrom(...COUNT_SYSTEMS);
  const positive = fc.double({ min: 1e-3, max: 1e6, noNaN: true });

  it('conversions round-trip between any two systems', () => {
    fc.assert(
      fc.property(positive, system, system, (x, a, b) => {
        const back = convertCount(convertCount(x, a, b), b, a);
        expect(back / x).toBeCloseTo(1, 10);
      }),
    );
  });

  it('conversion through a third system equals direct conversion', () => {
    fc.assert(
      fc.property(positive, system, system, system, (x, a, b, c) => {
        const viaC = convertCount(convertCount(x, a, c), c, b);
        expect(viaC / convertCount(x, a, b)).toBeCloseTo(1, 10);
      }),
    );
  });

  it('a finer yarn has more metres per kg in every system direction', () => {
    fc.assert(
      fc.property(positive, positive, system, (x, y, s: CountSystem) => {
        fc.pre(Math.abs(x - y) / Math.max(x, y) > 1e-9);
        const mx = toMetresPerKg(s, x);
        const my = toMetresPerKg(s, y);
        const direct = s === 'tex' || s === 'denier';
        expect(mx > my).toBe(direct ? x < y : x > y);
      }),
    );
  });

  it('plied cotton text parses to size ÷ plies', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 120 }), fc.integer({ min: 1, max: 12 }), (size, plies) => {
        expect(ydPerLb(`${size}/${plies} cotton`)).toBeCloseTo((840 * size) / plies, 6);
        expect(ydPerLb(`${plies}/${size} worsted`)).toBeCloseTo((560 * size) / plies, 6);
      }),
    );
  });
});
