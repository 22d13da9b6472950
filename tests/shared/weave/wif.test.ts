import fc from 'fast-check';
import { parse as parseIni } from 'ini';
import { describe, expect, it } from 'vitest';
import { hexToRgb } from '../../../shared/weave/cloth';
import { createDraft } from '../../../shared/weave/draft';
import { WifError, fromWif, readWif, toWif } from '../../../shared/weave/wif';
import type { Draft } from '../../../shared/weave/types';
import { draftArb } from './arbitraries';

const DATE = new Date(Date.UTC(2025, 2, 14));

/** Text a weaver might type, including what INI readers treat specially (; # \ quotes, spaces, blank lines). */
const awkwardText = fc.string({
  unit: fc.constantFrom('a', 'Z', ' ', ';', '#', '\\', '"', "'", '=', '[', ']', 'é', '1'),
  maxLength: 20,
});
const awkwardNotes = fc.array(awkwardText, { maxLength: 4 }).map((lines) => lines.join('\n'));

const draftWithText = draftArb({ maxShafts: 32, maxTreadles: 32 }).chain((d) =>
  fc.record({ name: awkwardText, notes: awkwardNotes }).map((t): Draft => ({ ...d, ...t })),
);

function picksOf(d: Draft): number[][] {
  return d.control === 'liftplan' ? d.liftplan : d.treadling;
}

describe('WIF round trip', () => {
  it('fromWif(toWif(d)) keeps every field WIF carries', () => {
    fc.assert(
      fc.property(draftWithText, (d) => {
        const back = fromWif(toWif(d, { date: DATE }));
        expect({
          name: back.name,
          shafts: back.shafts,
          treadles: back.treadles,
          shed: back.shed,
          control: back.control,
          threading: back.threading,
          tieup: back.tieup,
          picks: picksOf(back),
          palette: back.palette,
          warpColors: back.warpColors,
          weftColors: back.weftColors,
          warpLayers: back.warpLayers,
          weftLayers: back.weftLayers,
          notes: back.notes,
          unit: back.sett.unit,
        }).toEqual({
          name: d.name,
          shafts: d.shafts,
          treadles: d.treadles,
          shed: d.shed,
          control: d.control,
          threading: d.threading,
          tieup: d.tieup,
          picks: picksOf(d),
          palette: d.palette,
          warpColors: d.warpColors,
          weftColors: d.weftColors,
          warpLayers: d.warpLayers.every((l) => l === 1) ? [] : d.warpLayers,
          weftLayers: d.weftLayers.every((l) => l === 1) ? [] : d.weftLayers,
          notes: d.notes,
          unit: d.sett.unit,
        });
        expect(back.sett.warp).toBeCloseTo(d.sett.warp, 9);
        expect(back.sett.weft).toBeCloseTo(d.sett.weft, 9);
      }),
    );
  });
});

describe('WIF read by a general-purpose INI reader', () => {
  // Source: WIF 1.1 specification, April 1997 — section and key names from memory;
  // reader: the `ini` package 6.x, which lower-cases nothing, turns true/false into booleans and
  // treats unescaped ; and # as comments.
  it('gives back every section, key by key', () => {
    fc.assert(
      fc.property(draftWithText, (d) => {
        const ini = parseIni(toWif(d, { date: DATE })) as Record<string, Record<string, unknown>>;
        expect(ini.WIF).toEqual({
          Version: '1.1',
          Date: 'March 14, 2025',
          Developers: 'Shedwright developers',
          'Source Program': 'Shedwright',
        });
        for (const name of Object.keys(ini).filter((n) => n !== 'WIF' && n !== 'CONTENTS')) expect(ini.CONTENTS[name]).toBe(true);
        expect(ini.TEXT.Title === true || ini.TEXT.Title === false ? String(ini.TEXT.Title) : ini.TEXT.Title).toBe(d.name);
        expect(ini.WEAVING).toEqual({ Shafts: String(d.shafts), Treadles: String(d.treadles), 'Rising Shed': d.shed === 'rising' });
        expect(ini.WARP.Threads).toBe(String(d.threading.length));
        expect(ini['COLOR PALETTE']).toEqual({ Entries: String(d.palette.length), Range: '0,255' });
        d.palette.forEach((hex, i) => expect(ini['COLOR TABLE'][String(i + 1)]).toBe(hexToRgb(hex).join(',')));
        d.threading.forEach((shafts, e) => expect(ini.THREADING[String(e + 1)]).toBe(shafts.length ? shafts.join(',') : undefined));
        const pickSection = d.control === 'liftplan' ? 'LIFTPLAN' : 'TREADLING';
        expect(ini[pickSection === 'LIFTPLAN' ? 'TREADLING' : 'LIFTPLAN']).toBeUndefined();
        picksOf(d).forEach((list, p) => expect(ini[pickSection][String(p + 1)]).toBe(list.length ? list.join(',') : undefined));
        const warpDefault = Number(ini.WARP.Color) - 1;
        d.warpColors.forEach((c, e) => expect(Number(ini['WARP COLORS']?.[String(e + 1)] ?? warpDefault + 1) - 1).toBe(c));
        const weftDefault = Number(ini.WEFT.Color) - 1;
        d.weftColors.forEach((c, p) => expect(Number(ini['WEFT COLORS']?.[String(p + 1)] ?? weftDefault + 1) - 1).toBe(c));
        const notes = ini.NOTES ? Object.keys(ini.NOTES).map((k) => String(ini.NOTES[k])).join('\n') : '';
        expect(notes).toBe(d.notes);
      }),
    );
  });
});

