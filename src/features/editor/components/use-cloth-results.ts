import { useEffect, useState } from 'react';
import { createClothResults, type ClothResults } from '../store/cloth-results';
import { useStore } from '../store/create-store';
import type { DraftState } from '../store/draft-store';
import type { Editor } from '../store/editor';

/**
 * The open draft, shown once the editor is up and updated once edits pause for `wait` ms and no
 * drag is under way: for work heavier than a grid repaint, so a drag keeps drawing at frame rate.
 */
function useSettledDraft(editor: Editor, wait: number): DraftState | null {
  // Null at first: the panels fill in just after the grids are shown, not before.
  const [settled, setSettled] = useState<DraftState | null>(null);
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | null = null;
    const settle = () => {
      timer = null;
      if (editor.doc.inGesture()) timer = setTimeout(settle, wait);
      else setSettled(editor.doc.get());
    };
    timer = setTimeout(settle, 0);
    const off = editor.doc.subscribe(() => {
      if (timer) clearTimeout(timer);
      timer = setTimeout(settle, wait);
    });
    return () => {
      off();
      if (timer) clearTimeout(timer);
    };
  }, [editor, wait]);
  return settled;
}

/**
 * The cloth views and Checks of the open draft, worked out in a Web Worker (on the page where
 * there is none): asked for once edits settle, and again when the views or their settings change.
 */
export function useClothResults(editor: Editor, wait = 200): ClothResults {
  const [cloth] = useState(createClothResults);
  const settled = useSettledDraft(editor, wait);
  const panels = useStore(editor.view, (v) => v.panels);
  const oneAtATime = useStore(editor.view, (v) => v.oneAtATime);
  const floatLimit = useStore(editor.view, (v) => v.floatLimit);
  const tiles = useStore(editor.view, (v) => v.tile);
  const frames = useStore(cloth.frames, (f) => f);
  useEffect(() => {
    if (!settled) return;
    cloth.request({ draft: settled.draft, revision: settled.revision, views: oneAtATime ? panels.slice(0, 1) : panels, floatLimit, tiles, frames });
  }, [cloth, settled, panels, oneAtATime, floatLimit, tiles, frames]);
  useEffect(() => () => cloth.dispose(), [cloth]);
  return cloth;
}
