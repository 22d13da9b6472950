import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Yarn } from '../../../types/api';

/** The signed-in weaver's stash, by name. */
export function getYarns(signal?: AbortSignal): Promise<{ yarns: Yarn[] }> {
  return api.get('/api/yarns', { signal });
}

export const yarnsQueryOptions = () => queryOptions({ queryKey: ['yarns'], queryFn: ({ signal }) => getYarns(signal) });

export function useYarns() {
  return useQuery(yarnsQueryOptions());
}
