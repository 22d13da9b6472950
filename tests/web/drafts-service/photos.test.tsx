import { fireEvent, screen, waitFor, within } from '@testing-library/react';
import { beforeEach, describe, expect, it, vi } from 'vitest';
import type { Photo } from '../../../src/types/api';
import { draftDetail, sessionUser } from '../support/factories';
import { apiError, mockApi, type MockHandler } from '../support/mock-api';
import { renderApp } from '../support/render';
import { stubOffscreenCanvas, twill, version } from './fixtures';

beforeEach(stubOffscreenCanvas);

function photo(overrides: Partial<Photo> = {}): Photo {
  return { id: 1, version: 3, url: '/api/photos/1', contentType: 'image/jpeg', bytes: 120_000, uploaderName: 'Wren Hollis', createdAt: '2025-03-16T09:00:00.000Z', ...overrides };
}

/** The history page with version 3 ready to open. */
function routes(role: 'editor' | 'viewer', more: Record<string, MockHandler>): Record<string, MockHandler> {
  const v3 = version({ version: 3, message: 'Hemmed' });
  return {
    'GET /api/session': { body: { user: sessionUser() } },
    'GET /api/drafts/7': { body: { draft: draftDetail({ id: 7, name: 'Point twill scarf', version: 3, role }) } },
    'GET /api/yarns': { body: { yarns: [] } },
    'GET /api/drafts/7/versions': { body: { versions: [v3, version({ version: 2 }), version({ version: 1 })] } },
    'GET /api/drafts/7/versions/3': { body: { version: { ...v3, document: twill(8) } } },
    ...more,
  };
}

async function openVersion3() {
  renderApp('/drafts/7/history');
  fireEvent.click(await screen.findByRole('button', { name: 'Open version 3' }));
  return screen.findByRole('region', { name: 'Photos of cloth from version 3' });
}

const jpeg = () => new File([new Uint8Array([0xff, 0xd8, 0xff, 0xe0])], 'scarf.jpg', { type: 'image/jpeg' });

/** The multipart body of the last upload (the mock API records JSON bodies only). */
function uploadedFile(): unknown {
  const call = vi.mocked(fetch).mock.calls.findLast(([, init]) => init?.body instanceof FormData);
  return (call?.[1]?.body as FormData | undefined)?.get('file');
}

describe('photos of a version', () => {
  it("shows only the open version's photos, and no upload to a viewer", async () => {
    mockApi(routes('viewer', {
      'GET /api/drafts/7/photos': { body: { photos: [photo({ id: 1, uploaderName: 'Tamsin Greaves' }), photo({ id: 2, version: 2, url: '/api/photos/2' })] } },
    }));
    const section = await openVersion3();
    const image = await within(section).findByRole('img', { name: 'Cloth photo added by Tamsin Greaves' });
    expect(image.getAttribute('src')).toBe('/api/photos/1');
    expect(within(section).getAllByRole('img')).toHaveLength(1);
    expect(within(section).queryByLabelText(/Add a photo/)).toBeNull();
  });

  it('uploads a photo of the open version as a file and shows it', async () => {
    const server = mockApi(routes('editor', {
      'GET /api/drafts/7/photos': (_request, calls) => ({ body: { photos: calls === 1 ? [] : [photo({ id: 9, url: '/api/photos/9' })] } }),
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/versions/3/photos': { status: 201, body: { photo: photo({ id: 9, url: '/api/photos/9' }) } },
    }));
    const section = await openVersion3();
    expect(await within(section).findByText('No photos yet.')).toBeTruthy();
    const file = jpeg();
    fireEvent.change(within(section).getByLabelText('Add a photo (JPEG, PNG or WebP, up to 5 MB)'), { target: { files: [file] } });
    expect((await within(section).findByRole('img', { name: 'Cloth photo added by Wren Hollis' })).getAttribute('src')).toBe('/api/photos/9');
    const [upload] = server.to('POST /api/drafts/7/versions/3/photos');
    expect(upload.headers.get('x-csrf-token')).toBe('tok-1');
    // The browser sets the multipart boundary itself; a JSON content type would break the upload.
    expect(upload.headers.get('content-type')).toBeNull();
    expect(uploadedFile()).toBe(file);
    expect(server.to('GET /api/drafts/7/photos')).toHaveLength(2);
  });

  it("shows the API's refusal of a file over the size limit (413)", async () => {
    mockApi(routes('editor', {
      'GET /api/drafts/7/photos': { body: { photos: [] } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/versions/3/photos': apiError(413, 'too_large', 'The file is larger than 5 MB'),
    }));
    const section = await openVersion3();
    fireEvent.change(within(section).getByLabelText(/Add a photo/), { target: { files: [jpeg()] } });
    expect((await within(section).findByRole('alert')).textContent).toContain('Could not add the photo. The file is larger than 5 MB');
  });

  it("shows the API's refusal of a file that is not a photo (422), and takes another after it", async () => {
    const server = mockApi(routes('editor', {
      'GET /api/drafts/7/photos': { body: { photos: [] } },
      'GET /api/csrf': { body: { token: 'tok-1' } },
      'POST /api/drafts/7/versions/3/photos': apiError(422, 'unprocessable', 'The file is not a JPEG, PNG or WebP image', { file: 'use a JPEG, PNG or WebP photo' }),
    }));
    const section = await openVersion3();
    const input = within(section).getByLabelText<HTMLInputElement>(/Add a photo/);
    fireEvent.change(input, { target: { files: [new File(['GIF89a'], 'scarf.gif', { type: 'image/jpeg' })] } });
    expect((await within(section).findByRole('alert')).textContent).toContain('The file is not a JPEG, PNG or WebP image');
    await waitFor(() => expect(input.disabled).toBe(false));
    fireEvent.change(input, { target: { files: [jpeg()] } });
    await waitFor(() => expect(server.to('POST /api/drafts/7/versions/3/photos')).toHaveLength(2));
  });
});
