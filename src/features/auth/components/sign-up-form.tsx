import { useState, type FormEvent } from 'react';
import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { Field } from '../../../components/ui/field';
import { fieldErrorsOf } from '../../../lib/api-client';
import { MIN_PASSWORD_LENGTH, useSignUp } from '../api/sign-up';

/**
 * Name, e-mail and password for a new account. The account is made from the link mailed to the
 * address, so the answer says the same whether or not the address has an account already.
 */
export function SignUpForm({ next }: { next?: string }) {
  const signUp = useSignUp();
  const [local, setLocal] = useState<Record<string, string>>({});
  const [sentTo, setSentTo] = useState('');
  const apiFields = fieldErrorsOf(signUp.error);
  const fields: Record<string, string> = { ...apiFields, ...local };
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

  const submit = (event: FormEvent<HTMLFormElement>) => {
    event.preventDefault();
    const data = new FormData(event.currentTarget);
    const input = {
      name: String(data.get('name') ?? '').trim(),
      email: String(data.get('email') ?? '').trim(),
      password: String(data.get('password') ?? ''),
    };
    const errors: Record<string, string> = {};
    if (!input.name) errors.name = 'Enter your name.';
    if (!input.email) errors.email = 'Enter your e-mail address.';
    if (input.password.length < MIN_PASSWORD_LENGTH) errors.password = `Use at least ${MIN_PASSWORD_LENGTH} characters.`;
    setLocal(errors);
    if (Object.keys(errors).length > 0) return;
    signUp.reset();
    setSentTo(input.email);
    signUp.mutate(next ? { ...input, next } : input);
  };

  return (
    <form onSubmit={submit} noValidate className="flex flex-col gap-4">
      {showNotice && <ErrorNotice title="Could not create the account" error={signUp.error} />}
      <Field label="Name" name="name" autoComplete="name" required error={fields.name} hint="Shown to people in your studios." />
      <Field label="E-mail" name="email" type="email" autoComplete="email" required error={fields.email} />
      <Field
        label="Password"
        name="password"
        type="password"
        autoComplete="new-password"
        required
        minLength={MIN_PASSWORD_LENGTH}
        error={fields.password}
        hint={`At least ${MIN_PASSWORD_LENGTH} characters.`}
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
