import type { Response } from 'express';
import type { DrawdownPngQuery, PrintQuery } from '../../shared/api/exports';
import type { Ctx } from '../http/handler';
import { attachmentDisposition } from '../services/draft-files';
import { draftPrintable, drawdownPng, printPdf, sharedPrintable, type Printable } from '../services/exports';

type Id = { id: number };
type Token = { token: string };

async function sendPdf(res: Response, p: Printable, query: PrintQuery): Promise<void> {
  const pdf = await printPdf(p, query);
  // Inline, so the Print button opens the browser's viewer; the name is kept for saving it.
  res.set('Content-Disposition', attachmentDisposition(p.name, 'pdf').replace(/^attachment/, 'inline'));
  res.type('application/pdf').send(pdf);
}

async function sendPng(res: Response, p: Printable, query: DrawdownPngQuery): Promise<void> {
  const png = await drawdownPng(p, query);
  res.set('Content-Disposition', attachmentDisposition(`${p.name} ${query.view}`, 'png'));
  res.type('image/png').send(png);
}

export async function draftPdf({ app, res, params, query }: Ctx<unknown, PrintQuery, Id>) {
  res.set('Cache-Control', 'private, no-cache');
  await sendPdf(res, await draftPrintable(app.models, params.id), query);
}

export async function draftPng({ app, res, params, query }: Ctx<unknown, DrawdownPngQuery, Id>) {
  res.set('Cache-Control', 'private, no-cache');
  await sendPng(res, await draftPrintable(app.models, params.id), query);
}

export async function sharedPdf({ app, res, params, query }: Ctx<unknown, PrintQuery, Token>) {
  res.set('Cache-Control', 'no-store');
  await sendPdf(res, await sharedPrintable(app.models, params.token), query);
}

export async function sharedPng({ app, res, params, query }: Ctx<unknown, DrawdownPngQuery, Token>) {
  res.set('Cache-Control', 'no-store');
  await sendPng(res, await sharedPrintable(app.models, params.token), query);
}
