import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { StudioDetailResponse } from '../../../types/api';

/** A studio and its members; 404 for anyone who is not a member. */
export function getStudio(id: number, signal?: AbortSignal): Promise<StudioDetailResponse> {
  return api.get<StudioDetailResponse>(`/api/studios/${id}`, { signal });
}

export const studioQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['studios', 'detail', id], queryFn: ({ signal }) => getStudio(id, signal) });

export function useStudio(id: number) {
  return useQuery(studioQueryOptions(id));
}
