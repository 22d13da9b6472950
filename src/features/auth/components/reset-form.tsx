import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { fieldErrorsOf, isApiError } from '../../../lib/api-client';
import type { SessionUser } from '../../../types/api';
import { useResetPassword } from '../api/reset-password';
import { MIN_PASSWORD_LENGTH } from '../api/sign-up';

export interface ResetFormProps {
  token: string | null;
  onReset: (user: SessionUser) => void;
}

/** Chooses a new password from a mailed link; success signs the person in. */
export function ResetForm({ token, onReset }: ResetFormProps) {
  const reset = useResetPassword();
  const [local, setLocal] = useState<Record<string, string>>({});
  const fields = { ...fieldErrorsOf(reset.error), ...local };

  if (!token) {
    return (
      <div className="flex flex-col gap-3 text-sm">
        <p>This page needs the link from your reset e-mail. Open the link from the mail, or ask for a new one.</p>
        <Link to="/forgot">Ask for a new link</Link>
      </div>
    );
  }

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const password = String(data.get('password') ?? '');
    const confirm = String(data.get('confirm') ?? '');
    const errors: Record<string, string> = {};
    if (password.length < MIN_PASSWORD_LENGTH) errors.password = `Use at least ${MIN_PASSWORD_LENGTH} characters.`;
    else if (password !== confirm) errors.confirm = 'The two passwords differ.';
    setLocal(errors);
    if (Object.keys(errors).length === 0) reset.mutate({ token, password }, { onSuccess: ({ user }) => onReset(user) });
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {reset.isError && !fieldErrorsOf(reset.error).password && (
        <div className="flex flex-col gap-2">
          <ErrorNotice title="Could not set the password" error={reset.error} />
          {isApiError(reset.error, 400) && (
            <Link to="/forgot" className="text-sm">
              Ask for a new link
            </Link>
          )}
        </div>
      )}
      <Field
        label="New password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        error={fields.password}
        hint={`At least ${MIN_PASSWORD_LENGTH} characters.`}
      />
      <Field label="New password again" name="confirm" type="password" autoComplete="new-password" required error={fields.confirm} />
      <Button type="submit" variant="primary" busy={reset.isPending} busyLabel="Saving…">
        Set password and sign in
      </Button>
    </form>
  );
}
