import { fireEvent, render, screen, within } from '@testing-library/react';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { drawdownPngQuerySchema, printQuerySchema } from '../../../shared/api/exports';
import { loomLists } from '../../../shared/api/plans';
import { PrintOptions, pictureScale } from '../../../src/features/print/components/print-options';
import { pngUrl, printArrangement, printUrl, type PrintChoices } from '../../../src/features/print/print-links';

/** The query of a link, as the server's schema reads it. */
function printQuery(href: string) {
  const url = new URL(href, 'http://localhost');
  return { path: url.pathname, query: printQuerySchema.parse(Object.fromEntries(url.searchParams)) };
}

const printLink = () => screen.getByRole('link', { name: 'Print' }).getAttribute('href')!;

describe('PrintOptions', () => {
  it('starts from the editor arrangement and builds the print link from every choice', () => {
    render(<PrintOptions base="/api/drafts/7" ends={60} picks={40} layered={false}
      arrangement={printArrangement({ threading: 'below', treadling: 'right', shaftOne: 'top', endOne: 'right' })} files />);
    let { path, query } = printQuery(printLink());
    expect(path).toBe('/api/drafts/7/print.pdf');
    expect(query).toMatchObject({ paper: 'a4', orientation: 'portrait', threadingAbove: false, treadlingRight: true, shaftsFromBottom: false, endOneRight: true, numberEvery: 4 });
    expect(query.lists).toEqual([...loomLists]);
    expect(screen.getByRole('link', { name: 'Print' }).getAttribute('target')).toBe('_blank');

    fireEvent.change(screen.getByLabelText('Paper'), { target: { value: 'letter' } });
    fireEvent.change(screen.getByLabelText('Orientation'), { target: { value: 'landscape' } });
    fireEvent.change(screen.getByLabelText('Numbers every'), { target: { value: '10' } });
    fireEvent.click(screen.getByLabelText('Threading above the drawdown'));
    fireEvent.click(screen.getByLabelText('Treadling on the right'));
    fireEvent.click(screen.getByLabelText('End 1 on the right'));
    fireEvent.click(screen.getByLabelText('Sleying'));
    fireEvent.click(screen.getByLabelText('Tying on'));
    fireEvent.change(screen.getByLabelText('Working from'), { target: { value: 'back' } });
    fireEvent.change(screen.getByLabelText('Direction'), { target: { value: 'left-to-right' } });
    fireEvent.change(screen.getByLabelText('Shaft 1 is'), { target: { value: 'far' } });
    ({ query } = printQuery(printLink()));
    expect(query).toEqual({
      paper: 'letter', orientation: 'landscape', threadingAbove: true, treadlingRight: false, shaftsFromBottom: false, endOneRight: false, numberEvery: 10,
      lists: ['threading', 'weaving'], from: 'back', direction: 'left-to-right', shaftNumbering: 'far', part: 'whole', fitWidth: false,
    });
  });

  it('prints one repeat by default for a draft that repeats, and the whole draft, a range or the width on one page on request', () => {
    const { unmount } = render(<PrintOptions base="/api/drafts/7" ends={440} picks={560} layered repeat={{ ends: 80, picks: 80 }} files />);
    expect(printQuery(printLink()).query).toMatchObject({ part: 'repeat', fitWidth: false });
    expect((screen.getByLabelText('One repeat (80 ends × 80 picks)') as HTMLInputElement).checked).toBe(true);
    fireEvent.click(screen.getByLabelText('The whole draft (440 ends × 560 picks)'));
    expect(printQuery(printLink()).query).toMatchObject({ part: 'whole' });
    fireEvent.click(screen.getByLabelText('Some ends and picks'));
    fireEvent.change(screen.getByLabelText('Ends from'), { target: { value: '41' } });
    fireEvent.change(screen.getByLabelText('Picks from'), { target: { value: '600' } });
    fireEvent.click(screen.getByLabelText('Fit the width to one page (smaller cells)'));
    // A pick past the draft is brought back inside it rather than sent.
    expect(printQuery(printLink()).query).toMatchObject({ part: 'range', ends: { from: 41, to: 440 }, picks: { from: 560, to: 560 }, fitWidth: true });
    unmount();
    render(<PrintOptions base="/api/drafts/7" ends={60} picks={40} layered={false} repeat={{ ends: 60, picks: 40 }} />);
    expect(screen.queryByLabelText(/One repeat/)).toBeNull();
    expect(printQuery(printLink()).query).toMatchObject({ part: 'whole' });
  });

  it('offers pictures of the cloth laid out like the print, and the draft files', () => {
    render(<PrintOptions base="/api/drafts/7" ends={60} picks={40} layered files />);
    const exportList = within(screen.getByRole('heading', { name: 'Export' }).parentElement!);
    // 4 megapixels ÷ 2400 cells → 40 pixels a cell, capped at 16.
    const colour = exportList.getByRole('link', { name: 'Colour view (PNG, 960 × 640 pixels)' });
    fireEvent.click(screen.getByLabelText('End 1 on the right'));
    const url = new URL(colour.getAttribute('href')!, 'http://localhost');
    expect(url.pathname).toBe('/api/drafts/7/drawdown.png');
    expect(drawdownPngQuerySchema.parse(Object.fromEntries(url.searchParams))).toEqual({ view: 'colour', scale: 16, threadingAbove: true, endOneRight: true });
    for (const name of [/Structure view/, /Front view/, /Back view/]) expect(exportList.getByRole('link', { name })).toBeTruthy();
    expect(exportList.getByRole('link', { name: /WIF/ }).getAttribute('href')).toBe('/api/drafts/7/export.wif');
    expect(exportList.getByRole('link', { name: /JSON/ }).getAttribute('href')).toBe('/api/drafts/7/export.json');
  });

  it('leaves out faces of one-layer cloth, files behind a public link, and pictures of a huge draft', () => {
    const { unmount } = render(<PrintOptions base="/api/shared/abc" ends={60} picks={40} layered={false} />);
    expect(screen.queryByRole('link', { name: /Front view/ })).toBeNull();
    expect(screen.queryByRole('link', { name: /WIF/ })).toBeNull();
    expect(printQuery(printLink()).path).toBe('/api/shared/abc/print.pdf');
    unmount();
    render(<PrintOptions base="/api/drafts/7" ends={20_000} picks={20_000} layered={false} />);
    expect(screen.queryByRole('link', { name: /PNG/ })).toBeNull();
    expect(screen.getByText('This draft is too big for a picture; print it instead.')).toBeTruthy();
  });
});

