import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Yarn, YarnBody } from '../../../types/api';
import { yarnsQueryOptions } from './get-yarns';

export function updateYarn({ id, ...patch }: Partial<YarnBody> & { id: number }): Promise<{ yarn: Yarn }> {
  return api.patch(`/api/yarns/${id}`, patch);
}

export function useUpdateYarn() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: updateYarn, onSuccess: () => queryClient.invalidateQueries({ queryKey: yarnsQueryOptions().queryKey }) });
}
