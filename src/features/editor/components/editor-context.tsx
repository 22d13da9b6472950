import { createContext, useContext } from 'react';
import type { Derived } from '../canvas/derived';
import type { ClothResults } from '../store/cloth-results';
import type { Editor } from '../store/editor';

export interface EditorContextValue {
  editor: Editor;
  /** Drawdown, cloth and floats, computed once per change and shared by the canvas and the views. */
  derived: Derived;
  /** Cloth views and Checks, worked out off the main thread once edits settle. */
  cloth: ClothResults;
}

export const EditorContext = createContext<EditorContextValue | null>(null);

/** The open editor; only inside {@link DraftEditor}. */
export function useEditorContext(): EditorContextValue {
  const value = useContext(EditorContext);
  if (!value) throw new Error('useEditorContext is used outside the draft editor');
  return value;
}
