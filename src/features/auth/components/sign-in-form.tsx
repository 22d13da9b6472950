import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { fieldErrorsOf, isApiError } from '../../../lib/api-client';
import { fieldMessage, useSchemaForm } from '../../../lib/schema-form';
import { signInBodySchema } from '../../../../shared/api/auth';
import { useSignIn } from '../api/sign-in';

export interface SignInFormProps {
  /** Carried to the sign-up link so a new account also lands where the person was going. */
  next?: string;
}

/**
 * E-mail and password; wrong credentials are said plainly without saying which one was wrong.
 * Success puts the user in the session cache, and the page around the form moves on from there.
 */
export function SignInForm({ next }: SignInFormProps) {
  const signIn = useSignIn();
  const form = useSchemaForm(signInBodySchema, { email: '', password: '' });
  const apiFields = fieldErrorsOf(signIn.error);
  const message = (name: string) => fieldMessage(form.formState.errors, apiFields, name);
  const submit = form.handleSubmit((body) => signIn.mutate(body));

  const problem = isApiError(signIn.error, 401)
    ? 'That e-mail and password do not match an account.'
    : isApiError(signIn.error, 429)
      ? 'Too many attempts. Wait a few minutes, then try again.'
      : undefined;

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {signIn.isError && Object.keys(apiFields).length === 0 && (
        <ErrorNotice title="Could not sign in" error={signIn.error} message={problem} />
      )}
      <Field label="E-mail" type="email" autoComplete="email" required error={message('email')} {...form.register('email')} />
      <Field label="Password" type="password" autoComplete="current-password" required error={message('password')} {...form.register('password')} />
      <Button type="submit" variant="primary" busy={signIn.isPending} busyLabel="Signing in…">
        Sign in
      </Button>
      <div className="flex flex-col gap-1 text-sm">
        <Link to="/forgot">Forgot your password?</Link>
        <Link to={next ? `/sign-up?next=${encodeURIComponent(next)}` : '/sign-up'}>New here? Create an account</Link>
      </div>
    </form>
  );
}
