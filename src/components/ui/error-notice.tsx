import { ApiError } from '../../lib/api-client';
import { Button } from './button';

/** Words for any thrown thing: the server's own message when it sent one. */
export function errorMessage(error: unknown): string {
  if (error instanceof ApiError) return error.message;
  return 'Something went wrong. Please try again.';
}

export interface ErrorNoticeProps {
  title?: string;
  error?: unknown;
  /** Overrides the message taken from `error`. */
  message?: string;
  onRetry?: () => void;
}

/** A problem the person should read now: announced, marked with a sign, not only red. */
export function ErrorNotice({ title = 'Something went wrong', error, message, onRetry }: ErrorNoticeProps) {
  return (
    <div role="alert" className="flex items-start gap-3 rounded-md border border-danger bg-danger-soft p-3 text-sm text-ink">
      <span aria-hidden="true" className="font-semibold text-danger">
        ⚠
      </span>
      <div className="flex flex-1 flex-col gap-2">
        <p>
          <strong className="font-semibold text-danger">{title}.</strong> {message ?? errorMessage(error)}
        </p>
        {onRetry && (
          <div>
            <Button onClick={onRetry}>Try again</Button>
          </div>
        )}
      </div>
    </div>
  );
}
