import type { Orientation } from '../plan/loom-lists';
import type { DraftArrangement as DraftLayout } from '../weave/types';
import type { PrintRangeChoice } from './print-range';

/** Paper sizes a printed draft comes on. */
export type Paper = 'a4' | 'letter';
export type PageOrientation = 'portrait' | 'landscape';

/** How the editor arranges a draft; the print follows the same settings. */
export interface DraftArrangement {
  /** Threading above the drawdown (else below). Pick 1 is the pick next to the threading. */
  threadingAbove: boolean;
  /** Treadling or lift plan to the right of the drawdown (else left). */
  treadlingRight: boolean;
  /** Shaft 1 is the bottom row of the threading (else the top row). */
  shaftsFromBottom: boolean;
  /** End 1 on the right of the drawdown (else the left), as the draft's arrangement says. */
  endOneRight: boolean;
}

/** The print's words for a draft's arrangement. */
export function printArrangementOf(a: DraftLayout): DraftArrangement {
  return { threadingAbove: a.threading === 'above', treadlingRight: a.treadling === 'right', shaftsFromBottom: a.shaftOne === 'bottom', endOneRight: a.endOne === 'right' };
}

/** A rectangle in PDF points, origin at the top left of the page, y growing downwards. */
export interface Rect {
  x: number;
  y: number;
  width: number;
  height: number;
}

export interface Size {
  width: number;
  height: number;
}

/**
 * Paper sizes in points (1/72 inch). Source: ISO 216 (A4 = 210 × 297 mm) and ANSI/ASME Y14.1
 * (Letter = 8.5 × 11 in); 210 mm = 595.28 pt, 297 mm = 841.89 pt.
 */
export const PAPER_SIZES: Readonly<Record<Paper, Size>> = {
  a4: { width: 595.28, height: 841.89 },
  letter: { width: 612, height: 792 },
};

/** The page in points, turned for landscape. */
export function pageSize(paper: Paper, orientation: PageOrientation): Size {
  const { width, height } = PAPER_SIZES[paper];
  return orientation === 'portrait' ? { width, height } : { width: height, height: width };
}

/** What a printed draft says about itself on page 1. */
export interface PrintMeta {
  title: string;
  author: string;
  studio: string;
  /** As the weaver should read it, already formatted. */
  date: string;
  version: string | number;
}

/** Numbers are printed on every 4th, 8th or 10th end and pick, as the weaver counts. */
export type NumberEvery = 4 | 8 | 10;

export interface PrintOptions extends DraftArrangement {
  paper: Paper;
  orientation: PageOrientation;
  numberEvery: NumberEvery;
  /** The order the loom-side lists follow; the saved plan's settings fill what is left out. */
  workingOrder?: Partial<Orientation>;
  /** Which ends and picks the draft sheets and cloth views show; default one repeat, or all when the draft does not repeat. */
  range?: PrintRangeChoice;
  /** Every printed end across one page width. */
  fitWidth?: boolean;
}

/** Loom-side lists a print can carry after the plan. */
export type LoomListKind = 'threading' | 'sleying' | 'tie-on' | 'weaving';
export const LOOM_LIST_KINDS: readonly LoomListKind[] = ['threading', 'sleying', 'tie-on', 'weaving'];
