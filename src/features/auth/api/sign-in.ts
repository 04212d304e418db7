import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { SignInInput } from '@/schemas/auth';
import { authKeys } from './keys';
import type { Me } from './get-me';

export { SignInSchema } from '@/schemas/auth';

export const signIn = (input: SignInInput) => apiPost<{ user: Me }>('/auth/signin', input);

export function useSignIn() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signIn,
    // The form shows the sentence inline; no toast.
    meta: { silent: true },
    onSuccess: ({ user }) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), user);
    },
  });
}
