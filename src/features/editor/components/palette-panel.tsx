import { useId, useState } from 'react';
import { hexToRgb } from '../../../../shared/weave';
import { FieldError } from '../../../components/ui/field';
import { addPaletteColor, removePaletteColor, setPaletteColor, setYarnName } from '../store/edits';
import { useStore } from '../store/create-store';
import { useEditorContext } from './editor-context';

const HEX = /^#[0-9a-fA-F]{6}$/;

/**
 * Black or white, whichever stands out more on the swatch colour `hex`. (A blend mode would do
 * this in CSS, but it makes the browser composite the whole page through an extra pass on every
 * frame, which costs a drag its frame rate.)
 */
export function tickColorOn(hex: string): '#000000' | '#ffffff' {
  // Source: WCAG 2.1, "relative luminance" and "contrast ratio" definitions (from memory): sRGB
  // channels linearised, weighted 0.2126 / 0.7152 / 0.0722; black and white contrast equally at L ≈ 0.179.
  const [r, g, b] = hexToRgb(hex).map((c) => {
    const s = c / 255;
    return s <= 0.04045 ? s / 12.92 : ((s + 0.055) / 1.055) ** 2.4;
  });
  const luminance = 0.2126 * r + 0.7152 * g + 0.0722 * b;
  return luminance > Math.sqrt(1.05 * 0.05) - 0.05 ? '#000000' : '#ffffff';
}

/** The palette: pick the colour to paint, change it by hex or colour picker, name its yarn. */
export function PalettePanel({ readOnly = false }: { readOnly?: boolean }) {
  const { editor } = useEditorContext();
  const palette = useStore(editor.doc, (s) => s.draft.palette);
  const yarns = useStore(editor.doc, (s) => s.draft.yarns);
  const active = useStore(editor.view, (v) => v.color);

  return (
    <section aria-labelledby="palette-heading" className="flex flex-col gap-2">
      <h2 id="palette-heading" className="text-sm font-semibold">
        Colours and yarns
      </h2>
      <p className="text-xs text-muted">Choose a colour, then draw it into the warp or weft colour order.</p>
      <ul className="flex flex-col gap-1">
        {palette.map((hex, i) => (
          <PaletteRow
            key={i}
            index={i}
            hex={hex}
            yarn={yarns.find((y) => y.color === i)?.name ?? ''}
            active={active === i}
            canRemove={palette.length > 1 && !readOnly}
            readOnly={readOnly}
          />
        ))}
      </ul>
      {!readOnly && (
        <button type="button" className="self-start rounded border border-field px-2 py-1 text-xs hover:bg-sunken" onClick={() => editor.doc.apply(addPaletteColor, { color: '#888888' })}>
          Add colour
        </button>
      )}
    </section>
  );
}

interface RowProps {
  index: number;
  hex: string;
  yarn: string;
  active: boolean;
  canRemove: boolean;
  readOnly: boolean;
}

function PaletteRow({ index, hex, yarn, active, canRemove, readOnly }: RowProps) {
  const { editor } = useEditorContext();
  const [text, setText] = useState(hex);
  const [shown, setShown] = useState(hex);
  // Follow outside changes (undo, another input) without fighting the weaver's typing.
  if (shown !== hex) {
    setShown(hex);
    setText(hex);
  }
  const valid = HEX.test(text);
  const label = `Colour ${index + 1}`;
  const errorId = useId();
  return (
    <li className="flex flex-wrap items-center gap-1.5 text-xs">
      <button
        type="button"
        aria-pressed={active}
        aria-label={`Paint with ${label}${yarn ? `, ${yarn}` : ''}`}
        onClick={() => editor.setView({ color: index })}
        className="h-6 w-6 shrink-0 rounded border-2 border-line aria-pressed:border-accent aria-pressed:ring-2 aria-pressed:ring-accent"
        style={{ backgroundColor: hex }}
      >
        {active && (
          <span aria-hidden="true" className="text-[10px]" style={{ color: tickColorOn(hex) }}>
            ✓
          </span>
        )}
      </button>
      <input
        type="color"
        aria-label={`${label}: pick`}
        value={hex}
        disabled={readOnly}
        onChange={(e) => editor.doc.apply(setPaletteColor, { index, color: e.target.value })}
        className="h-6 w-7 cursor-pointer border-0 bg-transparent p-0"
      />
      <input
        type="text"
        aria-label={`${label}: hex`}
        aria-invalid={!valid}
        aria-describedby={valid ? undefined : errorId}
        value={text}
        disabled={readOnly}
        spellCheck={false}
        onChange={(e) => {
          setText(e.target.value);
          if (HEX.test(e.target.value)) editor.doc.apply(setPaletteColor, { index, color: e.target.value });
        }}
        className="w-20 rounded border border-field bg-surface px-1 font-mono aria-[invalid=true]:border-danger"
      />
      <input
        type="text"
        aria-label={`${label}: yarn name`}
        placeholder="Yarn name"
        defaultValue={yarn}
        key={yarn}
        disabled={readOnly}
        onBlur={(e) => editor.doc.apply(setYarnName, { color: index, name: e.target.value })}
        onKeyDown={(e) => {
          if (e.key === 'Enter') (e.target as HTMLInputElement).blur();
        }}
        className="min-w-0 flex-1 rounded border border-field bg-surface px-1"
      />
      {canRemove && (
        <button type="button" aria-label={`Remove ${label}`} onClick={() => editor.doc.apply(removePaletteColor, { index })} className="rounded px-1 hover:bg-sunken">
          ✕
        </button>
      )}
      {!valid && (
        <div className="basis-full">
          <FieldError id={errorId} message="Write the colour as # and six digits or letters a–f, such as #2f44b0." />
        </div>
      )}
    </li>
  );
}
