import { execFileSync } from 'node:child_process';
import { readFileSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

export interface Raster {
  width: number;
  height: number;
  /** RGB of the pixel at (x, y). */
  at(x: number, y: number): number[];
}

/**
 * One page of a PDF rendered by poppler's pdftoppm at `dpi`, read from its PPM (P6) output, which
 * is simple enough to read here. `dir` is a scratch folder for the files.
 */
export function renderPdfPage(pdf: Buffer, page: number, dpi: number, dir: string): Raster {
  const file = join(dir, `p${Math.random().toString(36).slice(2)}.pdf`);
  writeFileSync(file, pdf);
  const prefix = `${file}-out`;
  execFileSync('pdftoppm', ['-r', String(dpi), '-f', String(page), '-l', String(page), '-singlefile', file, prefix]);
  const ppm = readFileSync(`${prefix}.ppm`);
  // Header: "P6", width, height, maxval, each followed by whitespace (Netpbm PPM format).
  const fields: string[] = [];
  let i = 0;
  while (fields.length < 4) {
    while (/\s/.test(String.fromCharCode(ppm[i]))) i++;
    let s = '';
    while (!/\s/.test(String.fromCharCode(ppm[i]))) s += String.fromCharCode(ppm[i++]);
    fields.push(s);
  }
  i++;
  if (fields[0] !== 'P6' || fields[3] !== '255') throw new Error(`pdftoppm wrote ${fields[0]} with maxval ${fields[3]}, not P6 with 255`);
  const width = Number(fields[1]);
  const height = Number(fields[2]);
  const data = ppm.subarray(i);
  return { width, height, at: (x, y) => Array.from(data.subarray((y * width + x) * 3, (y * width + x) * 3 + 3)) };
}
