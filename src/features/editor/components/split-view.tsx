import { useRef, useState, type KeyboardEvent, type PointerEvent, type ReactNode } from 'react';
import { readLayoutSetting, writeLayoutSetting } from '../store/layout-settings';

const MIN = 0.25;
const MAX = 0.85;
const STEP = 0.05;
const clamp = (f: number) => Math.min(MAX, Math.max(MIN, f));

/**
 * Two panes side by side with a divider the weaver drags (or moves with the arrow keys once it has
 * focus). The share of the first pane is kept on this device, so the workspace opens as it was left.
 */
export function SplitView({ first, second, label }: { first: ReactNode; second: ReactNode; label: string }) {
  const box = useRef<HTMLDivElement>(null);
  const [share, setShare] = useState(() => clamp(Number(readLayoutSetting('split') ?? 0.62) || 0.62));
  const set = (f: number) => {
    const next = clamp(f);
    setShare(next);
    writeLayoutSetting('split', String(next));
  };
  const fromPointer = (e: PointerEvent<HTMLDivElement>) => {
    const rect = box.current?.getBoundingClientRect();
    if (rect && rect.width > 0) set((e.clientX - rect.left) / rect.width);
  };
  const onKeyDown = (e: KeyboardEvent<HTMLDivElement>) => {
    const moves: Record<string, number> = { ArrowLeft: share - STEP, ArrowRight: share + STEP, Home: MIN, End: MAX };
    if (e.key in moves) {
      set(moves[e.key]);
      e.preventDefault();
      e.stopPropagation();
    }
  };
  return (
    <div ref={box} className="flex min-h-0 min-w-0 flex-1">
      <div className="flex min-h-0 min-w-0 flex-col" style={{ width: `${share * 100}%` }}>
        {first}
      </div>
      <div
        role="separator"
        aria-orientation="vertical"
        aria-label={label}
        aria-valuemin={MIN * 100}
        aria-valuemax={MAX * 100}
        aria-valuenow={Math.round(share * 100)}
        tabIndex={0}
        onKeyDown={onKeyDown}
        onPointerDown={(e) => e.currentTarget.setPointerCapture(e.pointerId)}
        onPointerMove={(e) => {
          if (e.currentTarget.hasPointerCapture(e.pointerId)) fromPointer(e);
        }}
        data-testid="split-divider"
        className="group flex w-3 shrink-0 cursor-col-resize touch-none items-center justify-center outline-none focus-visible:ring-2 focus-visible:ring-accent"
      >
        <span aria-hidden="true" className="h-12 w-1 rounded-full bg-line group-hover:bg-accent" />
      </div>
      <div className="flex min-h-0 min-w-0 flex-1 flex-col overflow-auto">{second}</div>
    </div>
  );
}
