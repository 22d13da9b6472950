import { useState } from 'react';
import { GO_TO_HINT } from '../store/go-to';
import { useEditorContext } from './editor-context';

/** "end 120", "picks 10–20": go to a thread or select a run by typing it; the grids take the keyboard after. */
export function GoToBox() {
  const { editor } = useEditorContext();
  const [text, setText] = useState('');
  const [refused, setRefused] = useState(false);
  return (
    <form
      role="search"
      aria-label="Go to an end or pick"
      className="flex items-center gap-1 text-xs"
      onSubmit={(e) => {
        e.preventDefault();
        const ok = editor.goTo(text);
        setRefused(!ok);
        if (ok) {
          setText('');
          document.querySelector<HTMLElement>('[data-testid="draft-canvas"]')?.focus();
        }
      }}
    >
      <label className="flex items-center gap-1">
        Go to
        <input
          type="text"
          value={text}
          onChange={(e) => setText(e.target.value)}
          placeholder="end 120 · picks 10–20"
          title={GO_TO_HINT}
          aria-invalid={refused || undefined}
          aria-describedby="editor-message"
          className="w-40 rounded border border-field bg-surface px-1 aria-invalid:border-danger"
        />
      </label>
    </form>
  );
}
