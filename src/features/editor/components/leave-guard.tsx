import { useEffect } from 'react';
import { useBlocker } from 'react-router-dom';
import type { Autosave } from '../store/autosave';

export const LEAVE_QUESTION =
  'Your latest edits have not reached the server (no connection, a conflict, or a draft with no ends or picks). They stay on this device and are sent when you open the draft again. Leave anyway?';

/** Asks before the app goes to another page while the open draft's edits cannot be sent. */
export function LeaveGuard({ autosave }: { autosave: Autosave }) {
  const blocker = useBlocker(({ currentLocation, nextLocation }) => currentLocation.pathname !== nextLocation.pathname && autosave.cannotSendOnLeave());
  useEffect(() => {
    if (blocker.state !== 'blocked') return;
    if (window.confirm(LEAVE_QUESTION)) blocker.proceed();
    else blocker.reset();
  }, [blocker]);
  return null;
}
