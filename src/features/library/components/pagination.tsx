import { Button } from '../../../components/ui/button';
import { PAGE_SIZES, pageCount } from '../drafts-search';

export interface PaginationProps {
  page: number;
  pageSize: number;
  total: number;
  onPage: (page: number) => void;
  onPageSize: (pageSize: number) => void;
}

/** Previous / next and rows per page for a server-paged list. */
export function Pagination({ page, pageSize, total, onPage, onPageSize }: PaginationProps) {
  const pages = pageCount(total, pageSize);
  return (
    <nav aria-label="Pages of drafts" className="flex flex-wrap items-center justify-between gap-3 text-sm">
      <div className="flex items-center gap-2">
        <Button onClick={() => onPage(page - 1)} disabled={page <= 1}>
          <span aria-hidden="true">←</span> Previous
        </Button>
        <span aria-current="page" className="tabular-nums">
          Page {page} of {pages}
        </span>
        <Button onClick={() => onPage(page + 1)} disabled={page >= pages}>
          Next <span aria-hidden="true">→</span>
        </Button>
      </div>
      <label className="flex items-center gap-2">
        Rows per page
        <select
          value={pageSize}
          onChange={(event) => onPageSize(Number(event.target.value))}
          className="rounded-md border border-field bg-surface px-2 py-1.5"
        >
          {PAGE_SIZES.map((size) => (
            <option key={size} value={size}>
              {size}
            </option>
          ))}
        </select>
      </label>
    </nav>
  );
}
