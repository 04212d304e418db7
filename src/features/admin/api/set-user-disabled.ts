import { useMutation, useQueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import { apiPost } from '@/lib/api-client';
import type { AdminUser } from './get-users';
import { adminKeys } from './keys';

export const setUserDisabled = ({ id, disabled }: { id: string; disabled: boolean }) =>
  apiPost<{ user: AdminUser }>(`/admin/users/${encodeURIComponent(id)}/${disabled ? 'disable' : 'enable'}`);

export function useSetUserDisabled() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: setUserDisabled,
    onSuccess: ({ user }) => {
      toast.success(user.disabled ? `${user.displayName} is disabled and signed out everywhere.` : `${user.displayName} can sign in again.`);
      return qc.invalidateQueries({ queryKey: adminKeys.users() });
    },
  });
}
