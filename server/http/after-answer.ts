import type { Response } from 'express';

/**
 * Runs `task` once the answer has gone (or the caller has left), so how long the task takes, and
 * whether it finds anything, tells the caller nothing. A failure is logged as "Could not <what>"
 * with its message only: never the address or values the task carried.
 */
export function afterAnswer(res: Response, what: string, task: () => Promise<void>): void {
  let started = false;
  const run = () => {
    if (started) return;
    started = true;
    task().catch((err: unknown) => console.error(`Could not ${what}:`, err instanceof Error ? err.message : String(err)));
  };
  res.once('finish', run);
  res.once('close', run);
}
