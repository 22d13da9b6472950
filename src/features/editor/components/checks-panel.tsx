import { useMemo } from 'react';
import { checkThreading, isLayered, type Float } from '../../../../shared/weave';
import { useStore } from '../store/create-store';
import { useEditorContext } from './editor-context';
import { useSettledDraft } from './use-settled-draft';

interface CheckItem {
  key: string;
  axis: 'ends' | 'picks';
  index: number;
  message: string;
}

const MAX_SHOWN = 100;

/** Checks: what the engine found wrong, each item jumping to its end or pick. */
export function ChecksPanel() {
  const { editor, derived } = useEditorContext();
  const draft = useSettledDraft();
  const floatLimit = useStore(editor.view, (v) => v.floatLimit);
  const items = useMemo(() => {
    const list: CheckItem[] = [];
    if (!draft) return null;
    for (const p of checkThreading(draft).problems) list.push({ key: `t-${p.end}-${p.shaft}`, axis: 'ends', index: p.end, message: p.message });
    if (isLayered(draft)) {
      derived.layers(draft).problems.forEach((p, i) => {
        if (p.end !== undefined) list.push({ key: `l-${i}`, axis: 'ends', index: p.end, message: p.message });
        else if (p.pick !== undefined) list.push({ key: `l-${i}`, axis: 'picks', index: p.pick, message: p.message });
      });
    }
    // One item per thread: its longest float over the limit (a thread may float many times).
    const longest = new Map<string, Float>();
    for (const f of derived.floats(draft, floatLimit).overLimit) {
      const key = `${f.kind}-${f.thread}`;
      const best = longest.get(key);
      if (!best || f.length > best.length) longest.set(key, f);
    }
    for (const f of longest.values()) {
      list.push({
        key: `f-${f.kind}-${f.thread}-${f.start}`,
        axis: f.kind === 'warp' ? 'ends' : 'picks',
        index: f.thread,
        message: `${f.kind === 'warp' ? 'End' : 'Pick'} ${f.thread + 1} floats ${f.side} ${f.length} threads (your limit is ${floatLimit}).`,
      });
    }
    return list;
  }, [draft, derived, floatLimit]);

  return (
    <section aria-labelledby="checks-heading" className="flex flex-col gap-1">
      <h2 id="checks-heading" className="text-sm font-semibold">
        Checks <span className="font-normal text-muted">({items === null ? 'working…' : items.length === 0 ? 'nothing found' : items.length})</span>
      </h2>
      {items && items.length > 0 && (
        <ul className="max-h-56 overflow-auto text-xs" data-testid="checks">
          {items.slice(0, MAX_SHOWN).map((item) => (
            <li key={item.key}>
              <button
                type="button"
                className="flex w-full items-start gap-1 rounded px-1 py-0.5 text-left hover:bg-sunken"
                onClick={() => editor.jumpTo(item.axis, item.index)}
              >
                <span aria-hidden="true">⚠</span>
                <span>{item.message}</span>
              </button>
            </li>
          ))}
          {items.length > MAX_SHOWN && <li className="px-1 text-muted">and {items.length - MAX_SHOWN} more</li>}
        </ul>
      )}
    </section>
  );
}