describe('print links', () => {
  const choices: fc.Arbitrary<PrintChoices> = fc.record({
    paper: fc.constantFrom('a4' as const, 'letter' as const),
    orientation: fc.constantFrom('portrait' as const, 'landscape' as const),
    threadingAbove: fc.boolean(),
    treadlingRight: fc.boolean(),
    shaftsFromBottom: fc.boolean(),
    endOneRight: fc.boolean(),
    numberEvery: fc.constantFrom(4 as const, 8 as const, 10 as const),
    lists: fc.subarray([...loomLists]),
    workingOrder: fc.record({
      side: fc.constantFrom('front' as const, 'back' as const),
      direction: fc.constantFrom('right-to-left' as const, 'left-to-right' as const),
      shaftNumbering: fc.constantFrom('near' as const, 'far' as const),
    }),
    part: fc.constantFrom('whole' as const, 'repeat' as const, 'range' as const),
    ends: fc.tuple(fc.integer({ min: 1, max: 20_000 }), fc.integer({ min: 0, max: 500 })).map(([from, more]) => ({ from, to: from + more })),
    picks: fc.tuple(fc.integer({ min: 1, max: 20_000 }), fc.integer({ min: 0, max: 500 })).map(([from, more]) => ({ from, to: from + more })),
    fitWidth: fc.boolean(),
  });

  it('reads back on the server as exactly the choices made', () => {
    fc.assert(
      fc.property(choices, (c) => {
        const { query } = printQuery(printUrl('/api/drafts/1', c));
        const { workingOrder: w, ends, picks, ...rest } = c;
        expect(query).toEqual({ ...rest, from: w.side, direction: w.direction, shaftNumbering: w.shaftNumbering, ...(c.part === 'range' ? { ends, picks } : {}) });
      }),
    );
  });

  it('maps the draft arrangement to the print words without loss', () => {
    fc.assert(
      fc.property(fc.boolean(), fc.boolean(), fc.boolean(), fc.boolean(), (above, right, bottom, endRight) => {
        const p = printArrangement({ threading: above ? 'above' : 'below', treadling: right ? 'right' : 'left', shaftOne: bottom ? 'bottom' : 'top', endOne: endRight ? 'right' : 'left' });
        expect([p.threadingAbove, p.treadlingRight, p.shaftsFromBottom, p.endOneRight]).toEqual([above, right, bottom, endRight]);
        const url = new URL(pngUrl('/x', 'structure', 2, p), 'http://localhost');
        expect(drawdownPngQuerySchema.parse(Object.fromEntries(url.searchParams))).toMatchObject({ threadingAbove: p.threadingAbove, endOneRight: p.endOneRight });
      }),
    );
  });

  it('keeps every offered picture within the server limit of 16 megapixels', () => {
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 20_000 }), fc.integer({ min: 1, max: 20_000 }), (ends, picks) => {
        const scale = pictureScale(ends, picks);
        if (scale === null) expect(ends * picks).toBeGreaterThan(16_000_000);
        else expect(ends * picks * scale * scale).toBeLessThanOrEqual(16_000_000);
      }),
    );
  });
});
