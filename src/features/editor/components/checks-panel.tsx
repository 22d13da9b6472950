import { useStore } from '../store/create-store';
import { useEditorContext } from './editor-context';

/** Checks: what the engine found wrong, each item jumping to its end or pick. */
export function ChecksPanel() {
  const { editor, cloth } = useEditorContext();
  const result = useStore(cloth, (s) => s.result);
  const items = result?.checks ?? null;
  const count = result?.checkCount ?? 0;

  return (
    <section aria-labelledby="checks-heading" className="flex flex-col gap-1">
      <h2 id="checks-heading" className="text-sm font-semibold">
        Checks <span className="font-normal text-muted">({items === null ? 'working…' : count === 0 ? 'nothing found' : count})</span>
      </h2>
      {items && items.length > 0 && (
        <ul className="max-h-56 overflow-auto text-xs" data-testid="checks">
          {items.map((item) => (
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
          {count > items.length && <li className="px-1 text-muted">and {count - items.length} more</li>}
        </ul>
      )}
    </section>
  );
}
