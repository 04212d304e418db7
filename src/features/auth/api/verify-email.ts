import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { VerifyEmailInput } from '@/schemas/auth';
import { authKeys } from './keys';

export { VerifyEmailSchema } from '@/schemas/auth';

export const verifyEmail = (input: VerifyEmailInput) => apiPost<{ ok: true; email: string }>('/auth/verify-email', input);

export function useVerifyEmail() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: verifyEmail,
    meta: { silent: true },
    onSuccess: () => qc.invalidateQueries({ queryKey: authKeys.me() }),
  });
}
