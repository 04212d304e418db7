import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { UpdateShelfYarnInput } from '@/schemas/yarn';
import type { ShelfYarn } from '@/types/api';
import { yarnKeys } from './keys';

export { UpdateShelfYarnSchema } from '@/schemas/yarn';

export const updateYarn = async (id: number, input: UpdateShelfYarnInput) => (await apiPatch<{ yarn: ShelfYarn }>(`/yarns/${id}`, input)).yarn;

export function useUpdateYarn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ id, input }: { id: number; input: UpdateShelfYarnInput }) => updateYarn(id, input),
    meta: { silent: true },
    onSuccess: () => qc.invalidateQueries({ queryKey: yarnKeys.lists() }),
  });
}
