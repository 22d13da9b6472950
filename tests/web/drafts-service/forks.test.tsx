import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { draftDetail, draftSummary } from '../support/factories';
import { apiError, mockApi } from '../support/mock-api';
import { renderApp } from '../support/render';
import { draftPageRoutes, lineage, twill } from './fixtures';

// The draft page loads the editor's chunk on first use; on a busy machine that outlasts the 5 s default.
vi.setConfig({ testTimeout: 15_000 });

// Undyed warp, indigo weft.
const scarf = draftDetail({ id: 7, name: 'Point twill scarf', version: 3, role: 'editor', document: twill(8, ['#f4ecd8', '#2b4a6f']) });
// Yards per pound from the count: cotton 840 × 8 ÷ 2 = 3360; linen lea 300 × 16 ÷ 2 = 2400 (common practice, from memory).
const yarns = [
  { id: 1, name: 'Madder 8/2 cotton', fibre: 'cotton', colour: '#a83232', count: '8/2', yardsPerPound: 3360 },
  { id: 2, name: 'Walnut linen', fibre: 'linen', colour: '#5c4033', count: '16/2', yardsPerPound: 2400 },
];

async function openDialog() {
  // The first draft page of a run loads the editor's chunk, which can take longer than the default second.
  fireEvent.click(await screen.findByRole('button', { name: 'New colourway' }, { timeout: 5000 }));
  const dialog = screen.getByRole('dialog', { name: 'New colourway' });
  expect(dialog.hasAttribute('open')).toBe(true);
  return within(dialog);
}

describe('new colourway', () => {
  it('forks the opened version with a colour picked freely and one from the yarns, then opens the copy', async () => {
    const copy = draftDetail({ id: 12, name: 'Madder scarf', version: 1, role: 'owner', document: twill(8, ['#a83232', '#123456']) });
    const server = mockApi({
      ...draftPageRoutes(scarf),
      ...draftPageRoutes(copy),
      'GET /api/yarns': { body: { yarns } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/fork': { status: 201, body: { draft: draftSummary({ id: 12, name: 'Madder scarf', version: 1 }) } },
    });
    const app = renderApp('/drafts/7');
    const dialog = await openDialog();
    expect(dialog.getByText(/A copy of version 3/)).toBeTruthy();
    const name = dialog.getByLabelText<HTMLInputElement>('Name');
    expect(name.value).toBe('Point twill scarf (new colourway)');
    expect(dialog.getByLabelText<HTMLInputElement>('New colour for colour 1').value).toBe('#f4ecd8');
    expect(dialog.getByLabelText<HTMLInputElement>('New colour for colour 2').value).toBe('#2b4a6f');

    fireEvent.change(name, { target: { value: '  Madder scarf ' } });
    const yarn = await dialog.findByLabelText('Yarn for colour 1');
    expect(within(yarn).getAllByRole('option').map((o) => o.textContent)).toEqual(['From my yarns…', 'Madder 8/2 cotton (#a83232)', 'Walnut linen (#5c4033)']);
    fireEvent.change(yarn, { target: { value: '#a83232' } });
    fireEvent.change(dialog.getByLabelText('New colour for colour 2'), { target: { value: '#123456' } });
    expect(dialog.getByText('#a83232', { selector: 'code' })).toBeTruthy();
    expect(dialog.getByText('#123456', { selector: 'code' })).toBeTruthy();
    fireEvent.click(dialog.getByRole('button', { name: 'Make colourway' }));

    await waitFor(() => expect(app.location()).toBe('/drafts/12'));
    expect(server.to('POST /api/drafts/7/fork')[0].body).toEqual({ name: 'Madder scarf', palette: ['#a83232', '#123456'], version: 3 });
    expect(await screen.findByRole('heading', { level: 1, name: 'Madder scarf' })).toBeTruthy();
  });

  it('offers no yarn list to a weaver with no yarns', async () => {
    mockApi(draftPageRoutes(scarf));
    renderApp('/drafts/7');
    const dialog = await openDialog();
    expect(dialog.getByLabelText('New colour for colour 1')).toBeTruthy();
    expect(dialog.queryByLabelText('Yarn for colour 1')).toBeNull();
  });

  it('shows the palette refusal in the colours and keeps the dialog open', async () => {
    const server = mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/fork': apiError(422, 'unprocessable', 'The new colourway has 2 colours; the draft has 3', { palette: 'give exactly 3 colours, one for each colour of the draft' }),
    });
    const app = renderApp('/drafts/7');
    const dialog = await openDialog();
    fireEvent.click(dialog.getByRole('button', { name: 'Make colourway' }));
    const colours = dialog.getByRole('group', { name: 'Colours' });
    expect(await within(colours).findByText('⚠ give exactly 3 colours, one for each colour of the draft')).toBeTruthy();
    expect(server.to('POST /api/drafts/7/fork')[0].body).toEqual({ name: 'Point twill scarf (new colourway)', palette: ['#f4ecd8', '#2b4a6f'], version: 3 });
    expect(screen.getByRole('dialog', { name: 'New colourway' }).hasAttribute('open')).toBe(true);
    expect(app.location()).toBe('/drafts/7');
  });

  it('shows a refusal with no field beside the form', async () => {
    mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/fork': apiError(404, 'not_found', 'No such draft'),
    });
    renderApp('/drafts/7');
    const dialog = await openDialog();
    fireEvent.click(dialog.getByRole('button', { name: 'Make colourway' }));
    expect((await dialog.findByRole('alert')).textContent).toContain('Could not make the colourway. No such draft');
  });

  it('starts again from the draft colours each time it opens', async () => {
    mockApi(draftPageRoutes(scarf));
    renderApp('/drafts/7');
    let dialog = await openDialog();
    fireEvent.change(dialog.getByLabelText('New colour for colour 1'), { target: { value: '#000000' } });
    fireEvent.click(dialog.getByRole('button', { name: 'Cancel' }));
    expect(screen.getByRole('dialog', { hidden: true }).hasAttribute('open')).toBe(false);
    dialog = await openDialog();
    expect(dialog.getByLabelText<HTMLInputElement>('New colour for colour 1').value).toBe('#f4ecd8');
  });
});

