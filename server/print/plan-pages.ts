import { formatNumber, LOOM_LIST_NAMES } from '../../shared/words';
import { arrangementOf, pickCount, type Draft } from '../../shared/weave';
import {
  planBlocker,
  type ClothSett,
  defaultLoomWaste,
  dentingLabel,
  DEFAULT_ORIENTATION,
  expandWarp,
  threadingSteps,
  weavingList,
  type Group,
  type Orientation,
  type PlanDocument,
  type PlanOutputs,
  type ShaftNumbering,
  type ThreadingStep,
  type WeavingList,
  type YarnAmount,
} from '../../shared/plan';
import { PAGE_MARGIN } from '../../shared/print/draft-pages';
import type { LoomListKind } from '../../shared/print/types';
import { BODY_SIZE, INK, MUTED, plural, ROW_HEIGHT, swatch, text, type Doc, type FontStyle } from './pdf-style';
import { textWidth } from './pdf-text';

/** Where a tick row's detail starts, after its box and label. */
const TICK_INDENT = 110;

/** Writes top to bottom between the margins, turning the page when the next block would not fit. */
class Flow {
  y = PAGE_MARGIN;
  constructor(
    private readonly doc: Doc,
    private readonly title: string,
  ) {
    doc.addPage();
    text(doc, title, PAGE_MARGIN, this.y, 14, INK, 'semibold');
    this.y += 24;
  }
  get bottom(): number {
    return this.doc.page.height - PAGE_MARGIN;
  }
  get width(): number {
    return this.doc.page.width - 2 * PAGE_MARGIN;
  }
  /** Makes room for `height` points, on a new page (with a continued heading) if need be. */
  room(height: number): void {
    if (this.y + height <= this.bottom) return;
    this.doc.addPage();
    this.y = PAGE_MARGIN;
    text(this.doc, `${this.title} (continued)`, PAGE_MARGIN, this.y, BODY_SIZE, MUTED, 'semibold');
    this.y += 18;
  }
  heading(s: string): void {
    this.room(36);
    this.y += 6;
    text(this.doc, s, PAGE_MARGIN, this.y, 11, INK, 'semibold');
    this.y += 17;
  }
  line(s: string, colour = INK, size = BODY_SIZE): void {
    this.room(size + 5);
    text(this.doc, s, PAGE_MARGIN, this.y, size, colour);
    this.y += size + 5;
  }
  /** Wrapped text from `indent`; a paragraph longer than the room left is broken across pages by pdfkit. */
  paragraph(s: string, indent = 0, font: FontStyle = 'regular'): void {
    const { doc } = this;
    const width = this.width - indent;
    for (const para of s.split(/\r?\n/)) {
      doc.font(font).fontSize(BODY_SIZE);
      const h = doc.heightOfString(para || ' ', { width });
      if (this.y + h > this.bottom) this.room(Math.min(h, BODY_SIZE * 3));
      doc.font(font).fontSize(BODY_SIZE).fillColor(INK).text(para || ' ', PAGE_MARGIN + indent, this.y, { width });
      this.y = doc.y + 2;
    }
  }
  /** Label and value in two columns. */
  pair(label: string, value: string): void {
    this.room(BODY_SIZE + 5);
    text(this.doc, label, PAGE_MARGIN, this.y, BODY_SIZE, MUTED);
    text(this.doc, value, PAGE_MARGIN + 150, this.y, BODY_SIZE);
    this.y += BODY_SIZE + 5;
  }
  /** One table row at the given column offsets; a swatch first when a colour is given. */
  row(cells: string[], offsets: number[], colour?: string, font: FontStyle = 'regular'): void {
    this.room(ROW_HEIGHT);
    if (colour) swatch(this.doc, colour, PAGE_MARGIN, this.y);
    cells.forEach((c, i) => text(this.doc, c, PAGE_MARGIN + offsets[i], this.y + 1, BODY_SIZE - 1, INK, font));
    this.y += ROW_HEIGHT;
  }
  /** A box to tick by hand, a bold label, and the step's detail beside it, wrapped when long. */
  tick(label: string, detail: string): void {
    const { doc } = this;
    const indent = TICK_INDENT;
    const width = this.width - indent;
    // Most steps fit on one line; measuring a wrapped height is much slower, so only long ones pay for it.
    const oneLine = textWidth(doc, detail, BODY_SIZE) <= width;
    const h = oneLine ? ROW_HEIGHT : Math.max(ROW_HEIGHT, doc.font('regular').fontSize(BODY_SIZE).heightOfString(detail, { width }) + 4);
    this.room(h);
    doc.rect(PAGE_MARGIN, this.y, 9, 9).lineWidth(0.6).strokeColor(INK).stroke();
    text(doc, label, PAGE_MARGIN + 16, this.y, BODY_SIZE, INK, 'semibold');
    if (oneLine) text(doc, detail, PAGE_MARGIN + indent, this.y, BODY_SIZE);
    else doc.font('regular').fontSize(BODY_SIZE).fillColor(INK).text(detail, PAGE_MARGIN + indent, this.y, { width });
    this.y += h;
  }
}

