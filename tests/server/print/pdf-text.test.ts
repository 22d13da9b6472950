import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import PDFDocument from 'pdfkit';
import { PDFParse } from 'pdf-parse';
import { fontData } from '../../../server/print/fonts';
import { textWidth, writeText } from '../../../server/print/pdf-text';

function newDoc(): { doc: PDFKit.PDFDocument; done: Promise<Buffer> } {
  const doc = new PDFDocument({ size: 'A4', autoFirstPage: false });
  doc.registerFont('regular', fontData('regular'));
  doc.registerFont('semibold', fontData('semibold'));
  const chunks: Buffer[] = [];
  doc.on('data', (c: Buffer) => chunks.push(c));
  const done = new Promise<Buffer>((resolve) => doc.on('end', () => resolve(Buffer.concat(chunks))));
  return { doc, done };
}

describe('writeText', () => {
  it('measures numbers built digit by digit exactly as pdfkit shapes them (no kerning between figures)', () => {
    const { doc } = newDoc();
    doc.addPage();
    fc.assert(
      fc.property(fc.integer({ min: 0, max: 999_999 }), fc.constantFrom('regular', 'semibold'), (n, font) => {
        const s = String(n);
        // pdfkit's own measure lays the whole string out with the font's features.
        const shaped = doc.font(font).fontSize(6).widthOfString(s);
        expect(textWidth(doc, s, 6, font)).toBeCloseTo(shaped, 9);
      }),
    );
    doc.end();
  });

  it('writes text that a PDF reader extracts again, numbers and words alike', async () => {
    const { doc, done } = newDoc();
    doc.addPage();
    const words = ['Écharpe «point» twill', 'AVATAR Wave', 'Treadle 12'];
    const numbers = Array.from({ length: 40 }, (_, i) => String(i * 97 + 1));
    writeText(doc, numbers.map((s, i) => ({ s, x: 40 + (i % 8) * 60, y: 40 + Math.floor(i / 8) * 20, centred: i % 2 === 0 })), 8, '#1d1d22');
    writeText(doc, words.map((s, i) => ({ s, x: 40, y: 300 + i * 20 })), 10, '#5b5b66', 'semibold');
    doc.end();
    const parser = new PDFParse({ data: new Uint8Array(await done) });
    try {
      const { text } = await parser.getText();
      for (const s of [...numbers, ...words]) expect(text).toContain(s);
    } finally {
      await parser.destroy();
    }
  });
});
