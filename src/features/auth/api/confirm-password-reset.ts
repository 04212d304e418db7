import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { PasswordResetConfirmInput } from '@/schemas/auth';
import { authKeys } from './keys';

export { PasswordResetConfirmSchema } from '@/schemas/auth';

export const confirmPasswordReset = (input: PasswordResetConfirmInput) => apiPost<{ ok: true; message: string }>('/auth/password-reset/confirm', input);

export function useConfirmPasswordReset() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: confirmPasswordReset,
    meta: { silent: true },
    // The server ended every session of that member, this browser's included.
    onSuccess: () => {
      qc.clear();
      qc.setQueryData(authKeys.me(), null);
    },
  });
}
