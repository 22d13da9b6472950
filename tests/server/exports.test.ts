import { once } from 'node:events';
import { createServer, request as httpRequest, type IncomingMessage } from 'node:http';
import type { AddressInfo } from 'node:net';
import { monitorEventLoopDelay } from 'node:perf_hooks';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse as parseIni } from 'ini';
import { PDFParse } from 'pdf-parse';
import type { Response } from 'supertest';
import { defaultPlan } from '../../shared/plan';
import { pickCount, type Draft } from '../../shared/weave';
import { doubleWeaveTableMat, pointTwillScarf } from '../../server/db/seeders/demo-drafts';
import { renderDrawdownPng } from '../../server/print/drawdown-png';
import { createDraft } from '../../server/services/drafts';
import { printEvents } from '../../server/services/exports';
import { bigPointTwill, checkerboard, probeLiftPlan } from '../helpers/print-fixtures';
import { startTestServer, type TestClient, type TestServer } from '../helpers/server';

let server: TestServer;
beforeAll(async () => {
  server = await startTestServer();
});
afterAll(async () => {
  await server.close();
});

/** supertest buffers binary bodies only when asked to. */
async function fetchBinary(client: TestClient, path: string): Promise<Response> {
  return client.agent.get(path).buffer(true).parse((res, done) => {
    const chunks: Buffer[] = [];
    res.on('data', (c: Buffer) => chunks.push(c));
    res.on('end', () => done(null, Buffer.concat(chunks)));
  });
}

async function readPdf(pdf: Buffer): Promise<{ total: number; pages: string[]; text: string; title: string }> {
  const parser = new PDFParse({ data: new Uint8Array(pdf) });
  try {
    const t = await parser.getText();
    const info = await parser.getInfo();
    return { total: t.total, pages: t.pages.map((p) => p.text), text: t.text, title: String(info.info?.Title ?? '') };
  } finally {
    await parser.destroy();
  }
}

async function scene(document: Draft = pointTwillScarf()) {
  const { client: viewer, studioId, ownerId } = await server.signInWithRole('viewer');
  const owner = await server.ctx.models.User.findByPk(ownerId);
  const ownerClient = server.client();
  await ownerClient.signIn(owner!.email);
  const draft = await createDraft(server.ctx.models, { ownerId, studioId, document, tags: [] });
  return { viewer, owner: ownerClient, draftId: draft.id };
}

