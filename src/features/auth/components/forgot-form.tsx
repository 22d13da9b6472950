import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import { fieldMessage, useSchemaForm } from '../../../lib/schema-form';
import { forgotBodySchema } from '../../../../shared/api/auth';
import { useRequestReset } from '../api/request-reset';

/** Asks for a reset link. The answer is the same for any address, so it reveals no accounts. */
export function ForgotForm() {
  const request = useRequestReset();
  const form = useSchemaForm(forgotBodySchema, { email: '' });
  const apiFields = fieldErrorsOf(request.error);
  const email = form.getValues('email');

  if (request.isSuccess) {
    return (
      <div role="status" className="flex flex-col gap-3 text-sm">
        <p>
          If an account uses <strong>{email}</strong>, a link to choose a new password is on its way. The link works for a
          limited time.
        </p>
        {import.meta.env.DEV && (
          <p>
            Working locally? <Link to="/admin/mails">Open the captured mails</Link>.
          </p>
        )}
        <Link to="/sign-in">Back to sign in</Link>
      </div>
    );
  }

  const submit = form.handleSubmit((body) => request.mutate(body));

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {request.isError && !apiFields.email && <ErrorNotice title="Could not send the link" error={request.error} />}
      <p className="text-sm text-muted">Enter the e-mail address you signed up with and we will send a link to choose a new password.</p>
      <Field
        label="E-mail"
        type="email"
        autoComplete="email"
        required
        error={fieldMessage(form.formState.errors, apiFields, 'email')}
        {...form.register('email')}
      />
      <Button type="submit" variant="primary" busy={request.isPending} busyLabel="Sending…">
        Send the link
      </Button>
      <Link to="/sign-in" className="text-sm">
        Back to sign in
      </Link>
    </form>
  );
}