/** "24 ends and 20 picks per inch": the one way the print states a sett. */
export function settText(s: ClothSett): string {
  return `${fixed(s.warp)} ends and ${fixed(s.weft)} picks per ${s.unit}`;
}

function fixed(n: number, digits = 1): string {
  return formatNumber(n, digits);
}

function percent(rate: number): string {
  return `${fixed(rate * 100)} %`;
}

/** Yarn names by palette colour, as the legend shows them. */
export type YarnNames = (colour: number) => string;

/** Page 2: the project plan (or what the draft alone says when there is none) and the notes. */
export function drawPlanPage(doc: Doc, draft: Draft, yarnNames: YarnNames, plan?: { doc: PlanDocument; outputs: PlanOutputs }): void {
  const flow = new Flow(doc, 'Plan');
  const blocker = planBlocker(draft);
  if (blocker) {
    flow.line(blocker, MUTED);
  } else if (!plan) {
    flow.line('No plan has been saved for this draft yet; the figures below come from the draft alone.', MUTED);
    flow.pair('Sett', settText(draft.sett));
    flow.pair('Ends in the draft', String(draft.threading.length));
    flow.pair('Picks in the draft', String(pickCount(draft)));
  } else {
    const { doc: p, outputs } = plan;
    const w = outputs.warp;
    const u = w.unit === 'inch' ? 'in' : 'cm';
    const len = (v: number) => `${fixed(v)} ${u}`;
    flow.pair('Sett', settText({ warp: w.sett, weft: w.picksPerUnit, unit: w.unit }));
    const per = p.reed.per === '10cm' ? '10 cm' : p.reed.per;
    flow.pair('Reed and dents', `${p.reed.dents}-dent reed per ${per}, sleyed ${dentingLabel(outputs.denting.pattern)} (gives ${fixed(outputs.denting.sett)} ends per ${w.unit})`);
    if (outputs.centring) flow.pair('Centred in the reed', `start at dent ${outputs.centring.firstDent} of ${outputs.centring.reedDents}`);
    flow.pair('Width in the reed', len(w.widthInReed));
    flow.pair('Ends', `${w.ends.totalEnds} (${w.ends.repeats} repeats, ${w.ends.bodyEnds} in the body)`);
    flow.pair('Finished size', `${len(w.finished.width)} × ${len(w.finished.length)}, ${plural(p.pieces, 'piece')}${w.finished.width === p.finishedWidth && w.finished.length === p.finishedLength ? '' : ' (estimated with the allowances)'}`);
    flow.pair('Woven length per piece', len(w.wovenLengthPerPiece));
    flow.pair('Warp length', len(w.warpLength));
    flow.pair('Picks in all', outputs.picksReason);
    flow.pair('Weft length', len(w.weftLength));
    const a = p.allowances;
    flow.pair('Take-up / draw-in', `${percent(a.takeUp)} / ${percent(a.drawIn)}`);
    flow.pair('Shrinkage (length / width)', `${percent(a.lengthShrinkage)} / ${percent(a.widthShrinkage)}`);
    flow.pair('Loom waste', len(p.loomWaste ?? defaultLoomWaste(p.loom, p.unit)));
    if (w.bouts?.length) flow.pair('Bouts', `${w.bouts.length} (${w.bouts.join(', ')} ends)`);

    const offsets = [22, 170, 230, 330, 420];
    const table = (title: string, amounts: YarnAmount[], threads: string) => {
      flow.heading(title);
      flow.row(['Yarn', threads, 'Length', 'Weight', 'Skeins or cones'], offsets, undefined, 'semibold');
      for (const y of amounts) {
        const weight = y.grams === undefined || y.pounds === undefined ? '–' : `${fixed(y.grams, 0)} g (${fixed(y.pounds, 2)} lb)`;
        flow.row(
          [yarnNames(y.color), String(y.threads), `${fixed(y.metres)} m (${fixed(y.yards)} yd)`, weight, y.packages === undefined ? '–' : String(y.packages)],
          offsets,
          draft.palette[y.color] ?? '#000000',
        );
      }
    };
    table('Warp yarn per colour', w.warpByColor, 'Ends');
    table('Weft yarn per colour', w.weftByColor, 'Picks per repeat');
    if (p.notes.trim()) {
      flow.heading('Plan notes');
      flow.paragraph(p.notes);
    }
  }
  flow.line('Yarn and cloth figures are estimates: weave a sample and trust it over these numbers.', MUTED, BODY_SIZE - 1);
  flow.heading('Draft notes');
  if (draft.notes.trim()) flow.paragraph(draft.notes);
  else flow.line('No notes.', MUTED);
}

