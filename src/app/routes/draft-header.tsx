import { Link } from 'react-router-dom';
import { draftSchema } from '../../../shared/weave';
import { NewColourwayDialog } from '../../features/forks/components/new-colourway-dialog';
import { useYarns } from '../../features/yarns/api/get-yarns';
import { ROLE_LABEL } from '../../lib/roles';
import type { DraftDetail } from '../../types/api';

/** The draft's name and the facts a weaver glances at while drawing, on one line; actions at its end. */
export function DraftHeader({ draft }: { draft: DraftDetail }) {
  const facts: [string, string][] = [
    ['Studio', draft.studioName ?? 'Personal'],
    ['Ends × picks', `${draft.ends} × ${draft.picks}`],
    ['Shafts', String(draft.shafts)],
    ['Your role', ROLE_LABEL[draft.role]],
  ];
  return (
    <header className="flex flex-wrap items-center gap-x-4 gap-y-1 pb-1">
      <Link to="/drafts" className="text-sm">
        <span aria-hidden="true">←</span> Drafts
      </Link>
      <h1 className="text-lg font-semibold">{draft.name}</h1>
      <dl className="flex flex-wrap gap-x-3 text-sm">
        {facts.map(([label, value]) => (
          <div key={label} className="flex gap-1">
            <dt className="text-muted">{label}</dt>
            <dd className="font-medium tabular-nums">{value}</dd>
          </div>
        ))}
      </dl>
      {draft.tags.length > 0 && (
        <ul aria-label="Tags" className="flex flex-wrap gap-1">
          {draft.tags.map((tag) => (
            <li key={tag} className="rounded-full border border-line bg-surface px-2 text-xs">
              {tag}
            </li>
          ))}
        </ul>
      )}
      <div className="ml-auto flex items-center gap-2">
        {draft.role !== 'viewer' && (
          <Link to={`/drafts/${draft.id}/notes`} className="text-sm">
            Edit details
          </Link>
        )}
        <Colourway draft={draft} />
      </div>
    </header>
  );
}

function Colourway({ draft }: { draft: DraftDetail }) {
  const yarns = useYarns();
  const document = draftSchema.safeParse(draft.document);
  if (!document.success) return null;
  return (
    <NewColourwayDialog draftId={draft.id} draftName={draft.name} version={draft.version} palette={document.data.palette}
      yarns={yarns.data?.yarns ?? []} />
  );
}
