import type { Response } from 'express';

/**
 * Runs `task` once the answer has gone (or the caller has left), so how long the task takes, and
 * whether it finds anything, tells the caller nothing. A failure goes on the request's log as
 * "could not <what>" with its message only: never the address or values the task carried.
 */
export function afterAnswer(res: Response, what: string, task: () => Promise<void>): void {
  let started = false;
  const run = () => {
    if (started) return;
    started = true;
    task().catch((err: unknown) => res.req.log.error({ problem: err instanceof Error ? err.message : String(err) }, `could not ${what}`));
  };
  res.once('finish', run);
  res.once('close', run);
}
