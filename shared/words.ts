/**
 * The words Shedwright shows for its own things (areas, draft sections, cloth views, the lists used
 * at the loom, roles), written once and used by the screens, the printed PDF and the mails, so a name
 * changes in one place. Trade words stay the trade's (end, pick, shaft, treadle, sett, dent, float);
 * our own names are plain English. Dates and numbers are written the British way everywhere.
 */

/** The one locale for dates and numbers, on screen, in print and in mail. */
export const LOCALE = 'en-GB';

/** The top-level areas of the app. */
export const AREA_NAMES = { drafts: 'Drafts', studios: 'Studios', yarns: 'Yarns', account: 'Account' } as const;

/** A draft's sections, in the order a weaver works through them. */
export const SECTION_NAMES = {
  design: 'Design',
  plan: 'Plan',
  loom: 'At the loom',
  history: 'History',
  print: 'Print and export',
  notes: 'Notes and photos',
  discussion: 'Discussion',
} as const;

/** The cloth views, the same in the editor and in print. */
export const CLOTH_VIEW_NAMES = {
  structure: 'Structure',
  colour: 'Colour',
  floats: 'Floats',
  front: 'Front',
  back: 'Back',
  layers: 'Layer map',
} as const;

/** The lists used at the loom, named the same on the At the loom page and in print. */
export const LOOM_LIST_NAMES = {
  threading: 'Threading',
  sleying: 'Sleying',
  tieOn: 'Tying on',
  weaving: 'Weaving',
} as const;

/** Studio roles as they are written, never their ids. */
export const ROLE_NAMES = { owner: 'Owner', editor: 'Editor', viewer: 'Viewer' } as const;

/** Names of things that appear on more than one screen, in print or in mail. */
export const NAMES = {
  /** A copy of a draft in other colours: the button, the dialog and the version message. */
  newColourway: 'New colourway',
  /** The lineage line of a draft made from another. */
  madeFrom: 'Made from',
  warpColourOrder: 'Warp colour order',
  weftColourOrder: 'Weft colour order',
  blockDesign: 'Block design',
  endsPerInch: 'ends per inch',
  picksPerInch: 'picks per inch',
  numbersEvery: 'Numbers every',
} as const;

/** The arrangement of the grids, worded the same way round in the editor and the Print section. */
export const ARRANGEMENT_NAMES = {
  threadingAbove: 'Threading above the drawdown',
  treadlingRight: 'Treadling on the right',
  shaftOneAtBottom: 'Shaft 1 at the bottom of the threading',
  endOneRight: 'End 1 on the right',
} as const;

/** Which shaft the weaver counts as shaft 1, worded the same on the At the loom page, in Print and on paper. */
export const SHAFT_NUMBERING_NAMES = { question: 'Shaft 1 is', near: 'Nearest you', far: 'Farthest from you' } as const;

/** A number the British way (1,234.5), with at most `digits` decimals. */
export function formatNumber(n: number, digits = 0): string {
  return n.toLocaleString(LOCALE, { maximumFractionDigits: digits, minimumFractionDigits: 0 });
}

/** A day the British way: 5 December 2026. */
export function formatDay(d: Date | string | number): string {
  return new Date(d).toLocaleDateString(LOCALE, { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
}
