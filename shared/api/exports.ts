/**
 * Printed drafts and picture exports: the query strings of GET /api/drafts/:id/print.pdf and
 * /drawdown.png (and the same under /api/shared/:token).
 */
import { z } from 'zod';
import { loomLists, type LoomList } from './plans';

/** A yes/no in a query string: `true`/`false` or `1`/`0`. */
const flag = z.enum(['true', 'false', '1', '0']).transform((v) => v === 'true' || v === '1');

/** `lists=threading,weaving`: loom-side lists in the order given; an empty value asks for none. */
const listNames = z
  .string()
  .max(200)
  .transform((s, ctx) => {
    const names = s.split(',').map((n) => n.trim()).filter(Boolean);
    const bad = names.filter((n) => !(loomLists as readonly string[]).includes(n));
    if (bad.length) ctx.addIssue({ code: 'custom', message: `unknown list ${bad.join(', ')}; use ${loomLists.join(', ')}` });
    return [...new Set(names)] as LoomList[];
  });

/** `ends=1-80`: the first and last, 1-based, as the weaver numbers them. */
const numberRange = z
  .string()
  .max(40)
  .transform((s, ctx) => {
    const m = /^\s*(\d{1,6})\s*[-–]\s*(\d{1,6})\s*$/.exec(s) ?? /^\s*(\d{1,6})\s*$/.exec(s);
    const from = m ? Number(m[1]) : NaN;
    const to = m ? Number(m[2] ?? m[1]) : NaN;
    if (!m || from < 1 || to < from) {
      ctx.addIssue({ code: 'custom', message: 'give the first and last, like 1-80 (first at least 1, last not before first)' });
      return z.NEVER;
    }
    return { from, to };
  });

export const printParts = ['whole', 'repeat', 'range'] as const;

export const printQuerySchema = z
  .object({
    paper: z.enum(['a4', 'letter']).default('a4'),
    orientation: z.enum(['portrait', 'landscape']).default('portrait'),
    /** The arrangement; each one left out follows the draft's own. */
    threadingAbove: flag.optional(),
    treadlingRight: flag.optional(),
    shaftsFromBottom: flag.optional(),
    endOneRight: flag.optional(),
    numberEvery: z.enum(['4', '8', '10']).default('4').transform((v) => Number(v) as 4 | 8 | 10),
    /** Omitted: every list the plan allows. */
    lists: listNames.optional(),
    /** The working order of the loom-side lists; the saved plan's settings fill what is left out. */
    from: z.enum(['front', 'back']).optional(),
    direction: z.enum(['right-to-left', 'left-to-right']).optional(),
    shaftNumbering: z.enum(['near', 'far']).optional(),
    /** What the draft sheets show: omitted, one repeat for a draft that repeats, else the whole draft. */
    part: z.enum(printParts).optional(),
    /** With part=range: the ends and picks to print (omitted: all of them). */
    ends: numberRange.optional(),
    picks: numberRange.optional(),
    /** Every printed end across one page width. */
    fitWidth: flag.default(false),
  })
  .strict();
export type PrintQuery = z.output<typeof printQuerySchema>;
/** What the client puts in the query string. */
export type PrintQueryInput = z.input<typeof printQuerySchema>;

export const pngViews = ['structure', 'colour', 'front', 'back'] as const;
export type PngViewName = (typeof pngViews)[number];

export const drawdownPngQuerySchema = z
  .object({
    view: z.enum(pngViews).default('colour'),
    /** Pixels per cell side. */
    scale: z.coerce.number().int().min(1).max(64).default(8),
    /** Left out: as the draft's arrangement says. */
    threadingAbove: flag.optional(),
    endOneRight: flag.optional(),
  })
  .strict();
export type DrawdownPngQuery = z.output<typeof drawdownPngQuerySchema>;
export type DrawdownPngQueryInput = z.input<typeof drawdownPngQuerySchema>;

/** A query string from options, leaving out what is undefined. */
export function exportQuery(values: Record<string, string | number | boolean | readonly string[] | undefined>): string {
  const q = new URLSearchParams();
  for (const [k, v] of Object.entries(values)) {
    if (v === undefined) continue;
    q.set(k, Array.isArray(v) ? v.join(',') : String(v));
  }
  const s = q.toString();
  return s ? `?${s}` : '';
}
