import { useMutation } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { PasswordResetRequestInput } from '@/schemas/auth';

export { PasswordResetRequestSchema } from '@/schemas/auth';

export const requestPasswordReset = (input: PasswordResetRequestInput) => apiPost<{ ok: true; message: string }>('/auth/password-reset/request', input);

export const useRequestPasswordReset = () => useMutation({ mutationFn: requestPasswordReset, meta: { silent: true } });
