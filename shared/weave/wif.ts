import { DraftError, parseDraft } from './draft';
import { hexToRgb, rgbToHex } from './cloth';
import { DRAFT_SCHEMA_VERSION, MAX_SHAFTS, MAX_THREADS, MAX_TREADLES, type Draft, type LengthUnit } from './types';

/*
 * WIF 1.1 (Weaving Information File, the open interchange standard) in and out.
 * What the draft carries in WIF: name ([TEXT] Title), shafts, treadles, shed, threading, tie-up,
 * the controlling pick list (treadling or lift plan, never both), palette, warp and weft colours,
 * sett ([WARP]/[WEFT] Spacing), notes, and layers in private sections. Yarns and block links
 * stay in the JSON document only.
 */

const WARP_LAYERS = 'PRIVATE SHEDWRIGHT WARP LAYERS';
const WEFT_LAYERS = 'PRIVATE SHEDWRIGHT WEFT LAYERS';

/** A section of a WIF file kept as written: sections Shedwright does not read travel on through here. */
export interface WifSection {
  name: string;
  entries: [key: string, value: string][];
}

export interface WifReadResult {
  draft: Draft;
  /** Things read with a guess or left out, in plain words. */
  warnings: string[];
  /** Sections not used by Shedwright, kept so they can be written back. */
  extras: WifSection[];
}

export interface WifWriteOptions {
  /** Date written in [WIF]; today when omitted. */
  date?: Date;
  /** Sections to write after the draft's own (e.g. the `extras` of a file read earlier). */
  extras?: readonly WifSection[];
}

/** A file that cannot be read as a draft; the message names the section and line. */
export class WifError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'WifError';
  }
}

// ---------------------------------------------------------------- writing

const MONTHS = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December'];

/**
 * Escapes a text value so general INI readers give it back unchanged: ';' and '#' would start a
 * comment there, and surrounding quotes or spaces would be stripped, so such text is JSON-quoted.
 */
