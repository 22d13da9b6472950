import { useState } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import { fieldMessage, useSchemaForm } from '../../../lib/schema-form';
import { PASSWORD_MIN_LENGTH, signUpBodySchema } from '../../../../shared/api/auth';
import { useSignUp } from '../api/sign-up';

/**
 * Name, e-mail and password for a new account. The account is made from the link mailed to the
 * address, so the answer says the same whether or not the address has an account already.
 */
export function SignUpForm({ next }: { next?: string }) {
  const signUp = useSignUp();
  const form = useSchemaForm(signUpBodySchema, { name: '', email: '', password: '' });
  const [sentTo, setSentTo] = useState('');
  const apiFields = fieldErrorsOf(signUp.error);
  const message = (name: string) => fieldMessage(form.formState.errors, apiFields, name);
  const showNotice = signUp.isError && Object.keys(apiFields).length === 0;

  if (signUp.isSuccess) {
    return (
      <div role="status" className="flex flex-col gap-3 text-sm">
        <p>
          We sent a link to <strong>{sentTo}</strong>. Open it within a day to finish making your account; the link signs you
          in.
        </p>
        <p className="text-muted">
          If the address already has an account, the mail says so instead, and you can sign in or choose a new password.
        </p>
        {import.meta.env.DEV && (
          <p>
            Working locally? <Link to="/admin/mails">Open the captured mails</Link>.
          </p>
        )}
        <Link to={next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'}>Back to sign in</Link>
      </div>
    );
  }

  const submit = form.handleSubmit((body) => {
    signUp.reset();
    setSentTo(body.email);
    signUp.mutate(next ? { ...body, next } : body);
  });

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {showNotice && <ErrorNotice title="Could not create the account" error={signUp.error} />}
      <Field label="Name" autoComplete="name" required error={message('name')} hint="Shown to people in your studios." {...form.register('name')} />
      <Field label="E-mail" type="email" autoComplete="email" required error={message('email')} {...form.register('email')} />
      <Field
        label="Password"
        type="password"
        autoComplete="new-password"
        required
        minLength={PASSWORD_MIN_LENGTH}
        error={message('password')}
        hint={`At least ${PASSWORD_MIN_LENGTH} characters.`}
        {...form.register('password')}
      />
      <Button type="submit" variant="primary" busy={signUp.isPending} busyLabel="Creating account…">
        Create account
      </Button>
      <p className="text-sm">
        Already have an account? <Link to={next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in'}>Sign in</Link>
      </p>
    </form>
  );
}