describe('lineage', () => {
  it('links the parents nearest first with the version forked, the hidden ones counted, and the colourways made', async () => {
    mockApi({
      ...draftPageRoutes(scarf),
      'GET /api/drafts/7/lineage': {
        body: lineage(scarf, {
          draft: { id: 7, name: 'Point twill scarf', ownerName: 'Wren Hollis', parentVersion: 5 },
          ancestors: [
            { id: 4, name: 'Twill sampler', ownerName: 'Tamsin Greaves', parentVersion: 2 },
            { id: 2, name: 'Straight draw', ownerName: 'Ola Brightwater', parentVersion: null },
          ],
          hiddenAncestors: 2,
          children: [{ id: 15, name: 'Rust scarf', ownerName: 'Ola Brightwater', parentVersion: 3 }],
        }),
      },
    });
    renderApp('/drafts/7/notes');
    const section = await screen.findByRole('region', { name: 'Lineage' });
    const parents = within(await within(section).findByRole('list', { name: 'Made from, nearest first' })).getAllByRole('listitem');
    expect(parents.map((li) => li.textContent)).toEqual([
      'Twill sampler by Tamsin Greaves (version 5)',
      'Straight draw by Ola Brightwater',
      '2 drafts not shared with you',
    ]);
    expect(within(parents[0]).getByRole('link', { name: 'Twill sampler' }).getAttribute('href')).toBe('/drafts/4');
    expect(within(parents[1]).getByRole('link', { name: 'Straight draw' }).getAttribute('href')).toBe('/drafts/2');
    const children = within(within(section).getByRole('list', { name: 'Colourways made from this draft' })).getAllByRole('listitem');
    expect(children.map((li) => li.textContent)).toEqual(['Rust scarf by Ola Brightwater (from version 3)']);
    expect(within(children[0]).getByRole('link', { name: 'Rust scarf' }).getAttribute('href')).toBe('/drafts/15');
  });

  it('says when a draft has no parents and no colourways', async () => {
    mockApi(draftPageRoutes(scarf));
    renderApp('/drafts/7/notes');
    const section = await screen.findByRole('region', { name: 'Lineage' });
    expect(await within(section).findByText('Nothing: this draft started here.')).toBeTruthy();
    expect(within(section).getByText('None yet.')).toBeTruthy();
    expect(within(section).queryByRole('link')).toBeNull();
  });

  it('names a single hidden parent in the singular', async () => {
    mockApi({ ...draftPageRoutes(scarf), 'GET /api/drafts/7/lineage': { body: lineage(scarf, { hiddenAncestors: 1 }) } });
    renderApp('/drafts/7/notes');
    const section = await screen.findByRole('region', { name: 'Lineage' });
    expect(await within(section).findByText('A draft not shared with you')).toBeTruthy();
  });
});