function textValue(text: string): string {
  if (text !== text.trim() || /^["']/.test(text) || /[\r\n]/.test(text)) return JSON.stringify(text);
  return text.replace(/[\\;#]/g, (c) => `\\${c}`);
}

function mostCommon(values: readonly number[], fallback: number): number {
  const counts = new Map<number, number>();
  let best = fallback;
  let bestCount = 0;
  for (const v of values) {
    const c = (counts.get(v) ?? 0) + 1;
    counts.set(v, c);
    if (c > bestCount) [best, bestCount] = [v, c];
  }
  return best;
}

/**
 * Writes the draft as a WIF 1.1 file.
 *
 * @example toWif(draft) // "[WIF]\nVersion=1.1\n…"
 */
export function toWif(draft: Draft, options: WifWriteOptions = {}): string {
  const date = options.date ?? new Date();
  const sections: WifSection[] = [];
  const add = (name: string, entries: [string, string][], always = false) => {
    if (entries.length > 0 || always) sections.push({ name, entries });
  };
  const numbered = (lists: readonly (readonly number[])[]): [string, string][] =>
    lists.flatMap((l, i): [string, string][] => (l.length > 0 ? [[String(i + 1), l.join(',')]] : []));
  const sparse = (values: readonly number[], skip: number, toText: (v: number) => string): [string, string][] =>
    values.flatMap((v, i): [string, string][] => (v !== skip ? [[String(i + 1), toText(v)]] : []));

  const picks = draft.control === 'liftplan' ? draft.liftplan.length : draft.treadling.length;
  const warpDefault = mostCommon(draft.warpColors, 0);
  const weftDefault = mostCommon(draft.weftColors, Math.min(1, draft.palette.length - 1));
  const units = draft.sett.unit === 'cm' ? 'Centimeters' : 'Inches';

  add('TEXT', [['Title', textValue(draft.name)]]);
  add('WEAVING', [
    ['Shafts', String(draft.shafts)],
    ['Treadles', String(draft.treadles)],
    ['Rising Shed', draft.shed === 'rising' ? 'true' : 'false'],
  ]);
  add('WARP', [
    ['Threads', String(draft.threading.length)],
    ['Color', String(warpDefault + 1)],
    ['Units', units],
    ['Spacing', String(1 / draft.sett.warp)],
  ]);
  add('WEFT', [
    ['Threads', String(picks)],
    ['Color', String(weftDefault + 1)],
    ['Units', units],
    ['Spacing', String(1 / draft.sett.weft)],
  ]);
  add('COLOR PALETTE', [
    ['Entries', String(draft.palette.length)],
    ['Range', '0,255'],
  ]);
  add('COLOR TABLE', draft.palette.map((hex, i): [string, string] => [String(i + 1), hexToRgb(hex).join(',')]));
  add('THREADING', numbered(draft.threading), true);
  add('TIEUP', numbered(draft.tieup), draft.treadles > 0);
  // The section header alone says which list controls the picks, even for a draft with no picks yet.
  if (draft.control === 'liftplan') add('LIFTPLAN', numbered(draft.liftplan), true);
  else add('TREADLING', numbered(draft.treadling), true);
  add('WARP COLORS', sparse(draft.warpColors, warpDefault, (c) => String(c + 1)));
  add('WEFT COLORS', sparse(draft.weftColors, weftDefault, (c) => String(c + 1)));
  if (draft.notes !== '') add('NOTES', draft.notes.split('\n').map((line, i): [string, string] => [String(i + 1), textValue(line)]));
  add(WARP_LAYERS, sparse(draft.warpLayers, 1, String));
  add(WEFT_LAYERS, sparse(draft.weftLayers, 1, String));
  for (const extra of options.extras ?? []) add(extra.name, extra.entries, true);

  const head: WifSection[] = [
    {
      name: 'WIF',
      entries: [
        ['Version', '1.1'],
        ['Date', `${MONTHS[date.getUTCMonth()]} ${date.getUTCDate()}, ${date.getUTCFullYear()}`],
        ['Developers', 'Shedwright developers'],
        ['Source Program', 'Shedwright'],
      ],
    },
    { name: 'CONTENTS', entries: sections.map((s): [string, string] => [s.name, 'true']) },
  ];
  return [...head, ...sections].map((s) => [`[${s.name}]`, ...s.entries.map(([k, v]) => `${k}=${v}`)].join('\n')).join('\n\n') + '\n';
}

// ---------------------------------------------------------------- reading

interface Entry {
  key: string;
  value: string;
  line: number;
}

interface Section {
  name: string;
  line: number;
  entries: Entry[];
}

const KNOWN = new Set([
  'WIF', 'CONTENTS', 'TEXT', 'WEAVING', 'WARP', 'WEFT', 'COLOR PALETTE', 'COLOR TABLE', 'THREADING', 'TIEUP',
  'TREADLING', 'LIFTPLAN', 'WARP COLORS', 'WEFT COLORS', 'NOTES', WARP_LAYERS, WEFT_LAYERS,
]);

function splitSections(text: string): Map<string, Section> {
  const sections = new Map<string, Section>();
  let current: Section | undefined;
  const lines = text.replace(/^\uFEFF/, '').split(/\r\n|\n|\r/);
  lines.forEach((raw, i) => {
    const line = raw.trim();
    const lineNo = i + 1;
    if (line === '' || line.startsWith(';')) return;
    const header = /^\[(.*)\]$/.exec(line);
    if (header) {
      const name = header[1].trim().replace(/\s+/g, ' ');
      const key = name.toUpperCase();
      current = sections.get(key);
      if (!current) sections.set(key, (current = { name, line: lineNo, entries: [] }));
      return;
    }
    const eq = line.indexOf('=');
    if (!current) throw new WifError(`Line ${lineNo}: "${line.slice(0, 40)}" comes before any [SECTION] header, so this is not a WIF file.`);
    if (eq < 0) {
      if (KNOWN.has(current.name.toUpperCase())) {
        throw new WifError(`[${current.name}] line ${lineNo}: "${line.slice(0, 40)}" is not a Key=Value line.`);
      }
      current.entries.push({ key: line, value: '', line: lineNo });
      return;
    }
    current.entries.push({ key: line.slice(0, eq).trim(), value: line.slice(eq + 1).trim(), line: lineNo });
  });
  return sections;
}

/** Reverses {@link textValue}, and reads plain text from other writers as it stands. */
function readText(value: string): string {
  if (value.length >= 2 && value.startsWith('"') && value.endsWith('"')) {
    try {
      const parsed: unknown = JSON.parse(value);
      if (typeof parsed === 'string') return parsed;
    } catch {
      // Not JSON: fall through and take it as plain text.
    }
  }
  if (value.length >= 2 && value.startsWith("'") && value.endsWith("'")) return value.slice(1, -1);
  return value.replace(/\\([\\;#])/g, '$1');
}

class Reader {
  readonly warnings: string[] = [];
  constructor(readonly sections: Map<string, Section>) {}

  section(name: string): Section | undefined {
    return this.sections.get(name);
  }

  entry(section: string, key: string): Entry | undefined {
    const k = key.toLowerCase();
    const entries = this.section(section)?.entries ?? [];
    for (let i = entries.length - 1; i >= 0; i--) if (entries[i].key.toLowerCase() === k) return entries[i];
    return undefined;
  }

  fail(section: string, entry: Entry, problem: string): never {
    throw new WifError(`[${this.section(section)?.name ?? section}] line ${entry.line}: ${entry.key}=${entry.value.slice(0, 40)}: ${problem}`);
  }

  int(section: string, entry: Entry, min: number, max: number, what: string): number {
    const v = entry.value.replace(/;.*$/, '').trim();
    if (!/^[+-]?\d+$/.test(v)) this.fail(section, entry, `${what} must be a whole number`);
    const n = Number(v);
    if (n < min || n > max) this.fail(section, entry, `${what} must be from ${min} to ${max}`);
    return n;
  }

  intOf(section: string, key: string, min: number, max: number, what: string): number | undefined {
    const e = this.entry(section, key);
    return e ? this.int(section, e, min, max, what) : undefined;
  }

  numbers(section: string, entry: Entry, max: number, what: string): number[] {
    const parts = entry.value.replace(/;.*$/, '').split(',').map((p) => p.trim()).filter((p) => p !== '');
    const out = parts.map((p) => {
      if (!/^[+-]?\d+$/.test(p)) this.fail(section, entry, `"${p}" is not a ${what} number`);
      const n = Number(p);
      if (n < 1 || n > max) this.fail(section, entry, `${what} ${n} is outside 1 to ${max}`);
      return n;
    });
    return [...new Set(out)];
  }

  /** Numbered entries (1-based keys) of a section as [index, entry]; other keys are errors. */
  numbered(section: string, count: number | undefined, what: string): [number, Entry][] {
    const s = this.section(section);
    if (!s) return [];
    return s.entries.map((e): [number, Entry] => {
      if (!/^\d+$/.test(e.key)) this.fail(section, e, `"${e.key}" is not a ${what} number`);
      const i = Number(e.key);
      const max = count ?? MAX_THREADS;
      if (i < 1 || i > max) {
        this.fail(section, e, count === undefined ? `${what} ${i} is beyond ${MAX_THREADS}, the most Shedwright reads` : `${what} ${i} but the file has ${count} ${what}s`);
      }
      return [i - 1, e];
    });
  }

  bool(section: string, key: string, fallback: boolean): boolean {
    const e = this.entry(section, key);
    if (!e) return fallback;
    const v = e.value.replace(/;.*$/, '').trim().toLowerCase();
    if (['true', 'yes', 'on', '1'].includes(v)) return true;
    if (['false', 'no', 'off', '0'].includes(v)) return false;
    return this.fail(section, e, 'must be true or false');
  }

  /** The highest numbered key in the sections; a key beyond `limit` is an error, not a huge list. */
  maxKey(limit: number, ...names: string[]): number {
    let max = 0;
    for (const name of names) {
      for (const e of this.section(name)?.entries ?? []) {
        if (!/^\d+$/.test(e.key)) continue;
        const n = Number(e.key);
        if (n > limit) this.fail(name, e, `number ${e.key} is beyond ${limit}, the most Shedwright reads`);
        max = Math.max(max, n);
      }
    }
    return max;
  }
}

/** Threads per unit from WIF Spacing (distance between threads) and Units. */
function settFrom(r: Reader, section: 'WARP' | 'WEFT'): { value: number; unit: LengthUnit } | undefined {
  const spacing = r.entry(section, 'Spacing');
  if (!spacing) return undefined;
  const d = Number(spacing.value.replace(/;.*$/, '').trim());
  if (!Number.isFinite(d) || d <= 0) r.fail(section, spacing, 'Spacing must be a positive number');
  const units = (r.entry(section, 'Units')?.value ?? 'Inches').trim().toLowerCase();
  // Decipoints are tenths of a printer's point: 720 to the inch.
  const perInch = units.startsWith('deci') ? 720 / d : undefined;
  const value = perInch ?? 1 / d;
  const unit: LengthUnit = units.startsWith('cent') ? 'cm' : 'inch';
  if (!(value > 0 && value <= 1000)) {
    r.warnings.push(`[${section}] Spacing gives ${value} threads per ${unit}; the default sett was used.`);
    return undefined;
  }
  // Spacing is the reciprocal of the sett; rounding undoes the last-digit error of taking it twice.
  return { value: Number(value.toPrecision(12)), unit };
}

function readPalette(r: Reader): string[] | undefined {
  const table = r.section('COLOR TABLE');
  if (!table) return undefined;
  let min = 0;
  let max = 255;
  const range = r.entry('COLOR PALETTE', 'Range');
  if (range) {
    const parts = range.value.replace(/;.*$/, '').split(',').map((p) => Number(p.trim()));
    if (parts.length !== 2 || !parts.every(Number.isInteger) || parts[1] <= parts[0]) {
      r.fail('COLOR PALETTE', range, 'Range must be two whole numbers, lowest first, e.g. 0,255');
    }
    [min, max] = parts;
  }
  const entries = r.intOf('COLOR PALETTE', 'Entries', 0, 1024, 'Entries') ?? 0;
  const size = Math.max(entries, r.maxKey(1024, 'COLOR TABLE'));
  const palette = new Array<string | undefined>(size).fill(undefined);
  for (const [i, e] of r.numbered('COLOR TABLE', size, 'colour')) {
    const parts = e.value.replace(/;.*$/, '').split(',').map((p) => p.trim());
    if (parts.length !== 3 || !parts.every((p) => /^[+-]?\d+(\.\d+)?$/.test(p))) r.fail('COLOR TABLE', e, 'a colour must be three numbers R,G,B');
    const [red, green, blue] = parts.map((p) => {
      const v = Math.round(((Number(p) - min) * 255) / (max - min));
      if (v < 0 || v > 255) r.fail('COLOR TABLE', e, `each part must be within the Range ${min},${max}`);
      return v;
    });
    palette[i] = rgbToHex(red, green, blue);
  }
  const missing = palette.filter((c) => c === undefined).length;
  if (missing > 0) r.warnings.push(`${missing} palette entries had no colour in [COLOR TABLE] and are shown black.`);
  return palette.map((c) => c ?? '#000000');
}

/** Reads a WIF file (1.0 or 1.1) into a draft, with warnings and the sections kept as extras. */
export function readWif(text: string): WifReadResult {
  if (typeof text !== 'string') throw new WifError('A WIF file must be text.');
  const r = new Reader(splitSections(text));
  if (!r.section('WIF')) throw new WifError('This is not a WIF file: it has no [WIF] section.');
  const version = r.entry('WIF', 'Version')?.value;
  if (version === undefined) r.warnings.push('[WIF] gives no Version; read as 1.1.');
  else if (!/^1(\.\d+)?$/.test(version)) r.warnings.push(`[WIF] Version=${version} is not 1.x; read as 1.1.`);
  for (const e of r.section('CONTENTS')?.entries ?? []) {
    const listed = ['true', 'yes', 'on', '1'].includes(e.value.toLowerCase());
    if (listed && !r.section(e.key.toUpperCase().replace(/\s+/g, ' '))) r.warnings.push(`[CONTENTS] lists [${e.key}] but the file has no such section.`);
  }

  const shaftsGiven = r.intOf('WEAVING', 'Shafts', 1, Number.MAX_SAFE_INTEGER, 'Shafts');
  if (shaftsGiven !== undefined && shaftsGiven > MAX_SHAFTS) {
    r.fail('WEAVING', r.entry('WEAVING', 'Shafts') as Entry, `${shaftsGiven} shafts, but Shedwright drafts have at most ${MAX_SHAFTS}`);
  }
  const treadlesGiven = r.intOf('WEAVING', 'Treadles', 0, Number.MAX_SAFE_INTEGER, 'Treadles');
  if (treadlesGiven !== undefined && treadlesGiven > MAX_TREADLES) {
    r.fail('WEAVING', r.entry('WEAVING', 'Treadles') as Entry, `${treadlesGiven} treadles, but Shedwright drafts have at most ${MAX_TREADLES}`);
  }
  const shafts = shaftsGiven ?? MAX_SHAFTS;
  const treadleLimit = treadlesGiven ?? MAX_TREADLES;
  const ends = r.intOf('WARP', 'Threads', 0, MAX_THREADS, 'Threads') ?? r.maxKey(MAX_THREADS, 'THREADING', 'WARP COLORS', WARP_LAYERS);
  const picksGiven = r.intOf('WEFT', 'Threads', 0, MAX_THREADS, 'Threads');

  const lists = (section: string, count: number | undefined, what: string, max: number, item: string) => {
    const out = new Map<number, number[]>();
    for (const [i, e] of r.numbered(section, count, what)) out.set(i, r.numbers(section, e, max, item));
    return out;
  };
  const dense = (m: Map<number, number[]>, n: number) => Array.from({ length: n }, (_, i) => m.get(i) ?? []);

  const threadingMap = lists('THREADING', ends, 'end', shafts, 'shaft');
  const tieupMap = lists('TIEUP', treadlesGiven, 'treadle', shafts, 'shaft');
  const treadlingMap = lists('TREADLING', picksGiven, 'pick', treadleLimit, 'treadle');
  const liftplanMap = lists('LIFTPLAN', picksGiven, 'pick', shafts, 'shaft');
  // Folded rather than spread: a long lift plan would overflow the call stack as arguments.
  const highest = (lists: Iterable<number[]>, start: number) => {
    let max = start;
    for (const list of lists) for (const n of list) if (n > max) max = n;
    return max;
  };
  const usedShafts = highest([...threadingMap.values(), ...tieupMap.values(), ...liftplanMap.values()], 1);
  if (shaftsGiven === undefined) r.warnings.push(`[WEAVING] gives no Shafts; read as ${usedShafts}, the highest shaft used.`);
  const treadles = treadlesGiven ?? highest([[...tieupMap.keys()].map((i) => i + 1), ...treadlingMap.values()], 0);

  const control: Draft['control'] = r.section('LIFTPLAN') && !r.section('TREADLING') ? 'liftplan' : 'treadling';
  if (r.section('LIFTPLAN') && r.section('TREADLING')) r.warnings.push('The file has both [TREADLING] and [LIFTPLAN]; the picks follow the treadling.');
  const picks = picksGiven ?? r.maxKey(MAX_THREADS, control === 'liftplan' ? 'LIFTPLAN' : 'TREADLING', 'WEFT COLORS', WEFT_LAYERS);

  const palette = readPalette(r);
  const colours = (section: 'WARP' | 'WEFT', listSection: string, count: number, fallback: number) => {
    if (!palette) {
      if (r.section(listSection) || r.entry(section, 'Color')) r.warnings.push(`[${listSection}] was left out: the file has no [COLOR TABLE].`);
      return [];
    }
    const given = r.intOf(section, 'Color', 1, palette.length, 'Color');
    const out = new Array<number>(count).fill(given !== undefined ? given - 1 : Math.min(fallback, palette.length - 1));
    for (const [i, e] of r.numbered(listSection, count, section === 'WARP' ? 'end' : 'pick')) out[i] = r.int(listSection, e, 1, palette.length, 'colour') - 1;
    return out;
  };
  const layers = (section: string, count: number, what: string) => {
    const entries = r.numbered(section, count, what);
    if (entries.length === 0) return [];
    const out = new Array<number>(count).fill(1);
    for (const [i, e] of entries) out[i] = r.int(section, e, 1, 16, 'layer');
    return out;
  };
  const notesSection = r.section('NOTES');
  const notes = notesSection
    ? notesSection.entries
        .map((e) => ({ n: /^\d+$/.test(e.key) ? Number(e.key) : Number.MAX_SAFE_INTEGER, text: readText(e.value) }))
        .sort((a, b) => a.n - b.n)
        .map((e) => e.text)
        .join('\n')
    : '';
  const warpSett = settFrom(r, 'WARP');
  const weftSett = settFrom(r, 'WEFT');
  const title = r.entry('TEXT', 'Title');

  const candidate = {
    schemaVersion: DRAFT_SCHEMA_VERSION,
    // No title: left empty, for the caller to name the draft (after its file, say).
    name: title ? readText(title.value).slice(0, 200) : '',
    shafts: shaftsGiven ?? usedShafts,
    treadles,
    shed: r.bool('WEAVING', 'Rising Shed', true) ? 'rising' : 'sinking',
    control,
    threading: dense(threadingMap, ends),
    tieup: dense(tieupMap, treadles),
    treadling: control === 'treadling' ? dense(treadlingMap, picks) : [],
    liftplan: control === 'liftplan' ? dense(liftplanMap, picks) : [],
    ...(palette ? { palette } : {}),
    warpColors: colours('WARP', 'WARP COLORS', ends, 0),
    weftColors: colours('WEFT', 'WEFT COLORS', picks, 1),
    warpLayers: layers(WARP_LAYERS, ends, 'end'),
    weftLayers: layers(WEFT_LAYERS, picks, 'pick'),
    sett:
      warpSett || weftSett
        ? { warp: warpSett?.value ?? weftSett?.value, weft: weftSett?.value ?? warpSett?.value, unit: (warpSett ?? weftSett)?.unit }
        : undefined,
    notes: notes.slice(0, 100_000),
  };
  const extras: WifSection[] = [];
  for (const [key, s] of r.sections) {
    if (KNOWN.has(key)) continue;
    extras.push({ name: s.name, entries: s.entries.map((e): [string, string] => [e.key, e.value]) });
    r.warnings.push(`[${s.name}] is not used by Shedwright; it was kept as it is.`);
  }
  try {
    return { draft: parseDraft(candidate), warnings: r.warnings, extras };
  } catch (err) {
    if (err instanceof DraftError) throw new WifError(`The file does not make a valid draft: ${err.problems.map((p) => p.message).join('; ')}`);
    throw err;
  }
}

/** Reads a WIF file into a draft (see {@link readWif} for warnings and kept sections). */
export function fromWif(text: string): Draft {
  return readWif(text).draft;
}
