import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Photo } from '../../../types/api';

/** Photos of cloth woven from a draft, newest first. */
export function getPhotos(draftId: number, signal?: AbortSignal): Promise<{ photos: Photo[] }> {
  return api.get(`/api/drafts/${draftId}/photos`, { signal });
}

export const photosQueryOptions = (draftId: number) =>
  queryOptions({ queryKey: ['drafts', 'photos', draftId], queryFn: ({ signal }) => getPhotos(draftId, signal) });

export function usePhotos(draftId: number) {
  return useQuery(photosQueryOptions(draftId));
}