describe('GET /api/drafts/:id/print.pdf', () => {
  it('prints the draft for a viewer, named after the draft in safe ASCII, with the yarn table and the lists asked for', async () => {
    const s = await scene({ ...pointTwillScarf(), name: 'Écharpe «point» twill' });
    const res = await fetchBinary(s.viewer, `/api/drafts/${s.draftId}/print.pdf?paper=letter&orientation=landscape&numberEvery=8&lists=threading&from=back`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('application/pdf');
    // Browsers show a PDF sent inline; the plain name keeps only safe ASCII, the starred one the exact name (RFC 6266 / 5987).
    expect(res.headers['content-disposition']).toMatch(/^inline; filename="_charpe _point_ twill\.pdf"; filename\*=UTF-8''/);
    const pdf = res.body as Buffer;
    // Letter landscape: 11 × 8.5 in (ANSI/ASME Y14.1).
    expect(pdf.toString('latin1')).toContain('/MediaBox [0 0 792 612]');
    const { total, pages, text, title } = await readPdf(pdf);
    expect(title).toBe('Écharpe «point» twill');
    const draft = pointTwillScarf();
    expect(pages[0]).toContain(`${draft.threading.length} ends × ${pickCount(draft)} picks`);
    // In landscape the draft takes two sheets; the yarn table follows them.
    expect(text).toMatch(/Fine wool, deep teal\s+60 ends\s+0 picks/);
    expect(text).toMatch(/Fine wool, oat\s+0 ends\s+60 picks/);
    // The draft page(s), the plan page, and only the threading list, from the back of the loom.
    expect(text).toContain('No plan has been saved');
    expect(text).toContain('Working from the back of the loom');
    expect(text).not.toContain('Treadling\n');
    expect(pages[total - 1]).toContain('Threading');
  });

  it('uses the saved plan: its figures on the plan page and every list for the loom by default', async () => {
    const s = await scene();
    const plan = { unit: 'cm', finishedWidth: 30, finishedLength: 150, pieces: 1, warpYarn: { text: '8/2 cotton' }, weftYarn: { text: '8/2 cotton' } };
    const saved = await s.owner.send('put', `/api/drafts/${s.draftId}/plan`, plan);
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    const res = await fetchBinary(s.viewer, `/api/drafts/${s.draftId}/print.pdf`);
    expect(res.status).toBe(200);
    const { text } = await readPdf(res.body as Buffer);
    expect(text).toContain('Reed and dents');
    for (const heading of ['Threading', 'Sleying', 'Tying on', 'Weaving: treadling']) expect(text).toContain(heading);
  });

  it('states one sett everywhere: the plan page, the PDF header and the WIF (read back by an INI parser) all carry the plan\'s', async () => {
    const s = await scene();
    const plan = { unit: 'inch', finishedWidth: 10, finishedLength: 20, pieces: 1, sett: 24, picksPerUnit: 22, warpYarn: { text: '8/2 cotton' }, weftYarn: { text: '8/2 cotton' } };
    expect((await s.owner.send('put', `/api/drafts/${s.draftId}/plan`, plan)).status).toBe(200);
    const { pages } = await readPdf((await fetchBinary(s.viewer, `/api/drafts/${s.draftId}/print.pdf`)).body as Buffer);
    // Page 1's header and the plan page say the same sett, worded by settText.
    expect(pages[0]).toContain('sett 24 ends and 22 picks per inch');
    expect(pages.join('\n')).toMatch(/Sett 24 ends and 22 picks per inch/);
    const wif = await s.viewer.get(`/api/drafts/${s.draftId}/export.wif`);
    expect(wif.status).toBe(200);
    // WIF 1.1: [WARP]/[WEFT] Spacing is the distance between threads in Units (the ini package reads it).
    const ini = parseIni(wif.text) as Record<string, Record<string, string>>;
    expect(ini.WARP.Units.toLowerCase()).toBe('inches');
    expect(1 / Number(ini.WARP.Spacing)).toBeCloseTo(24, 6);
    expect(ini.WEFT.Units.toLowerCase()).toBe('inches');
    expect(1 / Number(ini.WEFT.Spacing)).toBeCloseTo(22, 6);
  });

  it.each([
    ['paper=a3', 'paper'],
    ['orientation=sideways', 'orientation'],
    ['numberEvery=5', 'numberEvery'],
    ['lists=threading,warping', 'lists'],
    ['threadingAbove=maybe', 'threadingAbove'],
    ['from=side', 'from'],
    ['colour=red', '_'],
    ['ends=9-3', 'ends'],
    ['part=half', 'part'],
  ])('answers a bad query (%s) with 400 naming the field', async (query, field) => {
    const s = await scene();
    const res = await s.viewer.get(`/api/drafts/${s.draftId}/print.pdf?${query}`);
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation');
    expect(Object.keys(res.body.error.fields)).toContain(field);
  });

  it('refuses a range past the draft with 422 saying how many picks it has', async () => {
    const s = await scene();
    const res = await s.viewer.get(`/api/drafts/${s.draftId}/print.pdf?part=range&picks=1-99999`);
    expect(res.status).toBe(422);
    expect(res.body.error.message).toMatch(/^the draft has \d+ picks, so picks 1–99999 cannot be printed$/);
  });

  it('keeps answering other requests while a large draft prints', async () => {
    // 1000 ends × 1000 picks on 8 shafts: about 220 sheets, under the 300-page limit.
    const big = bigPointTwill(1000);
    const s = await scene(big);
    const delay = monitorEventLoopDelay({ resolution: 5 });
    delay.enable();
    const started = performance.now();
    const printing = fetchBinary(s.viewer, `/api/drafts/${s.draftId}/print.pdf?part=whole&lists=`);
    // Ask for the session repeatedly while the print runs; each answer should come back promptly.
    const waits: number[] = [];
    let done = false;
    void printing.finally(() => (done = true));
    while (!done) {
      const t = performance.now();
      await s.viewer.get('/api/session');
      waits.push(performance.now() - t);
    }
    const res = await printing;
    delay.disable();
    const total = performance.now() - started;
    expect(res.status).toBe(200);
    const { total: pages, pages: text } = await readPdf(res.body as Buffer);
    expect(pages).toBeGreaterThan(100);
    expect(text[0]).toContain('the draft sheets show every end and pick');
    // The print yields every 25 ms of work (PRINT_SLICE_MS). On a quiet machine the longest block
    // is under 0.1 s; on a shared, busy one every slice stretches and the process is descheduled
    // now and then, so the check is relative: a print that did not yield would hold the loop for
    // nearly its whole run, well past half of it.
    const worstBlockMs = delay.max / 1e6;
    console.log(`print of ${pages} pages: ${total.toFixed(0)} ms; ${waits.length} other requests, slowest ${Math.max(...waits).toFixed(0)} ms; longest event-loop block ${worstBlockMs.toFixed(0)} ms`);
    // A fast print leaves room for only a few round trips; the block check below is the one that
    // tells a print that yields from one that does not.
    expect(waits.length).toBeGreaterThanOrEqual(2);
    expect(worstBlockMs).toBeLessThan(total / 2);
  });
});

describe('GET /api/drafts/:id/drawdown.png', () => {
  it('sends the same picture the print module makes, as an attachment named after the draft', async () => {
    const s = await scene();
    const res = await fetchBinary(s.viewer, `/api/drafts/${s.draftId}/drawdown.png?view=structure&scale=3&threadingAbove=false`);
    expect(res.status).toBe(200);
    expect(res.headers['content-type']).toBe('image/png');
    expect(res.headers['content-disposition']).toMatch(/^attachment; filename="Point twill scarf structure\.png"/);
    const png = res.body as Buffer;
    const draft = pointTwillScarf();
    // IHDR width and height (PNG spec §11.2.2).
    expect(png.readUInt32BE(16)).toBe(draft.threading.length * 3);
    expect(png.readUInt32BE(20)).toBe(pickCount(draft) * 3);
    expect(png.equals(renderDrawdownPng(draft, { view: 'structure', scale: 3, threadingAbove: false }))).toBe(true);
  });

  it('refuses a face of a one-layer draft (422), a picture too big (400) and a bad view (400)', async () => {
    // 80 × 60 cells at 64 pixels a side would be 19.7 megapixels, over the 16 allowed.
    const s = await scene(checkerboard(80, 60));
    const face = await s.viewer.get(`/api/drafts/${s.draftId}/drawdown.png?view=back`);
    expect(face.status).toBe(422);
    expect(face.body.error.fields.view).toBeTypeOf('string');
    const huge = await s.viewer.get(`/api/drafts/${s.draftId}/drawdown.png?scale=64`);
    expect(huge.status).toBe(400);
    expect(huge.body.error.fields.scale).toBe('at most 57 for this draft');
    const bad = await s.viewer.get(`/api/drafts/${s.draftId}/drawdown.png?view=floats`);
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.view).toBeTypeOf('string');
  });

  it('draws the back face of a double weave', async () => {
    const s = await scene(doubleWeaveTableMat());
    const res = await fetchBinary(s.viewer, `/api/drafts/${s.draftId}/drawdown.png?view=back&scale=2`);
    expect(res.status).toBe(200);
    expect((res.body as Buffer).equals(renderDrawdownPng(doubleWeaveTableMat(), { view: 'back', scale: 2 }))).toBe(true);
  });
});

