import { parentPort } from 'node:worker_threads';
import { HttpError } from '../http/errors';
import { derivedColumns } from './draft-derived';
import { requireCloth } from './draft-documents';
import { draftFromWifFile } from './draft-files';
import type { WifParseReply, WifParseRequest, WifUpload } from './wif-parse';

/**
 * Runs in its own thread: reads one uploaded WIF file at a time and answers with the draft, its
 * warnings and its library columns as JSON (a string crosses to the server's thread at little cost),
 * or the refusal the request should get. The server's event loop goes on answering meanwhile.
 */
parentPort!.on('message', (job: WifParseRequest) => {
  let reply: WifParseReply;
  try {
    const upload = draftFromWifFile({ buffer: Buffer.from(job.bytes.buffer, job.bytes.byteOffset, job.bytes.byteLength), originalname: job.name });
    // The checks and columns a save works out from the document are done here too, off the event loop.
    requireCloth(upload.draft);
    reply = { id: job.id, json: JSON.stringify({ ...upload, derived: derivedColumns(upload.draft) } satisfies WifUpload) };
  } catch (err) {
    reply = err instanceof HttpError
      ? { id: job.id, refusal: { status: err.status, code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } }
      : { id: job.id, failure: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply);
});
