import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import { yarnsQueryOptions } from './get-yarns';

export function deleteYarn(id: number): Promise<void> {
  return api.delete(`/api/yarns/${id}`);
}

export function useDeleteYarn() {
  const queryClient = useQueryClient();
  return useMutation({ mutationFn: deleteYarn, onSuccess: () => queryClient.invalidateQueries({ queryKey: yarnsQueryOptions().queryKey }) });
}
