import { useId, type InputHTMLAttributes, type ReactNode, type Ref, type SelectHTMLAttributes } from 'react';

const control =
  'block w-full rounded-md border border-field bg-surface px-3 py-2 text-sm text-ink ' +
  'aria-[invalid=true]:border-danger aria-[invalid=true]:border-2';

interface FieldFrameProps {
  label: string;
  error?: string;
  hint?: ReactNode;
  children: (ids: { id: string; describedBy: string | undefined }) => ReactNode;
}

function FieldFrame({ label, error, hint, children }: FieldFrameProps) {
  const id = useId();
  const hintId = hint ? `${id}-hint` : undefined;
  const errorId = error ? `${id}-error` : undefined;
  const describedBy = [hintId, errorId].filter(Boolean).join(' ') || undefined;
  return (
    <div className="flex flex-col gap-1">
      <label htmlFor={id} className="text-sm font-medium text-ink">
        {label}
      </label>
      {children({ id, describedBy })}
      {hint && (
        <p id={hintId} className="text-xs text-muted">
          {hint}
        </p>
      )}
      {error && <FieldError id={errorId} message={error} />}
    </div>
  );
}

/** A field's error: a mark and words as well as colour, so it reads without colour vision. */
export function FieldError({ id, message }: { id?: string; message: string }) {
  return (
    <p id={id} className="flex items-start gap-1 text-sm font-medium text-danger">
      <span aria-hidden="true">⚠</span>
      <span>{message}</span>
    </p>
  );
}

export interface FieldProps extends Omit<InputHTMLAttributes<HTMLInputElement>, 'id'> {
  /** The input itself, for a form library that reads its value (react-hook-form's `register`). */
  ref?: Ref<HTMLInputElement>;
  label: string;
  /** An error for this field, usually from the API's `fields`. */
  error?: string;
  hint?: ReactNode;
}

/** A labelled input whose hint and error are announced with it. */
export function Field({ label, error, hint, className = '', ...input }: FieldProps) {
  return (
    <FieldFrame label={label} error={error} hint={hint}>
      {({ id, describedBy }) => (
        <input id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={`${control} ${className}`} {...input} />
      )}
    </FieldFrame>
  );
}

export interface SelectFieldProps extends Omit<SelectHTMLAttributes<HTMLSelectElement>, 'id'> {
  label: string;
  error?: string;
  hint?: ReactNode;
}

/** A labelled select, laid out like {@link Field}. */
export function SelectField({ label, error, hint, className = '', children, ...select }: SelectFieldProps) {
  return (
    <FieldFrame label={label} error={error} hint={hint}>
      {({ id, describedBy }) => (
        <select id={id} aria-invalid={error ? true : undefined} aria-describedby={describedBy} className={`${control} ${className}`} {...select}>
          {children}
        </select>
      )}
    </FieldFrame>
  );
}
