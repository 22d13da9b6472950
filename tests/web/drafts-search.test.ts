import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  DEFAULT_DRAFTS_SEARCH,
  DRAFT_SORTS,
  draftsSearchToParams,
  MAX_SHAFTS,
  STRUCTURES,
  MAX_QUERY_LENGTH,
  NATURAL_DIRECTION,
  PAGE_SIZES,
  pageCount,
  parseDraftsSearch,
  toggleSort,
  type DraftsSearch,
} from '../../src/features/library/drafts-search';

const searchArb: fc.Arbitrary<DraftsSearch> = fc.record({
  q: fc.string({ maxLength: MAX_QUERY_LENGTH }).map((s) => s.trim()),
  sort: fc.constantFrom(...DRAFT_SORTS),
  dir: fc.constantFrom('asc' as const, 'desc' as const),
  page: fc.integer({ min: 1, max: 100_000 }),
  pageSize: fc.constantFrom(...PAGE_SIZES),
  shafts: fc.option(fc.integer({ min: 1, max: MAX_SHAFTS }), { nil: undefined }),
  structure: fc.constantFrom('', ...STRUCTURES),
  studio: fc.option(fc.integer({ min: 1, max: 2 ** 31 - 1 }), { nil: undefined }),
});

describe('drafts list state in the URL', () => {
  it('reads back exactly what it wrote (property)', () => {
    fc.assert(fc.property(searchArb, (search) => {
        expect(parseDraftsSearch(draftsSearchToParams(search))).toEqual(search);
      }));
  });

  it('keeps the plain address plain', () => {
    expect(draftsSearchToParams(DEFAULT_DRAFTS_SEARCH).toString()).toBe('');
    expect(parseDraftsSearch(new URLSearchParams())).toEqual(DEFAULT_DRAFTS_SEARCH);
  });

  it('falls back to defaults for nonsense', () => {
    const search = parseDraftsSearch(new URLSearchParams('sort=colour&dir=up&page=-3&pageSize=7&shafts=33&structure=satin&studio=0'));
    expect(search).toEqual(DEFAULT_DRAFTS_SEARCH);
    expect(parseDraftsSearch(new URLSearchParams('page=2.5')).page).toBe(1);
  });

  it('flips the same column and starts a new one in its natural order, on page 1 (property)', () => {
    fc.assert(
      fc.property(searchArb, fc.constantFrom(...DRAFT_SORTS), (search, sort) => {
        const next = toggleSort(search, sort);
        expect(next.sort).toBe(sort);
        expect(next.page).toBe(1);
        expect(next.q).toBe(search.q);
        if (search.sort === sort) expect(next.dir).not.toBe(search.dir);
        else expect(next.dir).toBe(NATURAL_DIRECTION[sort]);
        // Choosing the same column twice returns to the same order.
        expect(toggleSort(next, sort).dir).toBe(search.sort === sort ? search.dir : next.dir === 'asc' ? 'desc' : 'asc');
      }),
    );
  });

  it('counts enough pages for every draft, and at least one (property)', () => {
    fc.assert(
      fc.property(fc.nat(1_000_000), fc.constantFrom(...PAGE_SIZES), (total, size) => {
        const pages = pageCount(total, size);
        expect(pages).toBeGreaterThanOrEqual(1);
        expect(pages * size).toBeGreaterThanOrEqual(total);
        if (total > 0) expect((pages - 1) * size).toBeLessThan(total);
      }),
    );
  });
});
