// The client repeats a few limits of shared/api so zod stays out of the page; these keep them honest.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { draftListQuerySchema, draftSorts, DRAFTS_MAX_PAGE_SIZE, studioRoles } from '../../shared/api';
import { DEFAULT_DRAFTS_SEARCH, DRAFT_SORTS, MAX_QUERY_LENGTH, PAGE_SIZES, parseDraftsSearch } from '../../src/features/library/drafts-search';
import { STUDIO_ROLES } from '../../src/lib/roles';

describe('client copies of contract limits', () => {
  it('match shared/api', () => {
    expect([...DRAFT_SORTS].sort()).toEqual([...draftSorts].sort());
    expect([...STUDIO_ROLES].reverse()).toEqual([...studioRoles]);
    expect(Math.max(...PAGE_SIZES)).toBeLessThanOrEqual(DRAFTS_MAX_PAGE_SIZE);
    // The server's defaults are the client's, so leaving a default out of the URL changes nothing.
    const serverDefaults = draftListQuerySchema.parse({});
    expect({ sort: serverDefaults.sort, dir: serverDefaults.dir, page: serverDefaults.page, pageSize: serverDefaults.pageSize }).toEqual({
      sort: DEFAULT_DRAFTS_SEARCH.sort,
      dir: DEFAULT_DRAFTS_SEARCH.dir,
      page: DEFAULT_DRAFTS_SEARCH.page,
      pageSize: DEFAULT_DRAFTS_SEARCH.pageSize,
    });
  });

  it('never sends a list query the server would refuse, whatever is in the URL (property)', () => {
    const key = fc.constantFrom('q', 'sort', 'dir', 'page', 'pageSize', 'other');
    const value = fc.oneof(fc.string(), fc.integer().map(String), fc.constantFrom('name', 'size', 'updated', 'asc', 'desc', '1e3', '-1', '0'));
    fc.assert(
      fc.property(fc.array(fc.tuple(key, value), { maxLength: 8 }), (pairs) => {
        const search = parseDraftsSearch(new URLSearchParams(pairs));
        expect(search.q.length).toBeLessThanOrEqual(MAX_QUERY_LENGTH);
        expect(draftListQuerySchema.safeParse(search).success).toBe(true);
      }),
    );
  });
});