describe('prints and pictures through a public link', () => {
  it('serves both while the link lives, without the saved plan, and 404 once it is withdrawn', async () => {
    const s = await scene();
    const plan = { ...defaultPlan('cm'), notes: 'Studio-only note about the yarn order' };
    const saved = await s.owner.send('put', `/api/drafts/${s.draftId}/plan`, plan);
    expect(saved.status, JSON.stringify(saved.body)).toBe(200);
    const made = await s.owner.post(`/api/drafts/${s.draftId}/share`);
    const token = made.body.token as string;
    const stranger = server.client();
    const pdf = await fetchBinary(stranger, `/api/shared/${token}/print.pdf?lists=weaving`);
    expect(pdf.status).toBe(200);
    const { text } = await readPdf(pdf.body as Buffer);
    expect(text).toContain('Point twill scarf');
    expect(text).toContain('No plan has been saved');
    expect(text).not.toContain('Studio-only note');
    const png = await fetchBinary(stranger, `/api/shared/${token}/drawdown.png?scale=1`);
    expect(png.status).toBe(200);
    expect((png.body as Buffer).equals(renderDrawdownPng(pointTwillScarf(), { view: 'colour', scale: 1 }))).toBe(true);

    expect((await s.owner.delete(`/api/drafts/${s.draftId}/share`)).status).toBe(200);
    expect((await stranger.get(`/api/shared/${token}/print.pdf`)).status).toBe(404);
    expect((await stranger.get(`/api/shared/${token}/drawdown.png`)).status).toBe(404);
  });
});

