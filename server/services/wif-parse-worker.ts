import { parentPort } from 'node:worker_threads';
import { HttpError } from '../http/errors';
import { draftFromWifFile } from './draft-files';
import type { WifParseReply, WifParseRequest } from './wif-parse';

/**
 * Runs in its own thread: reads one uploaded WIF file at a time and answers with the draft and its
 * warnings as JSON,
 * or the refusal the request should get. The server's event loop goes on answering meanwhile.
 */
parentPort!.on('message', (job: WifParseRequest) => {
  let reply: WifParseReply;
  try {
    const upload = draftFromWifFile({ buffer: Buffer.from(job.bytes.buffer, job.bytes.byteOffset, job.bytes.byteLength), originalname: job.name });
    reply = { id: job.id, json: JSON.stringify(upload) };
  } catch (err) {
    reply = err instanceof HttpError
      ? { id: job.id, refusal: { status: err.status, code: err.code, message: err.message, ...(err.fields ? { fields: err.fields } : {}) } }
      : { id: job.id, failure: err instanceof Error ? err.message : String(err) };
  }
  parentPort!.postMessage(reply);
});
