import { exportQuery, type PngViewName } from '../../../shared/api/exports';
import type { PrintPart } from '../../../shared/print/print-range';
import type { LoomList, WorkingOrder } from '../../../shared/api/plans';
import type { DraftArrangement } from '../../../shared/weave/types';

/** The print's arrangement words: which side the threading, treadling, shaft 1 and end 1 are on. */
export interface PrintArrangement {
  threadingAbove: boolean;
  treadlingRight: boolean;
  shaftsFromBottom: boolean;
  endOneRight: boolean;
}

/** The draft's own arrangement in the print's words: where the Print section starts. */
export function printArrangement(a: DraftArrangement): PrintArrangement {
  return { threadingAbove: a.threading === 'above', treadlingRight: a.treadling === 'right', shaftsFromBottom: a.shaftOne === 'bottom', endOneRight: a.endOne === 'right' };
}

/** 1-based first and last, as the weaver names ends and picks. */
export interface NumberRange {
  from: number;
  to: number;
}

export interface PrintChoices extends PrintArrangement {
  paper: 'a4' | 'letter';
  orientation: 'portrait' | 'landscape';
  numberEvery: 4 | 8 | 10;
  lists: LoomList[];
  workingOrder: WorkingOrder;
  /** What the draft sheets show. */
  part: PrintPart;
  /** With `range`: the ends and picks to print. */
  ends: NumberRange;
  picks: NumberRange;
  /** Every printed end across one page width. */
  fitWidth: boolean;
}

/** Where the printed draft is: `base` is `/api/drafts/7` or `/api/shared/<token>`. */
export function printUrl(base: string, c: PrintChoices): string {
  return `${base}/print.pdf${exportQuery({
    paper: c.paper,
    orientation: c.orientation,
    threadingAbove: c.threadingAbove,
    treadlingRight: c.treadlingRight,
    shaftsFromBottom: c.shaftsFromBottom,
    endOneRight: c.endOneRight,
    numberEvery: c.numberEvery,
    lists: c.lists,
    from: c.workingOrder.side,
    direction: c.workingOrder.direction,
    shaftNumbering: c.workingOrder.shaftNumbering,
    part: c.part,
    ends: c.part === 'range' ? `${c.ends.from}-${c.ends.to}` : undefined,
    picks: c.part === 'range' ? `${c.picks.from}-${c.picks.to}` : undefined,
    fitWidth: c.fitWidth || undefined,
  })}`;
}

/** A picture of the cloth laid out as the print is. */
export function pngUrl(base: string, view: PngViewName, scale: number, a: Pick<PrintArrangement, 'threadingAbove' | 'endOneRight'>): string {
  return `${base}/drawdown.png${exportQuery({ view, scale, threadingAbove: a.threadingAbove, endOneRight: a.endOneRight })}`;
}
