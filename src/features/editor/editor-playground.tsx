import { useMemo, useRef, useState } from 'react';
import { asLists, createDraft, pointDraw, repeat, straightDraw, twillTieup, type Draft } from '../../../shared/weave';
import type { SaveResult } from './store/autosave';
import { DraftEditor } from './components/draft-editor';

/** Our own demo: a point twill scarf in two stripes of colour (invented for the playground). */
function demoDraft(ends: number, picks: number, shafts: number): Draft {
  const s = Math.max(2, Math.min(32, shafts));
  const threading = asLists(repeat(pointDraw(s), Math.ceil(ends / Math.max(1, 2 * s - 2))).slice(0, ends));
  // A balanced twill tie-up: half the shafts up, half down, stepped one shaft per treadle.
  const half = Math.max(1, Math.floor(s / 2));
  const tieup = twillTieup(s % 2 === 0 ? [half, half] : [half + 1, half]);
  const treadling = asLists(repeat(straightDraw(s), Math.ceil(picks / s)).slice(0, picks));
  const stripe = (i: number) => (Math.floor(i / 24) % 3 === 2 ? 2 : 0);
  return createDraft({
    name: 'Point twill scarf',
    shafts: s,
    treadles: tieup.length,
    threading,
    tieup,
    treadling,
    palette: ['#27345c', '#efe6d2', '#b5542e', '#7a8b4f'],
    warpColors: threading.map((_, i) => stripe(i)),
    weftColors: treadling.map((_, i) => (stripe(i) === 2 ? 3 : 1)),
    yarns: [
      { id: 'y1', name: 'Indigo wool 2-ply', color: 0 },
      { id: 'y2', name: 'Oat linen', color: 1 },
    ],
  });
}

function readParams(): { ends: number; picks: number; shafts: number } {
  const q = new URLSearchParams(typeof location === 'undefined' ? '' : location.search);
  const [w, h] = (q.get('size') ?? '96x80').split('x').map((n) => Number.parseInt(n, 10));
  const shafts = Number.parseInt(q.get('shafts') ?? '8', 10);
  const clamp = (n: number, d: number) => (Number.isFinite(n) && n > 0 ? Math.min(5000, n) : d);
  return { ends: clamp(w, 96), picks: clamp(h, 80), shafts: clamp(shafts, 8) };
}

/**
 * A page for trying the editor without the server: a demo draft (`?size=1000x1000&shafts=24` for a
 * big one) and a pretend server that can go offline or take someone else's save.
 */
export default function EditorPlayground() {
  const params = useMemo(() => readParams(), []);
  const draft = useMemo(() => demoDraft(params.ends, params.picks, params.shafts), [params]);
  const server = useRef({ version: 1, document: draft });
  const [offline, setOffline] = useState(false);
  // The editor keeps the first onSave it is given, so it reads "offline" through a ref.
  const offlineRef = useRef(offline);
  const [log, setLog] = useState<string[]>([]);
  const note = (line: string) => setLog((l) => [line, ...l].slice(0, 6));

  const onSave = async (doc: Draft, baseVersion: number): Promise<SaveResult> => {
    await new Promise((r) => setTimeout(r, 200));
    if (offlineRef.current) throw new Error('The pretend server is offline');
    const s = server.current;
    if (baseVersion !== s.version) {
      note(`Refused a save based on version ${baseVersion}: the server has ${s.version}.`);
      return { conflict: { version: s.version, document: s.document } };
    }
    server.current = { version: s.version + 1, document: doc };
    note(`Saved version ${s.version + 1}.`);
    return { version: s.version + 1 };
  };

  const someoneElseSaves = () => {
    const s = server.current;
    server.current = { version: s.version + 1, document: { ...s.document, name: `${s.document.name} (their copy)`, threading: s.document.threading.map(() => [1]) } };
    note(`Someone else saved version ${s.version + 1}.`);
  };

  return (
    <div className="flex h-screen flex-col">
      <div className="flex flex-wrap items-center gap-3 border-b border-line bg-sunken px-3 py-1 text-xs">
        <strong>Editor playground</strong>
        <span>
          {params.ends} ends × {params.picks} picks on {params.shafts} shafts
        </span>
        <label className="flex items-center gap-1">
          <input
            type="checkbox"
            checked={offline}
            onChange={(e) => {
              offlineRef.current = e.target.checked;
              setOffline(e.target.checked);
            }}
          />
          Pretend server offline
        </label>
        <button type="button" className="rounded border border-field bg-surface px-2" onClick={someoneElseSaves}>
          Someone else saves
        </button>
        <span className="text-muted">{log[0]}</span>
      </div>
      <div className="min-h-0 flex-1">
        <DraftEditor draft={draft} version={1} draftId={`playground-${params.ends}x${params.picks}x${params.shafts}`} onSave={onSave} />
      </div>
    </div>
  );
}
