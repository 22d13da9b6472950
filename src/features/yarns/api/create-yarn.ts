import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Yarn, YarnBody } from '../../../types/api';
import { yarnsQueryOptions } from './get-yarns';

export function createYarn(body: YarnBody): Promise<{ yarn: Yarn }> {
  return api.post('/api/yarns', body);
}

export function useCreateYarn() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: createYarn, onSuccess: () => queryClient.invalidateQueries({ queryKey: yarnsQueryOptions().queryKey }) });
}
