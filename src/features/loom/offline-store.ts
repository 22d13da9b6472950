/**
 * What the loom-side guide keeps on the device, so it goes on working when the connection drops:
 * the draft, its plan, and the place marker with a flag saying the server has not had it yet.
 * One key per draft; a newer save replaces the older, so the "queue" holds only the latest place.
 */
import type { Progress } from '../../../shared/api/plans';
import type { PlanDocument } from '../../../shared/plan/plan-schema';
import type { DraftDetail } from '../../types/api';

export interface LoomCache {
  draft?: Pick<DraftDetail, 'id' | 'name' | 'document' | 'role'>;
  plan?: PlanDocument | null;
  place?: Progress;
  /** True while `place` has not reached the server. */
  pending?: boolean;
  /** Ends per tie-on bundle chosen at the loom. */
  tieOnEnds?: number;
}

const key = (draftId: number) => `shedwright:loom:${draftId}`;

function storage(): Storage | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage;
  } catch {
    // Some browsers refuse storage access in private windows.
    return null;
  }
}

/** The cached state for a draft, or an empty one. */
export function readLoomCache(draftId: number): LoomCache {
  const raw = storage()?.getItem(key(draftId));
  if (!raw) return {};
  try {
    const value: unknown = JSON.parse(raw);
    return typeof value === 'object' && value !== null ? (value as LoomCache) : {};
  } catch {
    return {};
  }
}

/** Merges `patch` into the cached state; a full storage only loses the offline copy. */
export function writeLoomCache(draftId: number, patch: LoomCache): void {
  const s = storage();
  if (!s) return;
  try {
    s.setItem(key(draftId), JSON.stringify({ ...readLoomCache(draftId), ...patch }));
  } catch {
    // Quota exceeded: the guide still works while the page stays open.
  }
}