describe('bounded printing', () => {
  it('finding 2: a print past the limits answers 422 before any of it is made, saying how big it is; a range or one repeat prints', async () => {
    // 1200 × 1200 on 8 shafts prints as about 311 pages whole.
    const long = await scene(bigPointTwill(1200));
    const refused = await s(long.viewer, `/api/drafts/${long.draftId}/print.pdf?part=whole`);
    expect(refused.status).toBe(422);
    expect(refused.body.error.message).toMatch(/^This draft prints as [\d,]+ pages, more than the 300 a print can have; choose a range of ends and picks, or one repeat$/);
    // A browser tab opened on the print's address gets the same words as a page.
    const tab = await long.viewer.agent.get(`/api/drafts/${long.draftId}/print.pdf?part=whole`).set('accept', 'text/html,application/xhtml+xml,*/*;q=0.8');
    expect(tab.status).toBe(422);
    expect(tab.headers['content-type']).toMatch(/^text\/html/);
    expect(tab.text).toMatch(/prints as [\d,]+ pages/);
    expect((await fetchBinary(long.viewer, `/api/drafts/${long.draftId}/print.pdf?part=repeat`)).status).toBe(200);

    // The probe's 20 000 × 20 000 draft: refused at once whole, through a public link too; a range of it prints.
    const huge = await scene(probeLiftPlan());
    const whole = await s(huge.viewer, `/api/drafts/${huge.draftId}/print.pdf?part=whole`);
    expect(whole.status).toBe(422);
    expect(whole.body.error.message).toBe('This print would show 20,000 ends × 20,000 picks, more than the 4,000,000 cells a print can hold; choose a range of ends and picks, or one repeat');
    const link = await huge.owner.post(`/api/drafts/${huge.draftId}/share`);
    expect(link.status).toBeLessThan(300);
    const token = link.body.token as string;
    expect((await server.client().get(`/api/shared/${token}/print.pdf?part=whole`)).status).toBe(422);
    const part = await fetchBinary(huge.viewer, `/api/drafts/${huge.draftId}/print.pdf?ends=1-100&picks=1-100&lists=`);
    expect(part.status).toBe(200);
    expect((await readPdf(part.body as Buffer)).text).toContain('ends 1–100');

    // A picture too big at any scale says so; the library's thumbnail shows the start of the cloth only.
    const png = await s(huge.viewer, `/api/drafts/${huge.draftId}/drawdown.png?scale=1`);
    expect(png.status).toBe(422);
    expect(png.body.error.message).toMatch(/^This draft has 20,000 ends × 20,000 picks, more than the 16,000,000 cells a picture can show; print it instead and choose a range/);
    const thumb = await fetchBinary(huge.viewer, `/api/drafts/${huge.draftId}/thumbnail.png`);
    expect(thumb.status).toBe(200);
    // PNG width and height, bytes 16–23 (ISO/IEC 15948 IHDR): 96 ends and picks at 2 pixels each, at most.
    const bytes = thumb.body as Buffer;
    expect(Math.max(bytes.readUInt32BE(16), bytes.readUInt32BE(20))).toBeLessThanOrEqual(96 * 2 * 4);
  }, 120_000);

  it('finding 2: a print goes out as it is made, and stops when the client goes away', async () => {
    // About 220 pages: seconds of work, a little of it enough to send the first bytes.
    const long = await scene(bigPointTwill(1000));
    const events: { kind: string; reason?: string; pages: number }[] = [];
    const onDone = (e: { pages: number }) => events.push({ kind: 'done', ...e });
    const onStopped = (e: { reason: string; pages: number }) => events.push({ kind: 'stopped', ...e });
    printEvents.on('done', onDone);
    printEvents.on('stopped', onStopped);
    const listening = createServer(server.app).listen(0, '127.0.0.1');
    await once(listening, 'listening');
    try {
      const { port } = listening.address() as AddressInfo;
      const cookie = (long.viewer.agent as unknown as { jar: { getCookies(a: unknown): { toValueString(): string }[] } }).jar
        .getCookies({ domain: '127.0.0.1', path: '/', secure: false, script: false }).map((c) => c.toValueString()).join('; ');
      const asking = httpRequest({ host: '127.0.0.1', port, path: `/api/drafts/${long.draftId}/print.pdf?part=whole&lists=`, headers: { cookie } });
      asking.on('error', () => undefined);
      asking.end();
      const [answer] = (await once(asking, 'response')) as [IncomingMessage];
      expect(answer.statusCode).toBe(200);
      const [first] = (await once(answer, 'data')) as [Buffer];
      // The first bytes of the PDF came while the print was still being made.
      expect(first.subarray(0, 5).toString('latin1')).toBe('%PDF-');
      expect(events).toEqual([]);
      asking.destroy();
      const started = Date.now();
      while (events.length === 0 && Date.now() - started < 60_000) await new Promise((r) => setTimeout(r, 20));
      expect(events).toHaveLength(1);
      expect(events[0]).toMatchObject({ kind: 'stopped', reason: 'client gone' });
      expect(events[0].pages).toBeLessThan(200);
    } finally {
      printEvents.off('done', onDone);
      printEvents.off('stopped', onStopped);
      listening.closeAllConnections();
      listening.close();
    }
  }, 120_000);
});

/** A GET whose JSON error body is parsed (supertest parses JSON answers; a PDF stays a buffer). */
function s(client: TestClient, path: string) {
  return client.agent.get(path).set('accept', 'application/json');
}
