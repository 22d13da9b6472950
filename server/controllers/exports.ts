import type { Request, Response } from 'express';
import { HttpError } from '../http/errors';
import { PrintStopped } from '../print/draft-pdf';
import type { DrawdownPngQuery, PrintQuery } from '../../shared/api/exports';
import type { Ctx } from '../http/handler';
import { attachmentDisposition } from '../services/draft-files';
import { checkPrintSize, draftPrintable, drawdownPng, printInput, sharedPrintable, streamPrint, type Printable } from '../services/exports';

type Id = { id: number };
type Token = { token: string };

/**
 * Streams the print as it is made. Past the limits it is refused before any of it is made: as JSON
 * to the app, as a short page to a browser tab opened on the print's address. When the client
 * leaves, the print stops.
 */
async function sendPdf(req: Request, res: Response, p: Printable, query: PrintQuery): Promise<void> {
  const input = printInput(p, query);
  try {
    await checkPrintSize(input);
  } catch (err) {
    if (err instanceof HttpError && req.accepts(['json', 'html']) === 'html') {
      res.status(err.status).type('html').send(refusalPage(err.message));
      return;
    }
    throw err;
  }
  // Inline, so the Print button opens the browser's viewer; the name is kept for saving it.
  res.set('Content-Disposition', attachmentDisposition(p.name, 'pdf').replace(/^attachment/, 'inline'));
  res.type('application/pdf');
  const stop = new AbortController();
  res.on('close', () => {
    if (!res.writableFinished) stop.abort();
  });
  try {
    await streamPrint(input, res, stop.signal);
  } catch (err) {
    if (!res.headersSent) throw err;
    // Part of the PDF has gone: the only honest end is to cut it off, so no viewer shows half a print as whole.
    res.destroy();
    if (!(err instanceof PrintStopped && err.reason === 'client gone')) console.error(`A print was cut off: ${err instanceof Error ? err.message : String(err)}`);
  }
}

const escapeHtml = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`);

/** What a browser tab opened on a print's address shows when the print is refused. */
function refusalPage(message: string): string {
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Not printed · Shedwright</title></head>`
    + `<body><h1>Not printed</h1><p>${escapeHtml(message)}.</p>`
    + '<p>Close this tab and choose what to print under <strong>Print and export</strong>: a range of ends and picks, or one repeat.</p></body></html>';
}

async function sendPng(res: Response, p: Printable, query: DrawdownPngQuery): Promise<void> {
  const png = await drawdownPng(p, query);
  res.set('Content-Disposition', attachmentDisposition(`${p.name} ${query.view}`, 'png'));
  res.type('image/png').send(png);
}

export async function draftPdf({ app, req, res, params, query }: Ctx<unknown, PrintQuery, Id>) {
  res.set('Cache-Control', 'private, no-cache');
  await sendPdf(req, res, await draftPrintable(app.models, params.id), query);
}

export async function draftPng({ app, res, params, query }: Ctx<unknown, DrawdownPngQuery, Id>) {
  res.set('Cache-Control', 'private, no-cache');
  await sendPng(res, await draftPrintable(app.models, params.id), query);
}

export async function sharedPdf({ app, req, res, params, query }: Ctx<unknown, PrintQuery, Token>) {
  res.set('Cache-Control', 'no-store');
  await sendPdf(req, res, await sharedPrintable(app.models, params.token), query);
}

export async function sharedPng({ app, res, params, query }: Ctx<unknown, DrawdownPngQuery, Token>) {
  res.set('Cache-Control', 'no-store');
  await sendPng(res, await sharedPrintable(app.models, params.token), query);
}
