/**
 * When to suggest a break at the loom. Common practice in loom and bench ergonomics: stand up and
 * stretch at least every half hour of close work, and rest the eyes. Threading time is counted
 * from the weaver's own steps, so a pause of a few minutes already counts as a break.
 */
export const BREAK_AFTER_MS = 30 * 60_000;
/** Groups in a row before a reminder, for weavers who work fast (common practice, our own figure). */
export const BREAK_AFTER_STEPS = 40;
/** A gap this long between two steps is a rest, and starts the count again. */
export const REST_GAP_MS = 5 * 60_000;

export interface Activity {
  activeMs: number;
  steps: number;
  lastAt: number | null;
}

export const restedActivity: Activity = { activeMs: 0, steps: 0, lastAt: null };

/** The activity after one more step at time `now`. */
export function afterStep(a: Activity, now: number): Activity {
  if (a.lastAt === null || now - a.lastAt >= REST_GAP_MS || now < a.lastAt) return { activeMs: 0, steps: 1, lastAt: now };
  return { activeMs: a.activeMs + (now - a.lastAt), steps: a.steps + 1, lastAt: now };
}

/** True when it is time to suggest a break. */
export function breakDue(a: Activity): boolean {
  return a.activeMs >= BREAK_AFTER_MS || a.steps >= BREAK_AFTER_STEPS;
}
