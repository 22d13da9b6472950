import type { ButtonHTMLAttributes } from 'react';

export type ButtonVariant = 'primary' | 'secondary' | 'danger' | 'quiet';

const base =
  'inline-flex items-center justify-center gap-2 rounded-md px-3.5 py-2 text-sm font-medium min-h-9 ' +
  'transition-colors disabled:cursor-not-allowed disabled:opacity-60';

const variants: Record<ButtonVariant, string> = {
  primary: 'bg-accent text-white hover:bg-accent-strong',
  secondary: 'border border-field bg-surface text-ink hover:bg-sunken',
  danger: 'border border-danger bg-surface text-danger hover:bg-danger-soft',
  quiet: 'text-accent underline-offset-4 hover:underline',
};

/** The classes of a button, for links that should look like one. */
export function buttonClasses(variant: ButtonVariant = 'secondary', extra = ''): string {
  return `${base} ${variants[variant]} ${extra}`.trim();
}

export interface ButtonProps extends ButtonHTMLAttributes<HTMLButtonElement> {
  variant?: ButtonVariant;
  /** Shows the work in progress in words and blocks a second press. */
  busy?: boolean;
  busyLabel?: string;
}

/** A button that defaults to `type="button"` so it never submits a form by accident. */
export function Button({ variant = 'secondary', busy = false, busyLabel, className = '', type = 'button', disabled, children, ...rest }: ButtonProps) {
  return (
    <button type={type} className={buttonClasses(variant, className)} disabled={disabled || busy} aria-busy={busy || undefined} {...rest}>
      {busy && busyLabel ? busyLabel : children}
    </button>
  );
}
