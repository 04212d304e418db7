import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { UpdateHookInput } from '@/schemas/hooks';
import type { RollHook } from '@/types/hooks';
import { hookKeys } from './keys';

export { UpdateHookSchema } from '@/schemas/hooks';

export const updateHook = async (id: number, input: UpdateHookInput) => (await apiPatch<{ hook: RollHook }>(`/hooks/${id}`, input)).hook;

export function useUpdateHook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: UpdateHookInput }) => updateHook(id, input),
    meta: { silent: true },
    onSuccess: () => qc.invalidateQueries({ queryKey: hookKeys.lists() }),
  });
}