function range(from: number, to: number): string {
  return from === to ? String(from) : `${from}–${to}`;
}

/** How the shafts on the weaving list are numbered, as the weaver chose it. */
function numberingWords(n: ShaftNumbering): string {
  return n === 'near' ? 'Shaft 1 is the shaft nearest you at the front of the loom.' : 'Shaft 1 is the shaft farthest from you at the front of the loom (the back shaft).';
}

function orientationWords(o: Orientation): string {
  const numbering = o.shaftNumbering === 'near' ? 'shaft 1 nearest you' : 'shaft 1 farthest from you';
  return `Working from the ${o.side} of the loom, ${o.direction.replace(/-/g, ' ')}, ${numbering}; end 1 is on the ${o.endOneAt} seen from the front.`;
}

/**
 * Loom-side lists from the plan, or from the draft alone (threading and weaving) without one.
 * `breathe` is awaited between rows, so a long list can let other work run.
 */
export async function drawLoomLists(
  doc: Doc,
  draft: Draft,
  yarnNames: YarnNames,
  which: readonly LoomListKind[],
  orientation: Orientation,
  outputs?: PlanOutputs,
  breathe: () => Promise<void> = async () => {},
  /** The picks the weaving list shows (0-based, [start, end)); default every pick of the draft. */
  picks?: { start: number; end: number; repeat: boolean },
): Promise<void> {
  const { threading, weaving } = listsOf(draft, orientation, outputs);
  for (const kind of which) {
    if (kind === 'threading') await threadingList(doc, threading, orientation, breathe);
    else if (kind === 'sleying' && outputs) await sleyingList(doc, outputs, orientation, breathe);
    else if (kind === 'tie-on' && outputs) await tieOnList(doc, outputs, orientation, breathe);
    else if (kind === 'weaving') await weavingPages(doc, draft, picks ? picksWithin(weaving, picks) : weaving, yarnNames, breathe, outputs?.picksReason, picks);
  }
}

/** The threading groups and weaving rows the lists show: the plan's, or the draft's own without one. */
function listsOf(draft: Draft, orientation: Orientation, outputs?: PlanOutputs): { threading: Group<ThreadingStep>[]; weaving: WeavingList } {
  return {
    threading: outputs?.threading ?? draftThreading(draft, orientation),
    weaving: outputs?.weaving ?? weavingList(draft, { totalPicks: pickCount(draft), shaftNumbering: orientation.side === 'front' ? orientation.shaftNumbering : orientation.shaftNumbering === 'near' ? 'far' : 'near' }),
  };
}

/** The draft's own ends, once through, when no plan says how wide the warp is. */
function draftThreading(draft: Draft, o: Orientation): Group<ThreadingStep>[] {
  const n = draft.threading.length;
  if (n === 0) return [];
  const warp = expandWarp(draft, { repeats: 1, bodyEnds: n, totalEnds: n }, 0);
  return threadingSteps(draft, warp, o, Math.min(n, Math.max(draft.shafts, 4)));
}

const REST = 'Sit square to the loom, and rest your hands and eyes between groups.';

type Breathe = () => Promise<void>;

/** One line of a list for the loom: a box to tick, its label and what to do. */
interface TickRow {
  label: string;
  detail: string;
}

