import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiDelete } from '@/lib/api-client';
import { journalKeys } from './keys';

export const deletePhoto = (photoId: number) => apiDelete<void>(`/photos/${photoId}`);

export function useDeletePhoto(projectId: number, onCoverChange?: () => void) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ photoId }: { photoId: number; wasCover: boolean }) => deletePhoto(photoId),
    onSuccess: (_d, { wasCover }) => {
      if (wasCover) onCoverChange?.();
      return qc.invalidateQueries({ queryKey: journalKeys.project(projectId) });
    },
  });
}
