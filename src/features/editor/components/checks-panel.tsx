import { useState } from 'react';
import type { CheckKind } from '../../../../shared/weave';
import type { CheckItem } from '../canvas/cloth-work';
import { useStore } from '../store/create-store';
import { useEditorContext } from './editor-context';

/**
 * Checks: what the engine found wrong, one item per cause, counted and folded by kind; each item
 * jumps to its end or pick and marks it on the grid.
 */
export function ChecksPanel() {
  const { editor, cloth } = useEditorContext();
  const result = useStore(cloth, (s) => s.result);
  const [folded, setFolded] = useState<ReadonlySet<CheckKind>>(new Set());
  const items = result?.checks ?? null;
  const count = result?.checkCount ?? 0;
  const kinds = (result?.checkKinds ?? []).filter((k) => k.count > 0);
  const toggle = (kind: CheckKind) =>
    setFolded((f) => {
      const next = new Set(f);
      if (!next.delete(kind)) next.add(kind);
      return next;
    });

  return (
    <section aria-labelledby="checks-heading" className="flex flex-col gap-1">
      <h2 id="checks-heading" className="text-sm font-semibold">
        Checks <span className="font-normal text-muted">({items === null ? 'working…' : count === 0 ? 'nothing found' : count})</span>
      </h2>
      {items && items.length > 0 && (
        <div className="max-h-72 overflow-auto text-xs" data-testid="checks">
          {kinds.map(({ kind, label, count: n }) => {
            const open = !folded.has(kind);
            const shown = items.filter((i) => i.kind === kind);
            return (
              <div key={kind} data-kind={kind}>
                <button
                  type="button"
                  aria-expanded={open}
                  onClick={() => toggle(kind)}
                  className="flex w-full items-center gap-1 rounded px-1 py-0.5 text-left font-medium hover:bg-sunken"
                >
                  <span aria-hidden="true" className="w-3">
                    {open ? '▾' : '▸'}
                  </span>
                  {label} <span className="font-normal text-muted">({n})</span>
                </button>
                {open && (
                  <ul className="pl-3">
                    {shown.map((item) => (
                      <CheckRow key={item.key} item={item} onJump={() => editor.jumpTo(item.axis, item.index)} />
                    ))}
                    {n > shown.length && <li className="px-1 text-muted">and {n - shown.length} more</li>}
                  </ul>
                )}
              </div>
            );
          })}
        </div>
      )}
    </section>
  );
}

function CheckRow({ item, onJump }: { item: CheckItem; onJump: () => void }) {
  return (
    <li>
      <button type="button" className="flex w-full items-start gap-1 rounded px-1 py-0.5 text-left hover:bg-sunken" onClick={onJump}>
        <span aria-hidden="true">⚠</span>
        <span>{item.message}</span>
      </button>
    </li>
  );
}
