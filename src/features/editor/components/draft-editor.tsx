import { LOCALE } from '../../../../shared/words';
import { useContext, useEffect, useMemo, useState, type KeyboardEvent } from 'react';
import type { Draft } from '../../../../shared/weave';
import { createDerived } from '../canvas/derived';
import { openLocalStore, readUnsaved, unsavedKey, type LocalStore, type UnsavedCopy } from '../../../lib/local-drafts';
import { Spinner } from '../../../components/ui/spinner';
import { createAutosave, type SaveFn } from '../store/autosave';
import { fingerprint, keepHistory, restoreKeptHistory } from '../store/kept-history';
import { useStore } from '../store/create-store';
import { createEditor } from '../store/editor';
import { ChecksPanel } from './checks-panel';
import { ClothViews } from './cloth-views';
import { DraftCanvas } from './draft-canvas';
import { EditorContext, type EditorContextValue } from './editor-context';
import { KeysPanel } from './keys-panel';
import { LayersPanel } from './layers-panel';
import { LeaveGuard } from './leave-guard';
import { PalettePanel } from './palette-panel';
import { ProfilePanel } from './profile-panel';
import { SaveStatus } from './save-status';
import { SideColumn } from './side-column';
import { SplitView } from './split-view';
import { Toolbar } from './toolbar';
import { useClothResults } from './use-cloth-results';

export interface DraftEditorProps {
  draft: Draft;
  /** Server version the draft was loaded at; saves are based on it. */
  version: number;
  /** Names what is kept of this draft on the device (unsent edits, undo); defaults to the draft's name. */
  draftId?: string;
  readOnly?: boolean;
  /** Called a moment after edits settle; resolve `{ conflict }` when the server holds a newer version. */
  onSave?: SaveFn;
  /** Inside the app's router: ask before going to another page while edits cannot be sent. */
  guardNavigation?: boolean;
  /** Opens the side column at the block design (a draft just started as a block design). */
  showBlockDesign?: boolean;
}

/** What the device holds for this draft, read before the editor opens. */
interface Kept {
  local: LocalStore | null;
  unsaved: UnsavedCopy | null;
}

/**
 * The draft editor: grids and drawdown on a canvas, tools, palette, cloth views, checks and block
 * design, with undo and autosave. Edits the server has not acknowledged, and the undo history, are
 * kept on the device and come back after a reload. Mount it with a fresh `key` per draft.
 */
