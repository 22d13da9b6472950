import { Link, useSearchParams } from 'react-router-dom';
import { buttonClasses } from '../../../components/ui/button';
import { EmptyState } from '../../../components/ui/empty-state';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { useDrafts } from '../api/get-drafts';
import { draftsSearchToParams, pageCount, parseDraftsSearch, toggleSort, type DraftsSearch } from '../drafts-search';
import { DraftsFilters } from './drafts-filters';
import { DraftsSearchForm } from './drafts-search-form';
import { ImportWifButton } from './import-wif-button';
import { DraftsTable } from './drafts-table';
import { Pagination } from './pagination';

/** The Drafts library: search, filters, sort and pages live in the URL; the server does the work. */
export function DraftsLibrary({ studios = [] }: { studios?: readonly { id: number; name: string }[] }) {
  const [params, setParams] = useSearchParams();
  const search = parseDraftsSearch(params);
  const drafts = useDrafts(search);
  const go = (next: DraftsSearch) => setParams(draftsSearchToParams(next));

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <DraftsSearchForm query={search.q} onSearch={(q) => go({ ...search, q, page: 1 })} />
        <DraftsFilters search={search} studios={studios} onChange={go} />
        <div className="flex items-start gap-2">
          <Link to="/drafts/new" className={buttonClasses('primary')}>
            New draft
          </Link>
          <ImportWifButton />
          <Link to="/bin" className={buttonClasses('quiet')}>
            Bin
          </Link>
        </div>
        {drafts.data && (
          <p aria-live="polite" className="text-sm text-muted">
            {drafts.data.total === 1 ? '1 draft' : `${drafts.data.total} drafts`}
            {search.q && ` matching “${search.q}”`}
          </p>
        )}
      </div>

      {drafts.isPending ? (
        <Spinner label="Loading drafts…" />
      ) : drafts.isError ? (
        <ErrorNotice title="Could not load drafts" error={drafts.error} onRetry={() => void drafts.refetch()} />
      ) : drafts.data.total === 0 ? (
        search.q ? (
          <EmptyState
            title={`No drafts match “${search.q}”`}
            action={
              <Link to="/drafts" className="text-accent underline underline-offset-4">
                Clear search
              </Link>
            }
          >
            Try part of the name, or a tag.
          </EmptyState>
        ) : (
          <EmptyState
            title="No drafts yet"
            action={
              <Link to="/drafts/new" className={buttonClasses('primary')}>
                New draft
              </Link>
            }
          >
            Start one with New draft, or bring one from another program with Import WIF file above. Drafts you make, and
            drafts shared with your studios, will be listed here.
          </EmptyState>
        )
      ) : drafts.data.items.length === 0 ? (
        <EmptyState
          title="This page is past the last draft"
          action={
            <Link
              to={{ search: draftsSearchToParams({ ...search, page: pageCount(drafts.data.total, search.pageSize) }).toString() }}
              className="text-accent underline underline-offset-4"
            >
              Go to the last page
            </Link>
          }
        />
      ) : (
        <>
          <DraftsTable drafts={drafts.data.items} search={search} onSort={(sort) => go(toggleSort(search, sort))} stale={drafts.isPlaceholderData} />
          <Pagination
            page={search.page}
            pageSize={search.pageSize}
            total={drafts.data.total}
            onPage={(page) => go({ ...search, page })}
            onPageSize={(pageSize) => go({ ...search, pageSize, page: 1 })}
          />
        </>
      )}
    </div>
  );
}
