// Invented test data with overrides (demo names are our own).
import { emptyDraft } from '../../../shared/weave';
import type { DraftDetail, DraftListResponse, DraftSummary, SessionUser, StudioMember } from '../../../src/types/api';

export function sessionUser(overrides: Partial<SessionUser> = {}): SessionUser {
  return { id: 1, email: 'wren@example.test', name: 'Wren Hollis', isAdmin: false, memberships: [], ...overrides };
}

export function draftSummary(overrides: Partial<DraftSummary> = {}): DraftSummary {
  return {
    id: 1,
    name: 'Two-block table mat',
    ownerName: 'Wren Hollis',
    studioId: null,
    studioName: null,
    ends: 240,
    picks: 300,
    shafts: 8,
    colors: 2,
    tags: ['double weave'],
    structure: ['double weave'],
    version: 3,
    updatedAt: '2025-03-14T10:00:00.000Z',
    thumbnailUrl: null,
    ...overrides,
  };
}

export function draftDetail(overrides: Partial<DraftDetail> = {}): DraftDetail {
  return { ...draftSummary(), document: emptyDraft(4, 4), role: 'owner', ...overrides };
}

export function draftsPage(items: DraftSummary[], overrides: Partial<DraftListResponse> = {}): DraftListResponse {
  return { items, total: items.length, page: 1, pageSize: 20, ...overrides };
}

export function member(overrides: Partial<StudioMember> = {}): StudioMember {
  return { userId: 2, name: 'Tamsin Greaves', email: 'tamsin@example.test', role: 'editor', ...overrides };
}
