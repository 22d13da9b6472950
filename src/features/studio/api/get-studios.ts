import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { StudioListItem } from '../../../types/api';

/** The studios the signed-in weaver belongs to, with their role in each. */
export function getStudios(signal?: AbortSignal): Promise<{ studios: StudioListItem[] }> {
  return api.get<{ studios: StudioListItem[] }>('/api/studios', { signal });
}

export const studiosQueryOptions = () =>
  queryOptions({ queryKey: ['studios', 'list'], queryFn: ({ signal }) => getStudios(signal) });

export function useStudios() {
  return useQuery(studiosQueryOptions());
}
