import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseId } from '../../src/app/parse-id';
import { linkify } from '../../src/features/mails/linkify';

describe('linkify', () => {
  it('finds the reset link in a mail and leaves the full stop out', () => {
    const parts = linkify('Choose a new password: http://127.0.0.1:4780/reset?token=abc123.\nThanks');
    expect(parts).toEqual([
      { kind: 'text', text: 'Choose a new password: ' },
      { kind: 'link', text: 'http://127.0.0.1:4780/reset?token=abc123' },
      { kind: 'text', text: '.\nThanks' },
    ]);
  });

  it('never makes a link of anything but http(s)', () => {
    expect(linkify('javascript:alert(1) mailto:a@b.test ftp://x')).toEqual([{ kind: 'text', text: 'javascript:alert(1) mailto:a@b.test ftp://x' }]);
  });

  it('loses no text and links only http(s) addresses (property)', () => {
    const piece = fc.oneof(fc.string(), fc.constantFrom('https://', 'http://a.test/x?y=1', ' ', '.', ')', '\n', '<'));
    fc.assert(
      fc.property(fc.array(piece, { maxLength: 10 }), (pieces) => {
        const text = pieces.join('');
        const parts = linkify(text);
        expect(parts.map((p) => p.text).join('')).toBe(text);
        for (const part of parts) {
          if (part.kind === 'link') {
            expect(part.text).toMatch(/^https?:\/\/\S+$/);
            expect(part.text).not.toMatch(/[.,;:!?)\]'"]$/);
          }
        }
      }),
    );
  });
});

describe('parseId', () => {
  it('accepts positive whole numbers only', () => {
    expect(parseId('42')).toBe(42);
    for (const raw of ['0', '-1', '1e3', '12abc', '01', ' 1', '', undefined, '99999999999999999']) expect(parseId(raw)).toBeNull();
  });

  it('reads back any safe positive id (property)', () => {
    fc.assert(fc.property(fc.integer({ min: 1, max: Number.MAX_SAFE_INTEGER }), (id) => {
        expect(parseId(String(id))).toBe(id);
      }));
  });
});
