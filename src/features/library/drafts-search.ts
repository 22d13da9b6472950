/** The library's list state, kept in the URL so it survives reloads and can be shared. */
export interface DraftsSearch {
  q: string;
  sort: DraftSort;
  dir: SortDirection;
  page: number;
  pageSize: number;
  /** Filters: only drafts for this many shafts, with this structure, in this studio. */
  shafts: number | undefined;
  structure: string;
  studio: number | undefined;
}

// NOTE: sorts, sizes and limits repeat shared/api/drafts rather than import it, which would bring
// zod into the page; tests/web/contract-constants.test.ts checks they agree with the schema.
export type DraftSort = 'updated' | 'name' | 'size';
export type SortDirection = 'asc' | 'desc';

export const DRAFT_SORTS: readonly DraftSort[] = ['updated', 'name', 'size'];
export const PAGE_SIZES: readonly number[] = [10, 20, 50];

/** The way each column reads best first: newest, A to Z, largest. */
export const NATURAL_DIRECTION: Record<DraftSort, SortDirection> = { updated: 'desc', name: 'asc', size: 'desc' };

export const DEFAULT_DRAFTS_SEARCH: DraftsSearch = {
  q: '', sort: 'updated', dir: 'desc', page: 1, pageSize: 20, shafts: undefined, structure: '', studio: undefined,
};

/** Structures the server tags drafts with (server/services/draft-derived STRUCTURE_TAGS). */
export const STRUCTURES: readonly string[] = ['plain weave', 'twill', 'double weave', 'block weave'];
export const MAX_SHAFTS = 32;

// Undefined, not null, for "no filter": the list query leaves undefined out, as the server expects.
const positiveInt = (text: string | null, max = 2 ** 31 - 1): number | undefined => {
  const n = Number(text);
  return text !== null && Number.isSafeInteger(n) && n >= 1 && n <= max ? n : undefined;
};

/** The server's limit on `q` (draftListQuerySchema); a longer search would be refused with a 400. */
export const MAX_QUERY_LENGTH = 100;

/** Reads list state from search params; anything missing or malformed falls back to the default. */
export function parseDraftsSearch(params: URLSearchParams): DraftsSearch {
  const sortParam = params.get('sort');
  const sort = DRAFT_SORTS.find((s) => s === sortParam) ?? DEFAULT_DRAFTS_SEARCH.sort;
  const dirParam = params.get('dir');
  const dir: SortDirection = dirParam === 'asc' || dirParam === 'desc' ? dirParam : NATURAL_DIRECTION[sort];
  const page = Number(params.get('page'));
  const pageSize = Number(params.get('pageSize'));
  return {
    q: (params.get('q') ?? '').trim().slice(0, MAX_QUERY_LENGTH),
    sort,
    dir,
    page: Number.isSafeInteger(page) && page >= 1 ? page : DEFAULT_DRAFTS_SEARCH.page,
    pageSize: PAGE_SIZES.includes(pageSize) ? pageSize : DEFAULT_DRAFTS_SEARCH.pageSize,
    shafts: positiveInt(params.get('shafts'), MAX_SHAFTS),
    structure: STRUCTURES.find((s) => s === params.get('structure')) ?? '',
    studio: positiveInt(params.get('studio')),
  };
}

/** Writes list state as search params, leaving defaults out so plain /drafts stays plain. */
export function draftsSearchToParams(search: DraftsSearch): URLSearchParams {
  const params = new URLSearchParams();
  if (search.q) params.set('q', search.q);
  if (search.sort !== DEFAULT_DRAFTS_SEARCH.sort) params.set('sort', search.sort);
  if (search.dir !== NATURAL_DIRECTION[search.sort]) params.set('dir', search.dir);
  if (search.page !== DEFAULT_DRAFTS_SEARCH.page) params.set('page', String(search.page));
  if (search.pageSize !== DEFAULT_DRAFTS_SEARCH.pageSize) params.set('pageSize', String(search.pageSize));
  if (search.shafts !== undefined) params.set('shafts', String(search.shafts));
  if (search.structure) params.set('structure', search.structure);
  if (search.studio !== undefined) params.set('studio', String(search.studio));
  return params;
}

/** The state after choosing a column: the same column flips direction, a new one starts the natural way. */
export function toggleSort(search: DraftsSearch, sort: DraftSort): DraftsSearch {
  const dir = search.sort === sort ? (search.dir === 'asc' ? 'desc' : 'asc') : NATURAL_DIRECTION[sort];
  return { ...search, sort, dir, page: 1 };
}

/** Number of pages for a total, at least one so "page 1 of 1" reads right for an empty list. */
export function pageCount(total: number, pageSize: number): number {
  return Math.max(1, Math.ceil(total / pageSize));
}
