import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { SignUpInput } from '@/schemas/auth';
import { authKeys } from './keys';
import type { Me } from './get-me';

export { SignUpSchema } from '@/schemas/auth';

export const signUp = (input: SignUpInput) => apiPost<{ user: Me }>('/auth/signup', input);

export function useSignUp() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: signUp,
    meta: { silent: true }, // the form shows the sentence inline
    onSuccess: ({ user }) => {
      qc.clear();
      qc.setQueryData(authKeys.me(), user);
    },
  });
}
