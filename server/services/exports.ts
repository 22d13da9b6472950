import { EventEmitter } from 'node:events';
import type { Writable } from 'node:stream';
import type { DrawdownPngQuery, PrintQuery } from '../../shared/api/exports';
import type { LoomList } from '../../shared/api/plans';
import type { PlanDocument } from '../../shared/plan';
import { printArrangementOf, type LoomListKind, type PrintMeta } from '../../shared/print/types';
import { arrangementOf, isLayered, parseDraft, pickCount, type Draft } from '../../shared/weave';
import { HttpError, notFound } from '../http/errors';
import type { Models } from '../models';
import { PRINT_LIMITS, printExtent, PrintStopped, streamDraftPdf, type DraftPdfInput } from '../print/draft-pdf';
import { renderDrawdownPngAsync } from '../print/drawdown-png';
import { getPlan } from './plans';
import { sharedDraft } from './sharing';
import { formatDay } from '../../shared/words';

/** A draft with what its print says about it. */
export interface Printable {
  draft: Draft;
  name: string;
  meta: PrintMeta;
  plan?: PlanDocument;
}

/** "2 March 2025", as the weaver reads a date on paper. */
function paperDate(d: Date): string {
  return formatDay(d);
}

/** The draft as its editors see it now (the working document), with its saved plan if any. */
export async function draftPrintable(models: Models, draftId: number): Promise<Printable> {
  const [row, saved] = await Promise.all([
    models.Draft.findByPk(draftId, {
      attributes: ['name', 'version', 'updatedAt', 'document'],
      include: [
        { model: models.User, as: 'owner', attributes: ['name'] },
        { model: models.Studio, as: 'studio', attributes: ['name'] },
      ],
    }),
    getPlan(models, draftId),
  ]);
  if (!row) throw notFound('No such draft');
  return {
    draft: parseDraft(row.document),
    name: row.name,
    meta: { title: row.name, author: row.owner?.name ?? '', studio: row.studio?.name ?? '', date: paperDate(row.updatedAt), version: row.version },
    ...(saved.plan ? { plan: saved.plan } : {}),
  };
}

/**
 * The draft behind a public link. The link shows the draft alone, so its print carries no saved
 * plan (notes and yarn choices stay with the studio) and no studio name.
 */
export async function sharedPrintable(models: Models, token: string): Promise<Printable> {
  const { draft } = await sharedDraft(models, token);
  return {
    draft: parseDraft(draft.document),
    name: draft.name,
    meta: { title: draft.name, author: draft.ownerName, studio: '', date: paperDate(new Date(draft.updatedAt)), version: draft.version },
  };
}

/** The entries whose value is given. */
function definedOnly<T extends Record<string, unknown>>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

const LIST_KINDS: Record<LoomList, LoomListKind> = { threading: 'threading', sleying: 'sleying', tieon: 'tie-on', weaving: 'weaving' };

/** Prints never run side by side: a second waits for the first, so a burst of prints cannot eat the server's memory. */
let queue: Promise<unknown> = Promise.resolve();

function oneAtATime<T>(job: () => Promise<T>): Promise<T> {
  const run = queue.then(job, job);
  queue = run.catch(() => undefined);
  return run;
}

/** The print the query asks for: paper, arrangement, numbering, lists, working order and part of the draft. */
export function printInput(p: Printable, q: PrintQuery): DraftPdfInput {
  const workingOrder = {
    ...(q.from ? { side: q.from } : {}),
    ...(q.direction ? { direction: q.direction } : {}),
    ...(q.shaftNumbering ? { shaftNumbering: q.shaftNumbering } : {}),
  };
  return {
    draft: p.draft,
    meta: p.meta,
    ...(p.plan ? { plan: p.plan } : {}),
    ...(q.lists ? { lists: q.lists.map((l) => LIST_KINDS[l]) } : {}),
    options: {
      paper: q.paper,
      orientation: q.orientation,
      // The draft's own arrangement, with what the query names laid over it.
      ...printArrangementOf(arrangementOf(p.draft)),
      ...definedOnly({ threadingAbove: q.threadingAbove, treadlingRight: q.treadlingRight, shaftsFromBottom: q.shaftsFromBottom, endOneRight: q.endOneRight }),
      numberEvery: q.numberEvery,
      workingOrder,
      // Naming ends or picks is asking for a range.
      range: { ...(q.part ? { part: q.part } : q.ends || q.picks ? { part: 'range' as const } : {}), ...(q.ends ? { ends: q.ends } : {}), ...(q.picks ? { picks: q.picks } : {}) },
      fitWidth: q.fitWidth,
    },
  };
}

