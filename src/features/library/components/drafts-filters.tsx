import { MAX_SHAFTS, STRUCTURES, type DraftsSearch } from '../drafts-search';

export interface DraftsFiltersProps {
  search: DraftsSearch;
  studios: readonly { id: number; name: string }[];
  onChange: (next: DraftsSearch) => void;
}

const select = 'rounded-md border border-field bg-surface px-2 py-2 text-sm';

/** Narrow the library by shafts, structure and studio; each choice applies at once. */
export function DraftsFilters({ search, studios, onChange }: DraftsFiltersProps) {
  const set = (patch: Partial<DraftsSearch>) => onChange({ ...search, ...patch, page: 1 });
  return (
    <div className="flex flex-wrap items-end gap-3 text-sm">
      <label className="flex flex-col gap-1">
        <span className="font-medium">Shafts</span>
        <select className={select} value={search.shafts ?? ''} onChange={(e) => set({ shafts: e.target.value ? Number(e.target.value) : undefined })}>
          <option value="">Any</option>
          {Array.from({ length: MAX_SHAFTS }, (_, i) => i + 1).map((n) => <option key={n} value={n}>{n}</option>)}
        </select>
      </label>
      <label className="flex flex-col gap-1">
        <span className="font-medium">Structure</span>
        <select className={select} value={search.structure} onChange={(e) => set({ structure: e.target.value })}>
          <option value="">Any</option>
          {STRUCTURES.map((s) => <option key={s} value={s}>{s}</option>)}
        </select>
      </label>
      {studios.length > 0 && (
        <label className="flex flex-col gap-1">
          <span className="font-medium">Studio</span>
          <select className={select} value={search.studio ?? ''} onChange={(e) => set({ studio: e.target.value ? Number(e.target.value) : undefined })}>
            <option value="">Any</option>
            {studios.map((s) => <option key={s.id} value={s.id}>{s.name}</option>)}
          </select>
        </label>
      )}
    </div>
  );
}
