// The cache relay between the app's processes (server/cluster/relay.ts), with stand-ins for
// node:cluster's primary and workers; tests/e2e/workers.test.ts runs the real thing.
import { EventEmitter } from 'node:events';
import type { Cluster, Worker } from 'node:cluster';
import { afterEach, describe, expect, it, vi } from 'vitest';
import { relayBetweenWorkers, workerRelay, type CacheDrop } from '../../server/cluster/relay';

/** A worker as the primary sees it: what it was sent, and whether it was killed. */
class FakeWorker extends EventEmitter {
  sent: any[] = [];
  killedWith: string | null = null;
  connected = true;
  process = { kill: (signal: string) => { this.killedWith = signal; } };
  send(message: unknown) { this.sent.push(message); return true; }
  isConnected() { return this.connected; }
}

function primaryWith(count: number) {
  const cluster = new EventEmitter();
  const workers = Array.from({ length: count }, () => new FakeWorker());
  const mail = { id: 'm1', to: 'a@b.test', subject: 'Hello', text: 'Hi', date: '2026-12-02T00:00:00.000Z' };
  relayBetweenWorkers(cluster as unknown as Cluster, () => [mail]);
  const asWorker = (w: FakeWorker) => w as unknown as Worker;
  return {
    cluster,
    workers,
    mail,
    listen: (w: FakeWorker) => cluster.emit('listening', asWorker(w), { port: 1 }),
    say: (w: FakeWorker, message: unknown) => cluster.emit('message', asWorker(w), message),
    exit: (w: FakeWorker) => { w.connected = false; cluster.emit('exit', asWorker(w), 0, null); },
  };
}

const drop: CacheDrop = { kind: 'library' };

afterEach(() => { vi.useRealTimers(); });

describe('the primary', () => {
  it('tells the publisher only once every other serving worker has applied the drop', () => {
    const { workers: [a, b, c], listen, say } = primaryWith(3);
    [a, b, c].forEach(listen);
    say(a, { shedwright: 'drop', id: 7, drop });
    expect(a.sent).toEqual([]);
    const forwarded = b.sent[0];
    expect(forwarded).toMatchObject({ shedwright: 'drop', drop });
    expect(c.sent[0]).toEqual(forwarded);
    say(b, { shedwright: 'applied', id: forwarded.id });
    expect(a.sent).toEqual([]);
    say(c, { shedwright: 'applied', id: forwarded.id });
    expect(a.sent).toEqual([{ shedwright: 'applied', id: 7 }]);
  });

  it('answers at once when no other worker serves yet: one still starting has cached nothing', () => {
    const { workers: [a, b], listen, say } = primaryWith(2);
    listen(a);
    say(a, { shedwright: 'drop', id: 1, drop });
    expect(b.sent).toEqual([]);
    expect(a.sent).toEqual([{ shedwright: 'applied', id: 1 }]);
  });

  it('counts a worker that exits as done: its caches went with it', () => {
    const { workers: [a, b], listen, say, exit } = primaryWith(2);
    [a, b].forEach(listen);
    say(a, { shedwright: 'drop', id: 3, drop });
    exit(b);
    expect(a.sent).toEqual([{ shedwright: 'applied', id: 3 }]);
    // And it is not asked again.
    say(a, { shedwright: 'drop', id: 4, drop });
    expect(b.sent).toHaveLength(1);
    expect(a.sent).toContainEqual({ shedwright: 'applied', id: 4 });
  });

  it('kills a worker that does not apply a drop within 10 s, so the write does not wait for ever', () => {
    vi.useFakeTimers();
    const { workers: [a, b], listen, say, exit } = primaryWith(2);
    [a, b].forEach(listen);
    say(a, { shedwright: 'drop', id: 5, drop });
    vi.advanceTimersByTime(9_999);
    expect(b.killedWith).toBeNull();
    vi.advanceTimersByTime(1);
    expect(b.killedWith).toBe('SIGKILL');
    exit(b);
    expect(a.sent).toEqual([{ shedwright: 'applied', id: 5 }]);
  });

  it('answers a worker asking for the captured mails', () => {
    const { workers: [a], mail, say } = primaryWith(1);
    say(a, { shedwright: 'mails', id: 9 });
    expect(a.sent).toEqual([{ shedwright: 'mails', id: 9, mails: [mail] }]);
  });

  it('leaves other libraries\' messages alone', () => {
    const { workers: [a, b], listen, say } = primaryWith(2);
    [a, b].forEach(listen);
    say(a, { type: 'increment', key: 'x' });
    expect([...a.sent, ...b.sent]).toEqual([]);
  });
});

describe('a worker', () => {
  function channel() {
    const emitter = new EventEmitter() as EventEmitter & { sent: any[]; send: (m: unknown) => boolean };
    emitter.sent = [];
    emitter.send = (m) => { emitter.sent.push(m); return true; };
    return emitter;
  }

  it('publishes through the primary and resolves when the primary says all have applied it', async () => {
    const ch = channel();
    const { relay } = workerRelay(ch as unknown as NodeJS.Process);
    let done = false;
    const published = relay.publish({ kind: 'session', sid: 'abc' }).then(() => { done = true; });
    const [sent] = ch.sent;
    expect(sent).toMatchObject({ shedwright: 'drop', drop: { kind: 'session', sid: 'abc' } });
    await Promise.resolve();
    expect(done).toBe(false);
    ch.emit('message', { shedwright: 'applied', id: sent.id });
    await published;
    expect(done).toBe(true);
  });

  it('applies what another process published, then says so', () => {
    const ch = channel();
    const { relay } = workerRelay(ch as unknown as NodeJS.Process);
    const applied: CacheDrop[] = [];
    relay.subscribe((d) => applied.push(d));
    ch.emit('message', { shedwright: 'drop', id: 42, drop: { kind: 'access' } });
    expect(applied).toEqual([{ kind: 'access' }]);
    expect(ch.sent).toEqual([{ shedwright: 'applied', id: 42 }]);
  });

  it('reads the captured mails from the primary', async () => {
    const ch = channel();
    const { mails } = workerRelay(ch as unknown as NodeJS.Process);
    const answer = mails();
    ch.emit('message', { shedwright: 'mails', id: ch.sent[0].id, mails: [{ id: 'm' }] });
    expect(await answer).toEqual([{ id: 'm' }]);
  });
});