describe('reading WIF files from elsewhere', () => {
  const handWritten = [
    '; a comment line',
    '[wif]',
    'version=1.1',
    'Source Program=Another program',
    '',
    '[Weaving]',
    'shafts=4',
    'TREADLES=2',
    'rising shed=yes',
    '[Warp]',
    'threads=6',
    'color=2',
    'units=centimeters',
    'spacing=0.125',
    '[weft]',
    'Threads=4',
    'Color=1',
    '[color palette]',
    'entries=2',
    'range=0,999',
    '[Color Table]',
    '1=999,0,0',
    '2=0,500,999',
    '[threading]',
    '1=1',
    '2=2',
    '4=4',
    '5=1,3',
    '[tieup]',
    '1=1,3',
    '2=2,4',
    '[treadling]',
    '1=1',
    '2=2',
    '4=1,2',
    '[warp colors]',
    '3=1',
    '[PRIVATE OTHER THING]',
    'Key=kept; as it is',
    '[NOTES]',
    '2=second line',
    '1=first line',
  ].join('\r\n');

  it('reads sparse sections, any letter case, and scales the colour Range', () => {
    const { draft, warnings, extras } = readWif(handWritten);
    expect(draft.shafts).toBe(4);
    expect(draft.treadles).toBe(2);
    expect(draft.shed).toBe('rising');
    expect(draft.threading).toEqual([[1], [2], [], [4], [1, 3], []]);
    expect(draft.tieup).toEqual([[1, 3], [2, 4]]);
    expect(draft.treadling).toEqual([[1], [2], [], [1, 2]]);
    // round((v − min)·255/(max − min)): 999 → 255, 500 → 128.
    expect(draft.palette).toEqual(['#ff0000', '#0080ff']);
    expect(draft.warpColors).toEqual([1, 1, 0, 1, 1, 1]);
    expect(draft.weftColors).toEqual([0, 0, 0, 0]);
    expect(draft.sett).toEqual({ warp: 8, weft: 8, unit: 'cm' });
    expect(draft.notes).toBe('first line\nsecond line');
    expect(extras).toEqual([{ name: 'PRIVATE OTHER THING', entries: [['Key', 'kept; as it is']] }]);
    expect(warnings).toContain('[PRIVATE OTHER THING] is not used by Shedwright; it was kept as it is.');
    // Kept sections travel on when written again.
    expect(toWif(draft, { extras, date: DATE })).toContain('[PRIVATE OTHER THING]\nKey=kept; as it is');
  });

  it('reads a lift plan and a sinking shed', () => {
    const d = fromWif('[WIF]\nVersion=1.1\n[WEAVING]\nShafts=2\nRising Shed=false\n[THREADING]\n1=1\n2=2\n[LIFTPLAN]\n1=1\n2=2\n');
    expect([d.control, d.shed, d.liftplan, d.treadles]).toEqual(['liftplan', 'sinking', [[1], [2]], 0]);
  });

  it('throws a WifError naming the section and line for a bad file', () => {
    const bad = (text: string) => {
      try {
        fromWif(text);
      } catch (err) {
        expect(err).toBeInstanceOf(WifError);
        return (err as Error).message;
      }
      throw new Error('expected a WifError');
    };
    expect(bad('hello')).toMatch(/^Line 1: .* before any \[SECTION\] header/);
    expect(bad('[TEXT]\nTitle=x')).toBe('This is not a WIF file: it has no [WIF] section.');
    expect(bad('[WIF]\n[WEAVING]\nShafts=4\n[THREADING]\n1=1\n2=1,x\n')).toBe('[THREADING] line 6: 2=1,x: "x" is not a shaft number');
    expect(bad('[WIF]\n[WEAVING]\nShafts=4\n[THREADING]\n1=5\n')).toBe('[THREADING] line 5: 1=5: shaft 5 is outside 1 to 4');
    expect(bad('[WIF]\n[WEAVING]\nShafts=40\n')).toBe('[WEAVING] line 3: Shafts=40: 40 shafts, but Shedwright drafts have at most 32');
    expect(bad('[WIF]\n[WARP]\nThreads=2\n[THREADING]\n3=1\n')).toBe('[THREADING] line 5: 3=1: end 3 but the file has 2 ends');
    expect(bad('[WIF]\n[WEAVING]\nShafts=2\n[THREADING]\nthis line has no equals sign\n')).toMatch(/^\[THREADING\] line 5: .* is not a Key=Value line/);
  });

  it('never crashes on arbitrary text: it reads a draft or throws a WifError', () => {
    const pieces = fc.constantFrom('[WIF]', '[WEAVING]', '[THREADING]', '[TREADLING]', '[COLOR TABLE]', 'Shafts=4', '1=1', '2=9', 'x', '=', '[', 'Range=9,0', '3=1,2,3');
    fc.assert(
      fc.property(fc.array(fc.oneof(pieces, fc.string({ maxLength: 8 })), { maxLength: 12 }), (lines) => {
        try {
          fromWif(lines.join('\n'));
        } catch (err) {
          expect(err).toBeInstanceOf(WifError);
        }
      }),
    );
  });

  it('writes what it reads for a small twill', () => {
    const twill = createDraft({ shafts: 4, treadles: 4, threading: [[1], [2], [3], [4]], tieup: [[1, 2], [2, 3], [3, 4], [1, 4]], treadling: [[1], [2], [3], [4]], name: 'Twill; #1' });
    const text = toWif(twill, { date: DATE });
    expect(text).toContain('[TEXT]\nTitle=Twill\\; \\#1\n');
    expect(fromWif(text).name).toBe('Twill; #1');
  });
});
