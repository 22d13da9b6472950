import { useState, type ReactNode } from 'react';
import { MAX_SHAFTS, MAX_TREADLES, type RunChange } from '../../../../shared/weave';
import { ARRANGEMENT_NAMES, NAMES } from '../../../../shared/words';
import { useStore } from '../store/create-store';
import { setShafts, setTreadles } from '../store/edits';
import { COMMANDS, tooltipOf, type CommandId } from '../store/commands';
import type { Editor, Tool } from '../store/editor';
import { useEditorContext } from './editor-context';
import { GoToBox } from './go-to-box';

const TOOLS: { id: Tool; command: CommandId }[] = [
  { id: 'draw', command: 'draw' },
  { id: 'erase', command: 'erase' },
  { id: 'select', command: 'select' },
];

const btn = 'rounded border border-field bg-surface px-2 py-1 text-xs hover:bg-sunken disabled:opacity-50';

/**
 * A toolbar button drawn from the command list: its words, its tooltip with the key, and disabled
 * while the command has nothing to act on.
 */
function CommandButton({ id, text, className = btn, pressed }: { id: CommandId; text?: string; className?: string; pressed?: boolean }) {
  const { editor } = useEditorContext();
  const command = COMMANDS[id];
  const enabled = useEnabled(editor, id);
  return (
    <button type="button" className={className} aria-pressed={pressed} disabled={!enabled} onClick={() => command.run(editor)} title={tooltipOf(command)}>
      {text ?? command.label}
    </button>
  );
}

function useEnabled(editor: Editor, id: CommandId): boolean {
  const command = COMMANDS[id];
  const byDoc = useStore(editor.doc, () => command.enabled?.(editor) ?? true);
  const byView = useStore(editor.view, () => command.enabled?.(editor) ?? true);
  return byDoc && byView;
}

function Group({ label, children }: { label: string; children: ReactNode }) {
  return (
    <div role="group" aria-label={label} className="flex flex-wrap items-center gap-1 border-r border-line pr-2 last:border-r-0">
      {children}
    </div>
  );
}

