import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { ChangeEmailInput, VerifyEmailInput } from '@/schemas/auth';
import { authKeys } from './keys';

export const requestEmailChange = (input: ChangeEmailInput) => apiPost<{ ok: true; message: string }>('/auth/email', input);

export const useRequestEmailChange = () => useMutation({ mutationFn: requestEmailChange, meta: { silent: true } });

export const confirmEmailChange = (input: VerifyEmailInput) => apiPost<{ ok: true; email: string; message: string }>('/auth/email/confirm', input);

export function useConfirmEmailChange() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: confirmEmailChange,
    meta: { silent: true },
    onSuccess: () => qc.invalidateQueries({ queryKey: authKeys.me() }),
  });
}