export function DraftEditor(props: DraftEditorProps) {
  const { draft, draftId, readOnly = false, onSave } = props;
  const id = draftId ?? draft.name;
  const keeps = !readOnly && onSave !== undefined && typeof indexedDB !== 'undefined';
  const [kept, setKept] = useState<Kept | null>(() => (keeps ? null : { local: null, unsaved: null }));
  useEffect(() => {
    if (!keeps) return;
    let live = true;
    void (async () => {
      const local = await openLocalStore();
      let unsaved = await readUnsaved(local, id);
      // A copy the server already has in a later version (its answer was lost as the page closed) is dropped.
      if (unsaved && props.version > unsaved.baseVersion && fingerprint(unsaved.document) === fingerprint(draft)) {
        await local?.delete(unsavedKey(id)).catch(() => undefined);
        unsaved = null;
      }
      if (live) setKept({ local, unsaved });
    })();
    return () => {
      live = false;
    };
    // Read once per mount: the editor then owns the draft, and later props do not reopen it.
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  if (!kept) return <Spinner label="Opening the draft…" />;
  return <OpenEditor {...props} readOnly={readOnly} id={id} kept={kept} />;
}

const timeOfDay = new Intl.DateTimeFormat(LOCALE, { dateStyle: 'medium', timeStyle: 'short' });

function OpenEditor({ draft, version, readOnly, onSave, guardNavigation = false, showBlockDesign = false, id, kept }: DraftEditorProps & { readOnly: boolean; id: string; kept: Kept }) {
  const [{ editor, derived }] = useState(() => {
    if (typeof performance !== 'undefined') performance.mark('draft-arrived');
    // Edits kept on this device from an earlier visit come back first; the autosave sends them.
    return { editor: createEditor(kept.unsaved ? kept.unsaved.document : draft), derived: createDerived() };
  });
  const cloth = useClothResults(editor);
  const context = useMemo<EditorContextValue>(() => ({ editor, derived, cloth }), [editor, derived, cloth]);
  const [autosave] = useState(() =>
    onSave && !readOnly
      ? createAutosave({
          doc: editor.doc,
          draftId: id,
          version: kept.unsaved?.baseVersion ?? version,
          onSave,
          local: kept.local,
          events: typeof window === 'undefined' ? null : window,
        })
      : null,
  );
  useEffect(() => {
    if (!autosave) return;
    const history = keepHistory(kept.local, id, editor.doc);
    let live = true;
    void restoreKeptHistory(kept.local, id, editor.doc).then((steps) => {
      if (live && steps > 0 && !kept.unsaved) editor.setView({ message: `Undo goes back ${steps} step${steps === 1 ? '' : 's'} from your last visit.` });
    });
    // A restored copy is unsent work: send it now.
    if (kept.unsaved) autosave.forceSave();
    const leave = () => {
      autosave.leave();
      history.flush();
    };
    const onVisibility = () => {
      if (document.visibilityState === 'hidden') leave();
    };
    // Closing or reloading the page asks only when the edits cannot go with it (offline, a
    // conflict, a draft too large to send as the page closes); otherwise they are sent on pagehide.
    const onBeforeUnload = (e: BeforeUnloadEvent) => {
      if (!autosave.cannotSendOnLeave({ pageClosing: true })) return;
      e.preventDefault();
      e.returnValue = '';
    };
    document.addEventListener('visibilitychange', onVisibility);
    window.addEventListener('pagehide', leave);
    window.addEventListener('beforeunload', onBeforeUnload);
    return () => {
      live = false;
      document.removeEventListener('visibilitychange', onVisibility);
      window.removeEventListener('pagehide', leave);
      window.removeEventListener('beforeunload', onBeforeUnload);
      // Leaving the editor for another section or page: unsent edits go now.
      autosave.dispose();
      history.dispose();
    };
  }, [autosave, editor, kept, id]);

  const [showKeys, setShowKeys] = useState(false);

  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const target = e.target as HTMLElement;
    if (e.key === '?' && !/^(INPUT|TEXTAREA|SELECT)$/.test(target.tagName)) {
      setShowKeys((s) => !s);
      e.preventDefault();
    }
  };

  return (
    <EditorContext.Provider value={context}>
      <div className="flex h-full min-h-0 flex-col gap-1 pt-1" onKeyDown={onKeyDown}>
        <div className="flex items-start gap-2">
          <div className="min-w-0 flex-1">
            <Toolbar readOnly={readOnly} onShowKeys={() => setShowKeys((s) => !s)} />
          </div>
          <div className="flex shrink-0 items-center gap-2">
            {autosave && <SaveStatus autosave={autosave} />}
            {autosave && guardNavigation && <LeaveGuard autosave={autosave} />}
            {readOnly && <p className="text-sm text-muted">Read only: you can look, not change.</p>}
          </div>
        </div>
        {kept.unsaved && (
          <p role="status" className="text-sm" data-testid="restored-notice">
            <span aria-hidden="true">↺ </span>Edits kept on this device ({timeOfDay.format(new Date(kept.unsaved.keptAt))}) that had not reached the server were restored; they are sent now.
          </p>
        )}
        <EditorMessage />
        <div className="flex min-h-0 flex-1 gap-2">
          <SplitView
            label="Divider between the grids and the cloth views"
            first={<DraftCanvas readOnly={readOnly} />}
            second={<ClothViews />}
          />
          <SideColumn startOpen={showBlockDesign} scrollTo={showBlockDesign ? 'profile-heading' : undefined}>
            {showKeys && <KeysPanel onClose={() => setShowKeys(false)} />}
            <PalettePanel readOnly={readOnly} />
            <LayersPanel readOnly={readOnly} />
            {!readOnly && <ProfilePanel />}
            <ChecksPanel />
          </SideColumn>
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
