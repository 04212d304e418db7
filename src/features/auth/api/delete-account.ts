import { useMutation, useQueryClient } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import type { DeleteAccountInput } from '@/schemas/auth';
import { authKeys } from './keys';

export const deleteAccount = (input: DeleteAccountInput) => api<{ ok: true; message: string }>('/auth/account', { method: 'DELETE', body: input });

/** Once the account is gone nothing of it stays on this device: the cache (and so its stored copy) is emptied. */
export function useDeleteAccount() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: deleteAccount,
    meta: { silent: true },
    onSuccess: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}
