import { useState, type ReactNode } from 'react';
import { Field } from '../../../components/ui/field';

/** Up to three decimals, without trailing zeros: 25.4, 3.937. */
export function formatNumber(value: number | undefined, decimals = 3): string {
  return value === undefined ? '' : String(Number(value.toFixed(decimals)));
}

export interface NumberFieldProps {
  label: string;
  value: number | undefined;
  onChange: (value: number | undefined) => void;
  /** Blank is allowed and means "use the default". */
  optional?: boolean;
  /** Shown ×scale (100 for a fraction shown as a percentage). */
  scale?: number;
  placeholder?: string;
  hint?: ReactNode;
  error?: string;
}

function sameNumber(a: number | undefined, b: number | undefined): boolean {
  if (a === undefined || b === undefined) return a === b;
  return Math.abs(a - b) <= 1e-9 * Math.max(1, Math.abs(b));
}

/**
 * A number typed as text, so "1." or "" can sit in the box while the weaver types; the plan
 * only takes values that read as numbers. A change from outside (a unit switch) replaces the text.
 */
export function NumberField({ label, value, onChange, optional = false, scale = 1, placeholder, hint, error }: NumberFieldProps) {
  const shown = value === undefined ? undefined : value * scale;
  const [text, setText] = useState(formatNumber(shown));
  const [last, setLast] = useState(shown);
  const [local, setLocal] = useState<string | undefined>();
  // A tolerance, since 0.07 × 100 is not exactly 7.
  if (!sameNumber(shown, last)) {
    setLast(shown);
    setText(formatNumber(shown));
    setLocal(undefined);
  }
  return (
    <Field
      label={label}
      inputMode="decimal"
      value={text}
      placeholder={placeholder}
      hint={hint}
      error={local ?? error}
      onChange={(e) => {
        const raw = e.target.value;
        setText(raw);
        const t = raw.trim();
        if (t === '') {
          if (!optional) return setLocal('Give a number.');
          setLocal(undefined);
          setLast(undefined);
          return onChange(undefined);
        }
        const n = Number(t);
        if (!Number.isFinite(n)) return setLocal('Write a number, e.g. 12.5.');
        setLocal(undefined);
        setLast(n);
        onChange(n / scale);
      }}
    />
  );
}
