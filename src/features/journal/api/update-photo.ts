import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { UpdatePhotoInput } from '@/schemas/journal';
import type { PhotoOut } from '@/types/api';
import { journalKeys } from './keys';

export { UpdatePhotoSchema } from '@/schemas/journal';

export const updatePhoto = (photoId: number, input: UpdatePhotoInput) =>
  apiPatch<{ photo: PhotoOut; cover: boolean }>(`/photos/${photoId}`, input as Record<string, unknown>);

export function useUpdatePhoto(projectId: number, onCoverChange?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ photoId, input }: { photoId: number; input: UpdatePhotoInput }) => updatePhoto(photoId, input),
    onSuccess: (_data, { input }) => {
      if (input.cover !== undefined) onCoverChange?.();
      return qc.invalidateQueries({ queryKey: journalKeys.project(projectId) });
    },
  });
}
