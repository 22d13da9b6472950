import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import zlib from 'node:zlib';

const require = createRequire(import.meta.url);

/**
 * IBM Plex Sans as shipped with the app (the fontsource package's latin subset, which covers
 * western European names). pdfkit embeds only the glyphs used.
 */
export const FONT_FILES = {
  regular: require.resolve('@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-400-normal.woff'),
  semibold: require.resolve('@fontsource/ibm-plex-sans/files/ibm-plex-sans-latin-600-normal.woff'),
} as const;

export type FontName = keyof typeof FONT_FILES;

/**
 * Unwraps a WOFF 1.0 file into the plain TrueType/OpenType font inside it.
 * NOTE: pdfkit's font reader inflates a WOFF table again on every glyph lookup, which made a
 * thousand-page print take minutes; the unwrapped font is read once.
 * Source: W3C WOFF File Format 1.0 (2012), §3–§5 (header, table directory, zlib per table);
 * OpenType specification, "Organization of an OpenType Font" (table directory).
 */
export function woffToSfnt(woff: Buffer): Buffer {
  if (woff.toString('latin1', 0, 4) !== 'wOFF') throw new Error('not a WOFF 1.0 font');
  const flavor = woff.readUInt32BE(4);
  const numTables = woff.readUInt16BE(12);
  const tables: { tag: number; checksum: number; data: Buffer }[] = [];
  for (let i = 0; i < numTables; i++) {
    const at = 44 + i * 20;
    const offset = woff.readUInt32BE(at + 4);
    const compLength = woff.readUInt32BE(at + 8);
    const origLength = woff.readUInt32BE(at + 12);
    const raw = woff.subarray(offset, offset + compLength);
    // A table is stored as it is when compressing would not make it smaller.
    const data = compLength < origLength ? zlib.inflateSync(raw) : Buffer.from(raw);
    if (data.length !== origLength) throw new Error('WOFF table has the wrong length');
    tables.push({ tag: woff.readUInt32BE(at), checksum: woff.readUInt32BE(at + 16), data });
  }
  const pad = (n: number) => (n + 3) & ~3;
  const headerSize = 12 + 16 * numTables;
  const out = Buffer.alloc(headerSize + tables.reduce((s, t) => s + pad(t.data.length), 0));
  const power = 2 ** Math.floor(Math.log2(numTables));
  out.writeUInt32BE(flavor, 0);
  out.writeUInt16BE(numTables, 4);
  out.writeUInt16BE(power * 16, 6);
  out.writeUInt16BE(Math.log2(power), 8);
  out.writeUInt16BE(numTables * 16 - power * 16, 10);
  let offset = headerSize;
  tables.forEach((t, i) => {
    const rec = 12 + i * 16;
    out.writeUInt32BE(t.tag, rec);
    out.writeUInt32BE(t.checksum, rec + 4);
    out.writeUInt32BE(offset, rec + 8);
    out.writeUInt32BE(t.data.length, rec + 12);
    t.data.copy(out, offset);
    offset += pad(t.data.length);
  });
  return out;
}

const unwrapped = new Map<FontName, Buffer>();

/** The font ready for pdfkit, unwrapped once per process. */
export function fontData(name: FontName): Buffer {
  let data = unwrapped.get(name);
  if (!data) {
    data = woffToSfnt(readFileSync(FONT_FILES[name]));
    unwrapped.set(name, data);
  }
  return data;
}
