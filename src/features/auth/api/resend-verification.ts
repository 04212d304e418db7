import { useMutation } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';

export const resendVerification = () => apiPost<{ ok: true; message: string }>('/auth/verify-email/resend');

export const useResendVerification = () => useMutation({ mutationFn: resendVerification, meta: { silent: true } });