/** Tools, edits, loom size, zoom and arrangement. Every button has a key listed in Keys. */
export function Toolbar({ readOnly = false, onShowKeys }: { readOnly?: boolean; onShowKeys: () => void }) {
  const { editor } = useEditorContext();
  const tool = useStore(editor.view, (v) => v.tool);
  const cell = useStore(editor.view, (v) => v.cell);
  const arrangement = useStore(editor.view, (v) => v.arrangement);
  const rulerStep = useStore(editor.view, (v) => v.rulerStep);
  const drawdownView = useStore(editor.view, (v) => v.drawdownView);
  const undoLabel = useStore(editor.doc, (s) => s.undoLabel);
  const redoLabel = useStore(editor.doc, (s) => s.redoLabel);
  const shafts = useStore(editor.doc, (s) => s.draft.shafts);
  const treadles = useStore(editor.doc, (s) => s.draft.treadles);
  const control = useStore(editor.doc, (s) => s.draft.control);
  const ends = useStore(editor.doc, (s) => s.draft.threading.length);
  const [repeatTimes, setRepeatTimes] = useState(1);
  const [change, setChange] = useState<RunChange>('reverse');
  const [asking, setAsking] = useState(false);
  const [loomTreadles, setLoomTreadles] = useState(treadles || 10);
  const [refusal, setRefusal] = useState<string | null>(null);

  const fit = () => {
    // Whole cloth: the largest whole cell size at which every end fits the drawdown's width.
    const width = document.querySelector('[data-testid="draft-canvas"]')?.clientWidth ?? 900;
    editor.setView({ cell: Math.max(1, Math.min(40, Math.floor((width - 160) / Math.max(1, ends + 8)))), scrollX: 0, scrollY: 0 });
  };

  return (
    <div className="flex flex-col gap-2">
      <div className="flex flex-wrap items-center gap-2" role="toolbar" aria-label="Draft tools">
        {!readOnly && (
          <>
            <Group label="Tool">
              {TOOLS.map((t) => (
                <CommandButton key={t.id} id={t.command} pressed={tool === t.id} className={`${btn} aria-pressed:bg-accent aria-pressed:text-white`} />
              ))}
            </Group>
            <Group label="History">
              <CommandButton id="undo" text={undoLabel ? `Undo ${undoLabel.toLowerCase()}` : 'Undo'} />
              <CommandButton id="redo" text={redoLabel ? `Redo ${redoLabel.toLowerCase()}` : 'Redo'} />
            </Group>
            <Group label="Draws and repeats over the selection">
              <CommandButton id="straightDraw" />
              <CommandButton id="pointDraw" />
              <CommandButton id="brokenDraw" />
              <button type="button" className={btn} onClick={() => editor.repeatSelection(repeatTimes)} title={`Repeat the selection after itself, × times (${COMMANDS.repeat.keys} repeats once)`}>
                {COMMANDS.repeat.label}
              </button>
              <label className="flex items-center gap-1 text-xs">
                ×
                <input type="number" min={1} max={100} value={repeatTimes} onChange={(e) => setRepeatTimes(Math.max(1, Math.min(100, Number(e.target.value) || 1)))} className="w-12 rounded border border-field bg-surface px-1" aria-label="Repeat how many times" />
              </label>
              <button type="button" className={btn} onClick={() => editor.repeatWithChange(repeatTimes, change)} title="The run × times, then changed × times, across the warp or weft">
                Repeat with a change
              </button>
              <select value={change} onChange={(e) => setChange(e.target.value as RunChange)} aria-label="The change" className="rounded border border-field bg-surface px-1 text-xs">
                <option value="reverse">reversed</option>
                <option value="swap">two values swapped</option>
              </select>
              <CommandButton id="mirror" />
              <CommandButton id="reverse" />
              <CommandButton id="upsideDown" />
            </Group>
            <Group label="Ends and picks">
              <CommandButton id="insert" />
              <CommandButton id="delete" />
              <CommandButton id="copy" />
              <CommandButton id="paste" />
            </Group>
            <Group label="Picks">
              {control === 'treadling' ? (
                <>
                  <CommandButton id="treadleAsDrawnIn" />
                  <button type="button" className={btn} onClick={() => editor.toLiftPlan()}>
                    Use a lift plan
                  </button>
                </>
              ) : (
                <button type="button" className={btn} aria-expanded={asking} onClick={() => setAsking(!asking)}>
                  Use tie-up and treadling…
                </button>
              )}
            </Group>
          </>
        )}
        <Group label="Loom">
          <label className="flex items-center gap-1 text-xs">
            Shafts
            <input type="number" min={1} max={MAX_SHAFTS} value={shafts} disabled={readOnly} onChange={(e) => editor.doc.apply(setShafts, { shafts: Number(e.target.value) || 1 })} className="w-12 rounded border border-field bg-surface px-1" />
          </label>
          {control === 'treadling' && (
            <label className="flex items-center gap-1 text-xs">
              Treadles
              <input type="number" min={1} max={MAX_TREADLES} value={treadles} disabled={readOnly} onChange={(e) => editor.doc.apply(setTreadles, { treadles: Number(e.target.value) || 1 })} className="w-12 rounded border border-field bg-surface px-1" />
            </label>
          )}
        </Group>
        <Group label="View">
          <GoToBox />
          <label className="flex items-center gap-1 text-xs">
            Zoom
            <input type="range" min={1} max={40} value={cell} onChange={(e) => editor.setView({ cell: Number(e.target.value) })} aria-valuetext={`${cell} pixels per cell`} />
          </label>
          <button type="button" className={btn} onClick={fit}>
            Whole cloth
          </button>
          <button type="button" className={btn} onClick={() => editor.setView({ cell: 24 })}>
            Close up
          </button>
          <label className="flex items-center gap-1 text-xs">
            Drawdown
            <select value={drawdownView} onChange={(e) => editor.setView({ drawdownView: e.target.value as 'structure' | 'colour' })} className="rounded border border-field bg-surface px-1">
              <option value="colour">Colour</option>
              <option value="structure">Structure</option>
            </select>
          </label>
          <label className="flex items-center gap-1 text-xs">
            {NAMES.numbersEvery}
            <select value={rulerStep} onChange={(e) => editor.setView({ rulerStep: Number(e.target.value) as 4 | 8 | 10 })} className="rounded border border-field bg-surface px-1">
              {[4, 8, 10].map((n) => (
                <option key={n} value={n}>
                  {n}
                </option>
              ))}
            </select>
          </label>
          <label className="flex items-center gap-1 text-xs">
            <input type="checkbox" checked={arrangement.endOneRight} onChange={(e) => editor.arrange({ endOneRight: e.target.checked })} />
            {ARRANGEMENT_NAMES.endOneRight}
          </label>
          <label className="flex items-center gap-1 text-xs">
            <input type="checkbox" checked={!arrangement.threadingBelow} onChange={(e) => editor.arrange({ threadingBelow: !e.target.checked })} />
            {ARRANGEMENT_NAMES.threadingAbove}
          </label>
          <label className="flex items-center gap-1 text-xs">
            <input type="checkbox" checked={!arrangement.treadlingLeft} onChange={(e) => editor.arrange({ treadlingLeft: !e.target.checked })} />
            {ARRANGEMENT_NAMES.treadlingRight}
          </label>
          <label className="flex items-center gap-1 text-xs">
            <input type="checkbox" checked={!arrangement.shaftsFromTop} onChange={(e) => editor.arrange({ shaftsFromTop: !e.target.checked })} />
            {ARRANGEMENT_NAMES.shaftOneAtBottom}
          </label>
          <button type="button" className={btn} onClick={onShowKeys} title="Keys (?)">
            Keys
          </button>
        </Group>
      </div>
      {asking && control === 'liftplan' && (
        <form
          className="flex flex-wrap items-center gap-2 rounded border border-line bg-surface p-2 text-xs"
          onSubmit={(e) => {
            e.preventDefault();
            const reason = editor.toTreadling(loomTreadles);
            setRefusal(reason);
            if (!reason) setAsking(false);
          }}
        >
          <label className="flex items-center gap-1">
            Treadles on your loom
            <input type="number" min={1} max={MAX_TREADLES} value={loomTreadles} onChange={(e) => setLoomTreadles(Number(e.target.value) || 1)} className="w-14 rounded border border-field bg-surface px-1" autoFocus />
          </label>
          <button type="submit" className={`${btn} bg-accent text-white`}>
            Work out tie-up and treadling
          </button>
          <button type="button" className={btn} onClick={() => setAsking(false)}>
            Cancel
          </button>
          {refusal && (
            <p role="alert" className="flex w-full items-start gap-1 font-medium text-danger">
              <span aria-hidden="true">⚠</span>
              {refusal}
            </p>
          )}
        </form>
      )}
    </div>
  );
}