function threadingRows(groups: Group<ThreadingStep>[]): TickRow[] {
  const rows: TickRow[] = [];
  for (const g of groups) {
    const first = g.items[0];
    const last = g.items[g.items.length - 1];
    if (!first || !last) continue;
    const steps = g.items.map((s) => `${s.end}: ${s.shafts.length ? s.shafts.join('+') : 'no shaft'}${s.dent !== undefined ? ` (dent ${s.dent})` : ''}${s.selvedge ? ' (selvedge)' : ''}`).join('   ');
    rows.push({ label: `Group ${g.index} of ${g.of}`, detail: `Ends ${range(first.end, last.end)}  —  ${steps}` });
  }
  return rows;
}

function sleyingRows(outputs: PlanOutputs): TickRow[] {
  const rows: TickRow[] = [];
  for (const g of outputs.sleying) {
    const first = g.items[0];
    const last = g.items[g.items.length - 1];
    if (!first || !last) continue;
    const dents = g.items.map((d) => `${d.dent}: ${d.ends.length ? d.ends.map((e) => e.end).join(', ') : 'empty'}`).join('   ');
    rows.push({ label: `Group ${g.index} of ${g.of}`, detail: `Dents ${range(first.dent, last.dent)}  —  ${dents}` });
  }
  return rows;
}

function tieOnRows(outputs: PlanOutputs): TickRow[] {
  const rows: TickRow[] = [];
  for (const g of outputs.tieOn) {
    const first = g.items[0];
    const last = g.items[g.items.length - 1];
    if (first === undefined || last === undefined) continue;
    rows.push({ label: `Bundle ${g.index} of ${g.of}`, detail: `Ends ${range(first, last)} (${g.items.length} ends)` });
  }
  return rows;
}

function weavingRows(draft: Draft, list: WeavingList, yarnNames: YarnNames): TickRow[] {
  const layered = draft.weftLayers.some((l) => l > 1);
  return list.rows.map((r) => {
    const label = r.fromPick === r.toPick ? `Pick ${r.fromPick}` : `Picks ${r.fromPick}–${r.toPick}`;
    const how = r.treadles ? `treadle ${r.treadles.join('+')} (raises ${r.raised.join(' ') || 'nothing'})` : `raise ${r.raised.join(' ') || 'nothing'}`;
    const layer = layered ? ` · layer ${r.layer}` : '';
    return { label, detail: `${how} · ${yarnNames(r.color)}${layer}${r.times > 1 ? ` · ${r.times} times` : ''}` };
  });
}

async function tickAll(flow: Flow, rows: TickRow[], breathe: Breathe): Promise<void> {
  for (const r of rows) {
    await breathe();
    flow.tick(r.label, r.detail);
  }
}

async function threadingList(doc: Doc, groups: Group<ThreadingStep>[], o: Orientation, breathe: Breathe): Promise<void> {
  const flow = new Flow(doc, LOOM_LIST_NAMES.threading);
  flow.line(orientationWords(o), MUTED);
  flow.line(`Each group lists its ends in the order you reach them, with the shaft for each${groups.some((g) => g.items.some((s) => s.dent !== undefined)) ? ' and the dent it is sleyed in' : ''}. ${REST}`, MUTED, BODY_SIZE - 1);
  await tickAll(flow, threadingRows(groups), breathe);
}

async function sleyingList(doc: Doc, outputs: PlanOutputs, o: Orientation, breathe: Breathe): Promise<void> {
  const flow = new Flow(doc, LOOM_LIST_NAMES.sleying);
  flow.line(`${orientationWords(o)} Denting ${dentingLabel(outputs.denting.pattern)}.`, MUTED);
  flow.line(`Each group lists its dents with the ends that go through them. ${REST}`, MUTED, BODY_SIZE - 1);
  await tickAll(flow, sleyingRows(outputs), breathe);
}

async function tieOnList(doc: Doc, outputs: PlanOutputs, o: Orientation, breathe: Breathe): Promise<void> {
  const flow = new Flow(doc, LOOM_LIST_NAMES.tieOn);
  flow.line(orientationWords(o), MUTED);
  await tickAll(flow, tieOnRows(outputs), breathe);
}

