import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { ShelfYarnInput } from '@/schemas/yarn';
import type { ShelfYarn } from '@/types/api';
import { yarnKeys } from './keys';

export { ShelfYarnInputSchema } from '@/schemas/yarn';

export const createYarn = async (input: ShelfYarnInput) => (await apiPost<{ yarn: ShelfYarn }>('/yarns', input)).yarn;

export function useCreateYarn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createYarn,
    meta: { silent: true },
    onSuccess: () => qc.invalidateQueries({ queryKey: yarnKeys.lists() }),
  });
}
