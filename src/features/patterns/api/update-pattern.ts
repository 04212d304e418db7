import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { UpdatePatternInput } from '@/schemas/pattern';
import type { Pattern } from '@/types/api';
import { patternKeys } from './keys';

export { UpdatePatternSchema } from '@/schemas/pattern';

export const updatePattern = async ({ id, ...input }: UpdatePatternInput & { id: number }) =>
  (await apiPatch<{ pattern: Pattern }>(`/patterns/${id}`, input)).pattern;

export function useUpdatePattern() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: updatePattern,
    onSuccess: (pattern) => {
      qc.setQueryData(patternKeys.detail(pattern.id), pattern);
      return qc.invalidateQueries({ queryKey: patternKeys.lists() });
    },
  });
}