/** The rows of a weaving list inside picks [start, end), a row cut where the window cuts it. */
function picksWithin(list: WeavingList, picks: { start: number; end: number }): WeavingList {
  const rows = list.rows
    .filter((r) => r.toPick > picks.start && r.fromPick <= picks.end)
    .map((r) => {
      const fromPick = Math.max(r.fromPick, picks.start + 1);
      const toPick = Math.min(r.toPick, picks.end);
      return { ...r, fromPick, toPick, times: toPick - fromPick + 1 };
    });
  return { ...list, rows };
}

async function weavingPages(doc: Doc, draft: Draft, list: WeavingList, yarnNames: YarnNames, breathe: Breathe, picksReason?: string, window?: { start: number; end: number; repeat: boolean }): Promise<void> {
  const flow = new Flow(doc, `${LOOM_LIST_NAMES.weaving}: ${draft.control === 'liftplan' ? 'lift plan' : 'treadling'}`);
  const times = picksReason
    ? `${picksReason} `
    : list.repeats > 0 ? `Weave the sequence ${plural(list.repeats, 'time')}${list.extraPicks ? `, then picks 1–${list.extraPicks} once more` : ''}. ` : '';
  flow.line(`${times}${list.picksPerUnit} picks per ${list.unit}. ${numberingWords(list.shaftNumbering)}`, MUTED);
  const all = list.picksInSequence;
  if (window && (window.start > 0 || window.end < all)) {
    const n = window.end - window.start;
    const shown = `picks ${range(window.start + 1, window.end)}`;
    if (window.repeat && window.start === 0) {
      const whole = Math.floor(all / n);
      const rest = all % n;
      flow.line(`This list shows one repeat, ${shown}: the draft's ${plural(all, 'pick')} are this repeat ${plural(whole, 'time')}${rest ? `, then picks 1–${rest} once more` : ''}.`, INK);
    } else flow.line(`This list shows ${shown} of the draft's ${all}, as chosen for this print.`, INK);
  }
  flow.line(`Tick each line as you weave it. ${REST}`, MUTED, BODY_SIZE - 1);
  await tickAll(flow, weavingRows(draft, list, yarnNames), breathe);
}

/**
 * About how many pages the lists for the loom of drawLoomLists take, from their rows measured in the
 * print's font: a row too long for one line is counted by its width, not wrapped word by word.
 */
export async function estimateLoomListPages(
  measure: Doc,
  draft: Draft,
  yarnNames: YarnNames,
  which: readonly LoomListKind[],
  orientation: Orientation,
  outputs: PlanOutputs | undefined,
  page: { width: number; height: number },
  picks?: { start: number; end: number },
  breathe: Breathe = async () => {},
): Promise<number> {
  const { threading, weaving } = listsOf(draft, orientation, outputs);
  const width = page.width - 2 * PAGE_MARGIN - TICK_INDENT;
  const bottom = page.height - PAGE_MARGIN;
  const lineHeight = measure.font('regular').fontSize(BODY_SIZE).currentLineHeight(true);
  let pages = 0;
  for (const kind of which) {
    const rows = kind === 'threading' ? threadingRows(threading)
      : kind === 'sleying' && outputs ? sleyingRows(outputs)
        : kind === 'tie-on' && outputs ? tieOnRows(outputs)
          : kind === 'weaving' ? weavingRows(draft, picks ? picksWithin(weaving, picks) : weaving, yarnNames) : null;
    if (!rows) continue;
    // A list opens a page with its heading and two or three lines about it.
    pages++;
    let y = PAGE_MARGIN + 24 + 3 * (BODY_SIZE + 5);
    for (const r of rows) {
      await breathe();
      const w = textWidth(measure, r.detail, BODY_SIZE);
      const h = w <= width ? ROW_HEIGHT : Math.max(ROW_HEIGHT, Math.ceil(w / width) * lineHeight + 4);
      if (y + h > bottom) {
        pages++;
        y = PAGE_MARGIN + 18;
      }
      y += h;
    }
  }
  return pages;
}

/** The plan's list settings with the print's working order laid over them. */
export function listOrientation(draft: Draft, plan: PlanDocument | undefined, override: Partial<Orientation> | undefined): Orientation {
  const base: Orientation = plan
    ? { side: plan.lists.side, direction: plan.lists.direction, shaftNumbering: plan.lists.shaftNumbering, endOneAt: plan.lists.endOneAt }
    : DEFAULT_ORIENTATION;
  // End 1 is where the draft's arrangement puts it, whatever the plan or the print asks.
  return { ...base, ...override, endOneAt: arrangementOf(draft).endOne };
}
