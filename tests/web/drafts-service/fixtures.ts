// Invented drafts, versions and server answers shared by the Drafts service component tests.
import { vi } from 'vitest';
import { createDraft, type Draft } from '../../../shared/weave';
import type { DraftDetail, LineageResponse, SessionUser, VersionSummary } from '../../../src/types/api';
import { sessionUser } from '../support/factories';
import type { MockHandler } from '../support/mock-api';

/** A straight 4-shaft twill, `ends` wide and four picks long, in the palette given. */
export function twill(ends: number, palette = ['#f4ecd8', '#2b4a6f']): Draft {
  return createDraft({
    shafts: 4,
    treadles: 4,
    threading: Array.from({ length: ends }, (_, i) => [(i % 4) + 1]),
    tieup: [[1, 2], [2, 3], [3, 4], [4, 1]],
    treadling: [[1], [2], [3], [4]],
    palette,
    warpColors: Array.from({ length: ends }, () => 0),
    weftColors: [1, 1, 1, 1],
  });
}

export function version(overrides: Partial<VersionSummary> = {}): VersionSummary {
  const n = overrides.version ?? 1;
  return {
    version: n, firstVersion: n, named: true, authorName: 'Wren Hollis', message: '', createdAt: '2025-03-14T10:00:00.000Z',
    savedAt: '2025-03-14T10:00:00.000Z', thumbnailUrl: `/api/drafts/1/versions/${n}/thumbnail.png`, ...overrides,
  };
}

export function lineage(draft: DraftDetail, overrides: Partial<LineageResponse> = {}): LineageResponse {
  return { draft: { id: draft.id, name: draft.name, ownerName: draft.ownerName, parentVersion: null }, ancestors: [], hiddenAncestors: 0, children: [], ...overrides };
}

/**
 * Everything the draft page asks for on opening, as a mock table: the session, the draft, and the
 * Drafts service's parts (yarns, lineage, comments, and the public link for editors and owners).
 */
export function draftPageRoutes(draft: DraftDetail, user: SessionUser = sessionUser()): Record<string, MockHandler> {
  const base = `/api/drafts/${draft.id}`;
  return {
    'GET /api/session': { body: { user } },
    [`GET ${base}`]: { body: { draft } },
    'GET /api/yarns': { body: { yarns: [] } },
    [`GET ${base}/lineage`]: { body: lineage(draft) },
    [`GET ${base}/comments`]: { body: { comments: [] } },
    // Editors' pages fetch the CSRF token ahead, so a save as the weaver leaves needs no request first.
    ...(draft.role === 'viewer' ? {} : { [`GET ${base}/share`]: { body: { shared: false, createdAt: null } }, 'GET /api/csrf': { body: { token: 'tok-1' } } }),
  };
}

/** happy-dom's OffscreenCanvas has no 2D context; a mocked canvas element stands in, so cloth previews draw. */
export function stubOffscreenCanvas(): void {
  vi.stubGlobal('OffscreenCanvas', function OffscreenCanvas(width: number, height: number) {
    return Object.assign(document.createElement('canvas'), { width, height });
  });
}
