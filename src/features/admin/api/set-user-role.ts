import { useMutation, useQueryClient } from '@tanstack/react-query';
import { toast } from 'sonner';
import { apiPost } from '@/lib/api-client';
import type { AdminUser } from './get-users';
import { adminKeys } from './keys';

export const setUserRole = ({ id, role }: { id: string; role: AdminUser['role'] }) =>
  apiPost<{ user: AdminUser }>(`/admin/users/${encodeURIComponent(id)}/role`, { role });

export function useSetUserRole() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: setUserRole,
    onSuccess: ({ user }) => {
      toast.success(user.role === 'admin' ? `${user.displayName} is now an admin.` : `${user.displayName} is a member again.`);
      return qc.invalidateQueries({ queryKey: adminKeys.users() });
    },
  });
}
