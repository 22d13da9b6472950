import { SHORTCUTS } from '../store/commands';

/** Keys: every shortcut the editor answers, from the same command list that handles them and draws the toolbar. */
export function KeysPanel({ onClose }: { onClose: () => void }) {
  return (
    <section aria-labelledby="keys-heading" className="rounded-md border border-line bg-surface p-3 shadow-sm" data-testid="keys-panel">
      <div className="mb-2 flex items-center justify-between">
        <h2 id="keys-heading" className="text-sm font-semibold">
          Keys
        </h2>
        <button type="button" onClick={onClose} className="rounded px-2 text-sm hover:bg-sunken" aria-label="Close keys">
          ✕
        </button>
      </div>
      <dl className="grid grid-cols-[max-content_1fr] gap-x-4 gap-y-1 text-xs">
        {SHORTCUTS.map((s) => (
          <div key={s.keys} className="contents">
            <dt>
              <kbd className="rounded border border-line bg-sunken px-1 font-sans">{s.keys}</kbd>
            </dt>
            <dd>{s.does}</dd>
          </div>
        ))}
        <div className="contents">
          <dt>
            <kbd className="rounded border border-line bg-sunken px-1 font-sans">?</kbd>
          </dt>
          <dd>Show or hide this list</dd>
        </div>
        <div className="contents">
          <dt>Mouse</dt>
          <dd>Drag to draw; Shift-drag selects; Alt adds a second shaft; wheel scrolls, Ctrl-wheel zooms; middle-drag pans</dd>
        </div>
      </dl>
    </section>
  );
}
