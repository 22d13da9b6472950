import { LOCALE } from '../../../../shared/words';
import { useState, type ReactNode } from 'react';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Spinner } from '../../../components/ui/spinner';
import type { StudioRole } from '../../../types/api';
import { useVersions } from '../api/get-versions';
import { useRestoreVersion } from '../api/restore-version';
import { CompareView } from './compare-view';
import { VersionView } from './version-view';

const when = new Intl.DateTimeFormat(LOCALE, { dateStyle: 'medium', timeStyle: 'short' });
const cell = 'px-3 py-2 text-left align-top';

/**
 * A draft's versions: open one read-only, restore it (as a new version), or tick two to compare.
 * `extra` shows beside an open version (photos of the cloth woven from it).
 */
export function HistoryPage({ draftId, role, extra }: { draftId: number; role: StudioRole; extra?: (n: number) => ReactNode }) {
  const versions = useVersions(draftId);
  const restore = useRestoreVersion();
  const [open, setOpen] = useState<number | null>(null);
  const [picked, setPicked] = useState<number[]>([]);
  const [compared, setCompared] = useState<[number, number] | null>(null);
  const canWrite = role !== 'viewer';

  if (versions.isPending) return <Spinner label="Loading versions…" />;
  if (versions.isError) return <ErrorNotice title="Could not load the history" error={versions.error} onRetry={() => void versions.refetch()} />;

  const toggle = (n: number) => setPicked((p) => (p.includes(n) ? p.filter((x) => x !== n) : [...p.slice(-1), n]));
  const [older, newer] = [...picked].sort((x, y) => x - y);

  return (
    <div className="flex flex-col gap-4">
      {restore.isError && <ErrorNotice title="Could not restore" error={restore.error} />}
      {restore.isSuccess && <p role="status">Restored as version {restore.data.version}.</p>}
      <div className="flex items-center gap-3">
        <Button variant="primary" disabled={picked.length !== 2} onClick={() => setCompared([older, newer])}>
          Compare
        </Button>
        <span className="text-sm text-muted">{picked.length === 2 ? `Versions ${older} and ${newer} ticked` : 'Tick two versions to compare them'}</span>
      </div>
      <div className="overflow-x-auto rounded-md border border-line bg-surface">
        <table className="w-full border-collapse text-sm">
          <caption className="sr-only">Versions of this draft, newest first</caption>
          <thead className="border-b border-line bg-sunken">
            <tr>
              <th scope="col" className={cell}>Compare</th>
              <th scope="col" className={cell}>Version</th>
              <th scope="col" className={cell}>Saved by</th>
              <th scope="col" className={cell}>When</th>
              <th scope="col" className={cell}>Message</th>
              <th scope="col" className={cell}><span className="sr-only">Actions</span></th>
            </tr>
          </thead>
          <tbody>
            {versions.data.versions.map((v, i) => (
              <tr key={v.version} className="border-b border-line last:border-b-0">
                <td className={cell}>
                  <input type="checkbox" aria-label={`Compare version ${v.version}`} checked={picked.includes(v.version)} onChange={() => toggle(v.version)} />
                </td>
                <th scope="row" className={`${cell} tabular-nums`}>
                  {v.version}
                  {i === 0 && <span className="ml-2 rounded-full border border-line px-2 text-xs font-normal">current</span>}
                </th>
                <td className={cell}>{v.authorName}</td>
                <td className={`${cell} whitespace-nowrap`}>
                  <time dateTime={v.createdAt}>{when.format(new Date(v.createdAt))}</time>
                </td>
                <td className={cell}>{v.message}</td>
                <td className={`${cell} whitespace-nowrap`}>
                  <Button variant="quiet" onClick={() => setOpen(v.version)} aria-pressed={open === v.version}>
                    Open<span className="sr-only"> version {v.version}</span>
                  </Button>
                  {canWrite && i > 0 && (
                    <Button variant="quiet" busy={restore.isPending && restore.variables?.n === v.version} busyLabel="Restoring…"
                      onClick={() => restore.mutate({ draftId, n: v.version })}>
                      Restore<span className="sr-only"> version {v.version}</span>
                    </Button>
                  )}
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {compared && <CompareView key={compared.join('-')} draftId={draftId} a={compared[0]} b={compared[1]} />}
      {open !== null && (
        <div className="flex flex-col gap-3">
          <VersionView key={open} draftId={draftId} n={open} />
          {extra?.(open)}
        </div>
      )}
    </div>
  );
}
