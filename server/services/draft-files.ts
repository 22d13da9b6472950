import { readWif, WifError, type Draft } from '../../shared/weave';
import { HttpError } from '../http/errors';

/**
 * Reads an uploaded WIF file, with what was read by a guess or left out (shown to the weaver after the
 * import); a file that is not one, or does not make a valid draft, is a 422 saying why.
 */
export function draftFromWifFile(file: { buffer: Buffer; originalname: string } | undefined): { draft: Draft; warnings: string[] } {
  if (!file || file.buffer.length === 0) throw new HttpError(400, 'bad_request', 'Choose a WIF file to import.', { file: 'Choose a WIF file to import.' });
  // WIF is plain text; files from older programs may be Latin-1, which a lenient decoder reads well enough.
  const text = new TextDecoder('utf-8').decode(file.buffer);
  let draft: Draft;
  let warnings: string[];
  try {
    ({ draft, warnings } = readWif(text));
  } catch (err) {
    if (err instanceof WifError) throw new HttpError(422, 'unprocessable', err.message, { file: err.message });
    throw err;
  }
  const fallbackName = file.originalname.replace(/\.wif$/i, '').trim().slice(0, 200);
  return { draft: draft.name.trim() ? draft : { ...draft, name: fallbackName || 'Imported draft' }, warnings };
}

/** A file name a browser accepts in Content-Disposition, plus the exact name for those that read RFC 5987. */
export function attachmentDisposition(name: string, extension: string): string {
  const plain = name.replace(/[^A-Za-z0-9 ._-]+/g, '_').trim() || 'draft';
  return `attachment; filename="${plain}.${extension}"; filename*=UTF-8''${encodeURIComponent(`${name}.${extension}`)}`;
}
