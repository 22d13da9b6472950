import { useEffect, useState, type ReactNode } from 'react';
import { readLayoutSetting, writeLayoutSetting } from '../store/layout-settings';

/** The column of colours, layers, block design and checks beside the grids; folds to a narrow strip. */
export function SideColumn({ children, startOpen = false, scrollTo }: { children: ReactNode; startOpen?: boolean; scrollTo?: string }) {
  const [folded, setFolded] = useState(() => !startOpen && readLayoutSetting('side-folded') === '1');
  const shown = !folded;
  // Opened for one panel (the block design of a draft started as one): bring that panel into view.
  useEffect(() => {
    if (scrollTo) document.getElementById(scrollTo)?.scrollIntoView?.({ block: 'start' });
  }, [scrollTo]);
  const toggle = () => {
    setFolded(shown);
    writeLayoutSetting('side-folded', shown ? '1' : '0');
  };
  return (
    <aside aria-label="Side column" className={`flex min-h-0 shrink-0 flex-col gap-2 ${shown ? 'w-80' : 'w-9'}`}>
      <button
        type="button"
        onClick={toggle}
        aria-expanded={shown}
        aria-controls="side-column-panels"
        title={shown ? 'Fold the side column away' : 'Show colours, block design and checks'}
        className="self-start rounded border border-field bg-surface px-2 py-0.5 text-xs hover:bg-sunken"
      >
        {shown ? <>Fold away <span aria-hidden="true">»</span></> : <><span aria-hidden="true">«</span><span className="sr-only">Show the side column</span></>}
      </button>
      <div id="side-column-panels" hidden={!shown} className="flex min-h-0 flex-col gap-4 overflow-y-auto pr-1">
        {children}
      </div>
    </aside>
  );
}
