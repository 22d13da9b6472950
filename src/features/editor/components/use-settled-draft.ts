import { useEffect, useState } from 'react';
import type { Draft } from '../../../../shared/weave';
import { useEditorContext } from './editor-context';

/**
 * The open draft, shown once the editor is up and updated once edits pause for `wait` ms and no drag is under way: for panels (cloth views, checks) whose
 * work is heavier than a grid repaint, so a drag keeps drawing at frame rate on big drafts.
 */
export function useSettledDraft(wait = 200): Draft | null {
  const { editor } = useEditorContext();
  // Null at first: the panels fill in just after the grids are shown, not before.
  const [draft, setDraft] = useState<Draft | null>(null);
  useEffect(() => {
    let timer: ReturnType<typeof setTimeout> | null = null;
    const settle = () => {
      timer = null;
      if (editor.doc.inGesture()) timer = setTimeout(settle, wait);
      else setDraft(editor.doc.get().draft);
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
  return draft;
}
