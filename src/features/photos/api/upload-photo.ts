import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '../../../lib/api-client';
import type { Photo } from '../../../types/api';
import { photosQueryOptions } from './get-photos';

/** Adds a photo (JPEG, PNG or WebP, up to 5 MB) of cloth woven from version `version`. */
export function uploadPhoto(draftId: number, version: number, file: File): Promise<{ photo: Photo }> {
  const form = new FormData();
  form.append('file', file);
  return api.postForm(`/api/drafts/${draftId}/versions/${version}/photos`, form);
}

export function useUploadPhoto(draftId: number) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ version, file }: { version: number; file: File }) => uploadPhoto(draftId, version, file),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: photosQueryOptions(draftId).queryKey }),
  });
}
