import { once } from 'node:events';
import { createServer, type Server } from 'node:net';
import type { AddressInfo } from 'node:net';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { choosePorts, isFree } from '../../scripts/lib/ports.mjs';

/** A port something listens on, for the length of this file. */
let busy: Server;
let busyPort = 0;
beforeAll(async () => {
  busy = createServer().listen(0, '127.0.0.1');
  await once(busy, 'listening');
  busyPort = (busy.address() as AddressInfo).port;
});
afterAll(() => { busy.close(); });

describe('the ports npm start listens on', () => {
  it('moves a default that is taken to the next free port and says which variable chooses another', async () => {
    const lines: string[] = [];
    const log = vi.spyOn(console, 'log').mockImplementation((line: string) => { lines.push(line); });
    try {
      const ports = await choosePorts([
        { variable: 'SHEDWRIGHT_PORT', fallback: busyPort, what: 'the app' },
        { variable: 'SHEDWRIGHT_SMTP_PORT', fallback: busyPort, what: 'the fake SMTP server' },
      ], {});
      expect(ports.SHEDWRIGHT_PORT).toBeGreaterThan(busyPort);
      expect(await isFree(ports.SHEDWRIGHT_PORT)).toBe(true);
      // Two services never get the same port, even when both fall back from one default.
      expect(ports.SHEDWRIGHT_SMTP_PORT).toBeGreaterThan(ports.SHEDWRIGHT_PORT);
      expect(lines[0]).toBe(`Port ${busyPort} (the app) is taken; using ${ports.SHEDWRIGHT_PORT}. Set SHEDWRIGHT_PORT to choose another.`);
    } finally {
      log.mockRestore();
    }
  });

  it('refuses a port set in the environment that is taken, naming the variable', async () => {
    await expect(choosePorts([{ variable: 'SHEDWRIGHT_S3_PORT', fallback: 4783, what: 'the fake S3 object store' }], { SHEDWRIGHT_S3_PORT: String(busyPort) }))
      .rejects.toThrow(`port ${busyPort} (the fake S3 object store) is taken; set SHEDWRIGHT_S3_PORT to a free port`);
    expect(await isFree(busyPort)).toBe(false);
  });
});
