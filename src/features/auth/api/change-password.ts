import { useMutation } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { PasswordChangeInput } from '@/schemas/auth';

export { PasswordChangeSchema } from '@/schemas/auth';

export const changePassword = (input: PasswordChangeInput) => apiPost<{ ok: true; message: string }>('/auth/password', input);

export const useChangePassword = () => useMutation({ mutationFn: changePassword, meta: { silent: true } });
