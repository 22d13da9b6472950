import { useContext, useEffect, useMemo, useState, type KeyboardEvent } from 'react';
import type { Draft } from '../../../../shared/weave';
import { createDerived } from '../canvas/derived';
import { createAutosave, findLocalCopy, type SaveFn } from '../store/autosave';
import { useStore } from '../store/create-store';
import { createEditor } from '../store/editor';
import { renameDraft } from '../store/edits';
import { ChecksPanel } from './checks-panel';
import { ClothViews } from './cloth-views';
import { DraftCanvas } from './draft-canvas';
import { EditorContext, type EditorContextValue } from './editor-context';
import { KeysPanel } from './keys-panel';
import { LayersPanel } from './layers-panel';
import { PalettePanel } from './palette-panel';
import { ProfilePanel } from './profile-panel';
import { SaveStatus } from './save-status';
import { Toolbar } from './toolbar';
import { useClothResults } from './use-cloth-results';

export interface DraftEditorProps {
  draft: Draft;
  /** Server version the draft was loaded at; saves are based on it. */
  version: number;
  /** Names the copy of unsaved edits kept on this device; defaults to the draft's name. */
  draftId?: string;
  readOnly?: boolean;
  /** Called a moment after edits settle; resolve `{ conflict }` when the server holds a newer version. */
  onSave?: SaveFn;
}

const storage = () => {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    return null;
  }
};

/**
 * The draft editor: grids and drawdown on a canvas, tools, palette, cloth views, checks and block
 * design, with undo and autosave. Mount it with a fresh `key` per draft.
 */
export function DraftEditor({ draft, version, draftId, readOnly = false, onSave }: DraftEditorProps) {
  const [{ editor, derived, restored }] = useState(() => {
    if (typeof performance !== 'undefined') performance.mark('draft-arrived');
    // Edits kept on this device from an earlier visit come back first; the autosave sends them.
    const local = !readOnly && onSave ? findLocalCopy(storage(), draftId ?? draft.name) : null;
    return { editor: createEditor(local ? local.document : draft), derived: createDerived(), restored: local };
  });
  const cloth = useClothResults(editor);
  const context = useMemo<EditorContextValue>(() => ({ editor, derived, cloth }), [editor, derived, cloth]);
  const [autosave] = useState(() =>
    onSave && !readOnly
      ? createAutosave({
          doc: editor.doc,
          draftId: draftId ?? draft.name,
          version: restored?.baseVersion ?? version,
          onSave,
          storage: storage(),
          events: typeof window === 'undefined' ? null : window,
        })
      : null,
  );
  useEffect(() => {
    if (!autosave) return;
    // A restored copy is unsent work: send it now.
    if (restored) autosave.forceSave();
    return () => autosave.dispose();
  }, [autosave, restored]);

  const [showKeys, setShowKeys] = useState(false);
  const name = useStore(editor.doc, (s) => s.draft.name);

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const target = e.target as HTMLElement;
    if (e.key === '?' && !/^(INPUT|TEXTAREA|SELECT)$/.test(target.tagName)) {
      setShowKeys((s) => !s);
      e.preventDefault();
    }
  };

  return (
    <EditorContext.Provider value={context}>
      <div className="flex h-full min-h-0 flex-col gap-2 p-2" onKeyDown={onKeyDown}>
        <header className="flex flex-wrap items-start justify-between gap-2">
          <label className="flex items-center gap-2">
            <span className="sr-only">Draft name</span>
            <input
              key={name}
              defaultValue={name}
              readOnly={readOnly}
              onBlur={(e) => editor.doc.apply(renameDraft, { name: e.target.value })}
              className="rounded border border-transparent bg-transparent px-1 text-lg font-semibold hover:border-line focus:border-field"
            />
          </label>
          {autosave && <SaveStatus autosave={autosave} />}
          {readOnly && <p className="text-sm text-muted">Read only: you can look, not change.</p>}
        </header>
        <Toolbar readOnly={readOnly} onShowKeys={() => setShowKeys((s) => !s)} />
        <EditorMessage />
        <div className="flex min-h-0 flex-1 gap-3">
          <div className="flex min-w-0 flex-1 flex-col gap-3">
            <div className="h-[60vh] min-h-[320px]">
              <DraftCanvas readOnly={readOnly} />
            </div>
            <ClothViews />
          </div>
          <aside className="flex w-80 shrink-0 flex-col gap-4 overflow-y-auto">
            {showKeys && <KeysPanel onClose={() => setShowKeys(false)} />}
            <PalettePanel readOnly={readOnly} />
            <LayersPanel readOnly={readOnly} />
            <ChecksPanel />
            {!readOnly && <ProfilePanel />}
          </aside>
        </div>
      </div>
    </EditorContext.Provider>
  );
}

/** What just happened, said by screen readers; its own component so a message never re-renders the editor. */
function EditorMessage() {
  const { editor } = useContext(EditorContext)!;
  const message = useStore(editor.view, (v) => v.message);
  return (
    <p id="editor-message" aria-live="polite" className="min-h-5 text-xs text-muted" data-testid="editor-message">
      {message}
    </p>
  );
}
