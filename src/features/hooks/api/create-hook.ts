import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { HookRollInput } from '@/schemas/hooks';
import type { RollHook } from '@/types/hooks';
import { hookKeys } from './keys';

export { HookInputSchema } from '@/schemas/hooks';

export const createHook = async (input: HookRollInput) => (await apiPost<{ hook: RollHook }>('/hooks', input)).hook;

export function useAddHook() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createHook,
    // The form shows why it was not saved.
    meta: { silent: true },
    onSuccess: () => qc.invalidateQueries({ queryKey: hookKeys.lists() }),
  });
}