const CHOOSE_LESS = 'choose a range of ends and picks, or one repeat';
const count = (n: number) => n.toLocaleString('en');

/**
 * Refuses (422) a print past PRINT_LIMITS before any of it is made, saying how big it would be and
 * what to choose instead; a range outside the draft is a 422 too.
 */
export async function checkPrintSize(input: DraftPdfInput): Promise<void> {
  let extent;
  try {
    extent = await printExtent(input, PRINT_LIMITS.cells);
  } catch (err) {
    if (err instanceof RangeError) throw new HttpError(422, 'unprocessable', err.message);
    throw err;
  }
  const { window, pages } = extent;
  if (pages === null) {
    const shown = `${count(window.ends.end - window.ends.start)} ends × ${count(window.picks.end - window.picks.start)} picks`;
    throw new HttpError(422, 'unprocessable', `This print would show ${shown}, more than the ${count(PRINT_LIMITS.cells)} cells a print can hold; ${CHOOSE_LESS}`,
      { part: CHOOSE_LESS });
  }
  if (pages > PRINT_LIMITS.pages) {
    throw new HttpError(422, 'unprocessable', `This draft prints as ${count(pages)} pages, more than the ${PRINT_LIMITS.pages} a print can have; ${CHOOSE_LESS}`,
      { part: CHOOSE_LESS });
  }
}

/**
 * What prints do, for tests and logs: 'done' ({ pages }) when a print has gone out whole,
 * 'stopped' ({ reason, pages }) when one was stopped part way.
 */
export const printEvents = new EventEmitter();

/**
 * Writes the print to `out` as it is made, one print at a time. Stops when `signal` fires (the
 * client left), past PRINT_LIMITS.ms or well past the page limit, rejecting with PrintStopped.
 */
export function streamPrint(input: DraftPdfInput, out: Writable, signal: AbortSignal): Promise<void> {
  return oneAtATime(async () => {
    try {
      if (signal.aborted) throw new PrintStopped('client gone', 0);
      const { pages } = await streamDraftPdf(input, out, {
        signal,
        deadline: performance.now() + PRINT_LIMITS.ms,
        // The lists' pages are estimated: a little over is fine, a runaway is not.
        maxPages: Math.ceil(PRINT_LIMITS.pages * 1.25),
      });
      printEvents.emit('done', { pages });
    } catch (err) {
      if (err instanceof PrintStopped) printEvents.emit('stopped', { reason: err.reason, pages: err.pages });
      if (err instanceof RangeError) throw new HttpError(422, 'unprocessable', err.message);
      throw err;
    }
  });
}

/**
 * Largest picture served: 16 megapixels (a 2000 × 2000 draft at 2 pixels a cell). Laying out the
 * pixels holds the event loop (about 0.1 s per 4 megapixels here); compressing does not.
 */
export const EXPORT_MAX_PIXELS = 16_000_000;

/** A picture of the cloth; 400 for a picture too big at that scale, 422 for one too big at any scale or a face of a one-layer draft. */
export function drawdownPng(p: Printable, q: DrawdownPngQuery): Promise<Buffer> {
  const { draft } = p;
  if ((q.view === 'front' || q.view === 'back') && !isLayered(draft)) {
    throw new HttpError(422, 'unprocessable', `The ${q.view} view needs a draft woven in more than one layer`, { view: 'needs a layered draft' });
  }
  const cells = draft.threading.length * pickCount(draft);
  if (cells === 0) throw new HttpError(422, 'unprocessable', 'The draft has no cells to draw yet');
  if (cells > EXPORT_MAX_PIXELS) {
    throw new HttpError(422, 'unprocessable', `This draft has ${count(draft.threading.length)} ends × ${count(pickCount(draft))} picks, more than the `
      + `${count(EXPORT_MAX_PIXELS)} cells a picture can show; print it instead and ${CHOOSE_LESS}`, { scale: 'too big at any scale' });
  }
  if (cells * q.scale * q.scale > EXPORT_MAX_PIXELS) {
    const most = Math.floor(Math.sqrt(EXPORT_MAX_PIXELS / cells));
    throw new HttpError(400, 'validation', `The picture would be too big at ${q.scale} pixels per cell`, { scale: `at most ${most} for this draft` });
  }
  const own = printArrangementOf(arrangementOf(draft));
  return renderDrawdownPngAsync(draft, { view: q.view, scale: q.scale, threadingAbove: q.threadingAbove ?? own.threadingAbove, endOneRight: q.endOneRight ?? own.endOneRight });
}
