import type { Cluster, Worker } from 'node:cluster';
import type { CapturedMail } from '../../shared/api/dev';

/**
 * What another process must drop from its caches after a write: everything read from users,
 * studios, memberships and drafts ('access'), only library pages ('library'), or one session.
 */
export type CacheDrop = { kind: 'access' } | { kind: 'library' } | { kind: 'session'; sid: string };

/**
 * How the app's processes keep their caches true to each other. A process that wrote publishes what
 * the others must drop, and answers its request only once every other process has dropped it: so
 * the weaver's next request sees the write whichever process it reaches.
 */
export interface CacheRelay {
  /** Resolves once every other process has applied `drop` (at once when there are none). */
  publish(drop: CacheDrop): Promise<void>;
  /** `apply` runs for each drop another process publishes. */
  subscribe(apply: (drop: CacheDrop) => void): void;
}

/** One process on its own: nothing to tell. */
export const singleProcess: CacheRelay = {
  publish: () => Promise.resolve(),
  subscribe: () => {},
};

/** Messages between the primary and its workers; the tag keeps them apart from other libraries' messages. */
type Message =
  | { shedwright: 'drop'; id: number; drop: CacheDrop }
  | { shedwright: 'applied'; id: number }
  | { shedwright: 'mails'; id: number; mails?: CapturedMail[] };

const isMessage = (value: unknown): value is Message =>
  typeof value === 'object' && value !== null && 'shedwright' in value;

/** The worker's side: publishes through the primary, applies what it forwards, asks it for mails. */
export function workerRelay(channel: NodeJS.Process = process) {
  const waiting = new Map<number, (value: Message) => void>();
  const appliers: ((drop: CacheDrop) => void)[] = [];
  let nextId = 0;
  const ask = (message: Message) => new Promise<Message>((resolve) => {
    waiting.set(message.id, resolve);
    channel.send!(message);
  });
  channel.on('message', (message: unknown) => {
    if (!isMessage(message)) return;
    if (message.shedwright === 'drop') {
      for (const apply of appliers) apply(message.drop);
      channel.send!({ shedwright: 'applied', id: message.id } satisfies Message);
      return;
    }
    const resolve = waiting.get(message.id);
    waiting.delete(message.id);
    resolve?.(message);
  });
  const relay: CacheRelay = {
    publish: async (drop) => { await ask({ shedwright: 'drop', id: ++nextId, drop }); },
    subscribe: (apply) => { appliers.push(apply); },
  };
  /** The mails the primary's fake SMTP server caught, newest first. */
  const mails = async () => {
    const answer = await ask({ shedwright: 'mails', id: ++nextId });
    return answer.shedwright === 'mails' ? answer.mails ?? [] : [];
  };
  return { relay, mails };
}

/** How long a worker may take to apply a drop before it is taken to be hung and replaced. */
const APPLY_TIMEOUT_MS = 10_000;

/**
 * The primary's side: forwards each worker's drop to every other worker that is serving, and tells
 * the publisher when all have applied it. A worker still starting has read nothing to drop, and one
 * that exits owes nothing: its caches went with it. A worker that does not answer in time is
 * stopped rather than let the write wait for ever (the primary starts another).
 */
export function relayBetweenWorkers(cluster: Cluster, mails: () => CapturedMail[]): void {
  /** Per pending drop: the publisher, its id there, and the workers still to apply it. */
  const pending = new Map<number, { from: Worker; id: number; owed: Set<Worker>; timer: NodeJS.Timeout }>();
  const serving = new Set<Worker>();
  let nextId = 0;
  const settle = (key: number) => {
    const drop = pending.get(key);
    if (!drop || drop.owed.size > 0) return;
    pending.delete(key);
    clearTimeout(drop.timer);
    if (drop.from.isConnected()) drop.from.send({ shedwright: 'applied', id: drop.id } satisfies Message);
  };
  cluster.on('listening', (worker) => { serving.add(worker); });
  cluster.on('message', (worker, message: unknown) => {
    if (!isMessage(message)) return;
    if (message.shedwright === 'mails') {
      worker.send({ shedwright: 'mails', id: message.id, mails: mails() } satisfies Message);
    } else if (message.shedwright === 'drop') {
      const key = ++nextId;
      const others = [...serving].filter((w) => w !== worker && w.isConnected());
      const timer = setTimeout(() => { for (const hung of pending.get(key)?.owed ?? []) hung.process.kill('SIGKILL'); }, APPLY_TIMEOUT_MS);
      pending.set(key, { from: worker, id: message.id, owed: new Set(others), timer });
      for (const other of others) other.send({ shedwright: 'drop', id: key, drop: message.drop } satisfies Message);
      settle(key);
    } else {
      pending.get(message.id)?.owed.delete(worker);
      settle(message.id);
    }
  });
  cluster.on('exit', (worker) => {
    serving.delete(worker);
    for (const [key, drop] of pending) {
      drop.owed.delete(worker);
      settle(key);
    }
  });
}
