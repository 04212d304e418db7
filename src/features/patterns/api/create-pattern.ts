import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { CreatePatternInput } from '@/schemas/pattern';
import type { Pattern } from '@/types/api';
import { patternKeys } from './keys';

export { CreatePatternSchema } from '@/schemas/pattern';

export const createPattern = async (input: CreatePatternInput) =>
  (await apiPost<{ pattern: Pattern }>('/patterns', input)).pattern;

export function useCreatePattern() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createPattern,
    onSuccess: (pattern) => {
      qc.setQueryData(patternKeys.detail(pattern.id), pattern);
      return qc.invalidateQueries({ queryKey: patternKeys.lists() });
    },
  });
}
