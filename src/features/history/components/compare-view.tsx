import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import { useCompareVersions } from '../api/compare-versions';

const MAX_LISTED = 40;

function numbers(list: number[]): string {
  if (list.length === 0) return 'none';
  const shown = list.slice(0, MAX_LISTED).join(', ');
  return list.length > MAX_LISTED ? `${shown} and ${list.length - MAX_LISTED} more` : shown;
}

/** Numbers as runs: 3, 7–12, 40. */
function runs(list: number[]): string {
  const parts: string[] = [];
  for (let i = 0; i < list.length; ) {
    let j = i;
    while (j + 1 < list.length && list[j + 1] === list[j] + 1) j++;
    parts.push(i === j ? String(list[i]) : `${list[i]}–${list[j]}`);
    i = j + 1;
  }
  const shown = parts.slice(0, MAX_LISTED).join(', ');
  return parts.length > MAX_LISTED ? `${shown} and ${parts.length - MAX_LISTED} more runs` : shown;
}

/** Inserted, removed and changed threads, each with where they are. */
function alignment(t: { inserted: number[]; removed: number[]; changed: number[] }, a: number, b: number): string {
  const part = (list: number[], word: string, where: string) => (list.length === 0 ? `none ${word}` : `${list.length} ${word} (${runs(list)} ${where})`);
  return [part(t.inserted, 'inserted', `in version ${b}`), part(t.removed, 'removed', `in version ${a}`), part(t.changed, 'changed', `in version ${b}`)].join('; ');
}

/** What changed between two versions: counts, which ends and picks, and the drawdown difference picture. */
export function CompareView({ draftId, a, b }: { draftId: number; a: number; b: number }) {
  const query = useCompareVersions(draftId, [a, b]);
  if (query.isPending) return <Spinner label="Comparing…" />;
  if (query.isError) return <ErrorNotice title="Could not compare" error={query.error} onRetry={() => void query.refetch()} />;
  const c = query.data;
  return (
    <section aria-labelledby="compare-heading" className="flex flex-col gap-3 rounded-md border border-line bg-surface p-4">
      <h2 id="compare-heading" className="text-lg font-semibold">
        Version {a} compared with version {b}
      </h2>
      <dl className="grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1 text-sm">
        <dt className="text-muted">Ends</dt>
        <dd data-testid="aligned-ends">{alignment(c.aligned.ends, a, b)}</dd>
        <dt className="text-muted">Picks</dt>
        <dd data-testid="aligned-picks">{alignment(c.aligned.picks, a, b)}</dd>
        <dt className="text-muted">Ends that differ place by place</dt>
        <dd data-testid="changed-ends">
          <strong>{c.ends.length}</strong>: {numbers(c.ends)}
        </dd>
        <dt className="text-muted">Picks that differ place by place</dt>
        <dd data-testid="changed-picks">
          <strong>{c.picks.length}</strong>: {numbers(c.picks)}
        </dd>
        <dt className="text-muted">Tie-up cells changed</dt>
        <dd data-testid="changed-tieup">
          <strong>{c.tieup.length}</strong>
          {c.tieup.length > 0 && `: ${c.tieup.slice(0, MAX_LISTED).map((t) => `treadle ${t.treadle} shaft ${t.shaft}`).join(', ')}`}
        </dd>
        <dt className="text-muted">Drawdown cells changed</dt>
        <dd>
          <strong>{c.cells}</strong>
        </dd>
      </dl>
      <figure className="flex flex-col gap-2">
        <img
          src={c.imageUrl}
          alt={`Drawdown differences between version ${a} and version ${b}: ${c.cells} cells changed`}
          className="max-h-96 w-fit max-w-full rounded-md border border-line [image-rendering:pixelated]"
          style={{ minWidth: 240 }}
        />
        <figcaption className="text-xs text-muted">
          Faint: unchanged. Darkest: the end now lies over the pick. Dark orange: the end now lies under it. Counts above give the same in numbers.
        </figcaption>
      </figure>
    </section>
  );
}
