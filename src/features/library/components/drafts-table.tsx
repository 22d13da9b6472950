import { Link } from 'react-router-dom';
import type { DraftSummary } from '../../../types/api';
import type { DraftSort, DraftsSearch } from '../drafts-search';
import { formatDate } from '../format';

export interface DraftsTableProps {
  drafts: DraftSummary[];
  search: DraftsSearch;
  onSort: (sort: DraftSort) => void;
  /** True while a newer page is loading behind the one shown. */
  stale?: boolean;
}

const cell = 'px-3 py-2 text-left align-top';

/** The library's table: one row per draft, columns sortable where the server can sort them. */
export function DraftsTable({ drafts, search, onSort, stale = false }: DraftsTableProps) {
  const sortable = (sort: DraftSort, label: string, extra = '') => {
    const active = search.sort === sort;
    const ariaSort = active ? (search.dir === 'asc' ? 'ascending' : 'descending') : 'none';
    return (
      <th scope="col" aria-sort={ariaSort} className={`${cell} ${extra}`}>
        <button type="button" onClick={() => onSort(sort)} className="inline-flex items-center gap-1 rounded font-semibold text-ink hover:underline">
          {label}
          {/* An arrow as well as aria-sort, so the order is seen without relying on colour. */}
          <span aria-hidden="true" className="w-3 text-accent">
            {active ? (search.dir === 'asc' ? '▲' : '▼') : ''}
          </span>
        </button>
      </th>
    );
  };

  return (
    <div className="overflow-x-auto rounded-md border border-line bg-surface">
      {/* Said in words rather than by fading the table, which would take its text below 4.5:1. */}
      {stale && (
        <p role="status" className="border-b border-line bg-sunken px-3 py-1 text-xs text-muted">
          Updating the list…
        </p>
      )}
      <table aria-busy={stale || undefined} className="w-full border-collapse text-sm">
        <caption className="sr-only">Drafts you own or can see through your studios</caption>
        <thead className="border-b border-line bg-sunken">
          <tr>
            <th scope="col" className={`${cell} w-16`}>
              <span className="sr-only">Cloth</span>
            </th>
            {sortable('name', 'Name')}
            <th scope="col" className={`${cell} font-semibold`}>
              Owner
            </th>
            <th scope="col" className={`${cell} font-semibold`}>
              Studio
            </th>
            {sortable('size', 'Ends × picks')}
            <th scope="col" className={`${cell} text-right font-semibold`}>
              Shafts
            </th>
            <th scope="col" className={`${cell} font-semibold`}>
              Structure
            </th>
            {sortable('updated', 'Updated')}
          </tr>
        </thead>
        <tbody>
          {drafts.map((draft) => (
            <tr key={draft.id} className="border-b border-line last:border-b-0 hover:bg-paper">
              <td className={`${cell} w-16`}>
                {draft.thumbnailUrl ? (
                  <img src={draft.thumbnailUrl} alt="" width={48} height={48} loading="lazy" className="size-12 rounded border border-line object-cover [image-rendering:pixelated]" />
                ) : (
                  <span aria-hidden="true" className="block size-12 rounded border border-dashed border-line" />
                )}
              </td>
              <th scope="row" className={`${cell} font-medium`}>
                <Link to={`/drafts/${draft.id}`} className="text-accent underline-offset-4 hover:underline">
                  {draft.name}
                </Link>
              </th>
              <td className={cell}>{draft.ownerName}</td>
              <td className={cell}>{draft.studioName ?? <span className="text-muted">Personal</span>}</td>
              <td className={`${cell} tabular-nums`}>
                {draft.ends} × {draft.picks}
              </td>
              <td className={`${cell} text-right tabular-nums`}>{draft.shafts}</td>
              <td className={cell}>{draft.structure.join(', ') || <span className="text-muted">—</span>}</td>
              <td className={`${cell} whitespace-nowrap`}>
                <time dateTime={draft.updatedAt}>{formatDate(draft.updatedAt)}</time>
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
