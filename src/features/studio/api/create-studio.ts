import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Studio } from '../../../types/api';
import { studiosQueryOptions } from './get-studios';

export interface CreatedStudio {
  studio: Studio;
}

/** Creates a studio with the creator as its owner. */
export function createStudio(input: { name: string }): Promise<CreatedStudio> {
  return api.post<CreatedStudio>('/api/studios', input);
}

export function useCreateStudio({ onSuccess }: { onSuccess?: (data: CreatedStudio) => void } = {}) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createStudio,
    onSuccess: async (data) => {
      await queryClient.invalidateQueries({ queryKey: studiosQueryOptions().queryKey });
      onSuccess?.(data);
    },
  });
}
