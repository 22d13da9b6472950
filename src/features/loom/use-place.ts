import { useCallback, useEffect, useRef, useState } from 'react';
import type { LoomList, Progress, WorkingOrder } from '../../../shared/api/plans';
import { ApiError } from '../../lib/api-client';
import { saveProgress } from './api/save-progress';
import { readLoomCache, writeLoomCache } from './offline-store';

export const DEFAULT_WORKING_ORDER: WorkingOrder = { side: 'front', direction: 'right-to-left', shaftNumbering: 'near' };

export type SaveState = 'saved' | 'saving' | 'offline' | 'failed';

/** The newer of two places by when the marker was moved. */
export function newerPlace(a: Progress | undefined | null, b: Progress | undefined | null): Progress | null {
  if (!a) return b ?? null;
  if (!b) return a;
  return Date.parse(b.movedAt) > Date.parse(a.movedAt) ? b : a;
}

/**
 * The weaver's place marker: kept on the device at once, sent to the server, and, when the
 * network is down, sent again when it comes back. `server` is the place the server had on load.
 */
export function usePlace(draftId: number, server: Progress | null | undefined) {
  const [place, setPlace] = useState<Progress>(() => {
    const cached = readLoomCache(draftId).place;
    return cached ?? { list: 'threading', positions: {}, settings: DEFAULT_WORKING_ORDER, movedAt: new Date(0).toISOString() };
  });
  const [saveState, setSaveState] = useState<SaveState>(() => (readLoomCache(draftId).pending ? 'offline' : 'saved'));
  const latest = useRef(place);

  const send = useCallback(async (p: Progress) => {
    setSaveState('saving');
    try {
      const res = await saveProgress(draftId, { list: p.list, position: p.positions[p.list] ?? 0, settings: p.settings, movedAt: p.movedAt });
      if (latest.current !== p) return;
      writeLoomCache(draftId, { pending: false });
      setSaveState('saved');
      // Another device moved the marker later than this one: follow it.
      if (res.progress && Date.parse(res.progress.movedAt) > Date.parse(p.movedAt)) {
        latest.current = res.progress;
        setPlace(res.progress);
        writeLoomCache(draftId, { place: res.progress });
      }
    } catch (error) {
      if (latest.current !== p) return;
      setSaveState(error instanceof ApiError && error.status === 0 ? 'offline' : 'failed');
    }
  }, [draftId]);

  // Once the server's place is known, keep whichever is newer; send ours if the server lacks it.
  const merged = useRef(false);
  useEffect(() => {
    if (server === undefined || merged.current) return;
    merged.current = true;
    const cache = readLoomCache(draftId);
    const chosen = newerPlace(cache.place, server);
    if (!chosen) return;
    latest.current = chosen;
    // eslint-disable-next-line react-hooks/set-state-in-effect -- the server's place arrives after the first render and is merged once with this device's copy
    setPlace(chosen);
    writeLoomCache(draftId, { place: chosen });
    if (chosen !== server && cache.pending) void send(chosen);
  }, [server, draftId, send]);

  useEffect(() => {
    const retry = () => {
      if (readLoomCache(draftId).pending) void send(latest.current);
    };
    window.addEventListener('online', retry);
    return () => window.removeEventListener('online', retry);
  }, [draftId, send]);

  const move = useCallback((list: LoomList, position: number, settings: WorkingOrder) => {
    const next: Progress = {
      list,
      positions: { ...latest.current.positions, [list]: position },
      settings,
      movedAt: new Date(Math.max(Date.now(), Date.parse(latest.current.movedAt) + 1)).toISOString(),
    };
    latest.current = next;
    setPlace(next);
    writeLoomCache(draftId, { place: next, pending: true });
    void send(next);
  }, [draftId, send]);

  return { place, move, saveState };
}
