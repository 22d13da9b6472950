import { Link } from 'react-router-dom';
import { Button } from '../../../components/ui/button';
import { ErrorNotice } from '../../../components/ui/error-notice';
import { isApiError } from '../../../lib/api-client';
import { useConfirmSignUp } from '../api/sign-up';

export interface WelcomeFormProps {
  token: string | null;
  onDone: () => void;
}

/**
 * Makes the account from the sign-up mail's link. A button rather than on opening the page, so a
 * mail program that opens links to check them does not use the link up.
 */
export function WelcomeForm({ token, onDone }: WelcomeFormProps) {
  const confirm = useConfirmSignUp();
  if (!token) {
    return (
      <div className="flex flex-col gap-3 text-sm">
        <p>This page needs the link from your sign-up e-mail. Open the link from the mail, or sign up again.</p>
        <Link to="/sign-up">Sign up</Link>
      </div>
    );
  }
  return (
    <div className="flex flex-col gap-4 text-sm">
      {confirm.isError && (
        <div className="flex flex-col gap-2">
          <ErrorNotice title="Could not make the account" error={confirm.error} />
          <p>
            <Link to="/sign-in">Sign in</Link> · <Link to="/sign-up">Sign up again</Link>
          </p>
        </div>
      )}
      {/* A used or old link stays so: another try would only say the same. */}
      {!isApiError(confirm.error, 400) && (
        <>
          <p>Your e-mail address is confirmed by this link. Make the account and sign in:</p>
          <Button type="button" variant="primary" busy={confirm.isPending} busyLabel="Making the account…" onClick={() => confirm.mutate({ token }, { onSuccess: onDone })}>
            Make my account
          </Button>
        </>
      )}
    </div>
  );
}
