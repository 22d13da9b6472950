import { EventEmitter } from 'node:events';
import { Worker } from 'node:worker_threads';
import type { ErrorCode } from '../../shared/api/errors';
import { HttpError } from '../http/errors';
import type { DerivedColumns } from './draft-derived';
import { draftFromWifFile } from './draft-files';

/**
 * Files up to this size are read on the event loop: a few milliseconds. Larger ones (a 20 000-end,
 * 20 000-pick lift plan is 1.3 MB and takes most of a second to read) go to a thread of their own,
 * so other requests are answered meanwhile.
 */
export const WIF_INLINE_MAX_BYTES = 32 * 1024;

export interface WifParseRequest {
  id: number;
  bytes: Uint8Array;
  name: string;
}
export type WifParseReply =
  | { id: number; json: string }
  | { id: number; refusal: { status: number; code: ErrorCode; message: string; fields?: Record<string, string> } }
  | { id: number; failure: string };

/** 'start' and 'end' of each read done on the thread: how a test sees that requests are answered meanwhile. */
export const wifParseEvents = new EventEmitter();

/**
 * A WIF file read: the draft, and what was read by a guess or left out; for a large file read on
 * the thread, also the draft's library columns, worked out there (the cloth checked).
 */
export type WifUpload = ReturnType<typeof draftFromWifFile> & { derived?: DerivedColumns };

interface Waiting {
  resolve: (upload: WifUpload) => void;
  reject: (err: unknown) => void;
}

let thread: Worker | null = null;
let nextId = 1;
const waiting = new Map<number, Waiting>();

/** The reading thread, started on first use and kept (without keeping the process alive) for the next file. */
function readingThread(): Worker {
  if (thread) return thread;
  const worker = new Worker(new URL('./wif-parse-thread.mjs', import.meta.url));
  worker.unref();
  worker.on('message', (reply: WifParseReply) => {
    const job = waiting.get(reply.id);
    if (!job) return;
    waiting.delete(reply.id);
    wifParseEvents.emit('end', reply.id);
    if ('json' in reply) job.resolve(JSON.parse(reply.json) as WifUpload);
    else if ('refusal' in reply) job.reject(new HttpError(reply.refusal.status, reply.refusal.code, reply.refusal.message, reply.refusal.fields));
    else job.reject(new Error(`Reading a WIF file failed: ${reply.failure}`));
  });
  // A thread that dies fails the files it held; the next file starts a new one.
  const fail = (err: unknown) => {
    if (thread === worker) thread = null;
    for (const job of waiting.values()) job.reject(err instanceof Error ? err : new Error(`The WIF reading thread stopped (${String(err)})`));
    waiting.clear();
  };
  worker.on('error', fail);
  worker.on('exit', (code) => fail(new Error(`The WIF reading thread exited with code ${code}`)));
  thread = worker;
  return worker;
}

/**
 * An uploaded WIF file as a draft with its warnings, or the 400/422 it deserves (as
 * draftFromWifFile), read off the event loop when it is large.
 */
export function parseWifUpload(file: { buffer: Buffer; originalname: string } | undefined): Promise<WifUpload> {
  if (!file || file.buffer.length <= WIF_INLINE_MAX_BYTES) {
    try {
      return Promise.resolve(draftFromWifFile(file));
    } catch (err) {
      return Promise.reject(err);
    }
  }
  const id = nextId++;
  // A copy the thread can own: the upload's buffer may be a slice of a shared pool.
  const bytes = new Uint8Array(file.buffer);
  return new Promise<WifUpload>((resolve, reject) => {
    waiting.set(id, { resolve, reject });
    wifParseEvents.emit('start', id);
    readingThread().postMessage({ id, bytes, name: file.originalname } satisfies WifParseRequest, [bytes.buffer]);
  });
}
