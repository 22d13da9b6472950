import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { fieldErrorsOf, isApiError } from '../../../lib/api-client';
import { fieldMessage, useSchemaForm } from '../../../lib/schema-form';
import { PASSWORD_MIN_LENGTH, resetFormSchema } from '../../../../shared/api/auth';
import type { SessionUser } from '../../../types/api';
import { useResetPassword } from '../api/reset-password';

export interface ResetFormProps {
  token: string | null;
  onReset: (user: SessionUser) => void;
}

/** Chooses a new password from a mailed link; success signs the person in. */
export function ResetForm({ token, onReset }: ResetFormProps) {
  const reset = useResetPassword();
  const form = useSchemaForm(resetFormSchema, { password: '', confirm: '' });
  const apiFields = fieldErrorsOf(reset.error);
  const message = (name: string) => fieldMessage(form.formState.errors, apiFields, name);

  if (!token) {
    return (
      <div className="flex flex-col gap-3 text-sm">
        <p>This page needs the link from your reset e-mail. Open the link from the mail, or ask for a new one.</p>
        <Link to="/forgot">Ask for a new link</Link>
      </div>
    );
  }

  const submit = form.handleSubmit(({ password }) => reset.mutate({ token, password }, { onSuccess: ({ user }) => onReset(user) }));

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {reset.isError && !apiFields.password && (
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
        type="password"
        autoComplete="new-password"
        required
        error={message('password')}
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        {...form.register('password')}
      />
      <Field label="New password again" type="password" autoComplete="new-password" required error={message('confirm')} {...form.register('confirm')} />
      <Button type="submit" variant="primary" busy={reset.isPending} busyLabel="Saving…">
        Set password and sign in
      </Button>
    </form>
  );
}
