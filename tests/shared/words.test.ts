import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { CLOTH_VIEW_NAMES, formatDay, formatNumber, LOCALE, SECTION_NAMES } from '../../shared/words';

describe('the product words', () => {
  it('writes numbers and dates the British way, with the page marked en-GB for screen readers and spelling', () => {
    // Source: Unicode CLDR, en-GB locale data (as shipped in Node's ICU): comma thousands, point
    // decimals, day before month.
    expect(formatNumber(1234.5, 1)).toBe('1,234.5');
    expect(formatNumber(2304)).toBe('2,304');
    expect(formatDay('2026-12-05T23:30:00Z')).toBe('5 December 2026');
    expect(LOCALE).toBe('en-GB');
    expect(readFileSync('index.html', 'utf8')).toContain('<html lang="en-GB">');
  });

  it('gives every section and cloth view one name, none of them repeated', () => {
    for (const names of [SECTION_NAMES, CLOTH_VIEW_NAMES]) {
      const values = Object.values(names);
      expect(new Set(values).size).toBe(values.length);
    }
    expect(SECTION_NAMES.loom).toBe('At the loom');
  });
});
