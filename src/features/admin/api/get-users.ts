import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { AdminUserListQuery } from '@/schemas/auth';
import { adminKeys } from './keys';

export interface AdminUser {
  id: string;
  email: string;
  displayName: string;
  role: 'member' | 'admin';
  emailVerified: boolean;
  disabled: boolean;
  disabledAt: string | null;
  lastSignInAt: string | null;
  createdAt: string;
  projectCount: number;
}

export interface AdminUserPage {
  users: AdminUser[];
  page: number;
  pageSize: number;
  total: number;
  pageCount: number;
}

export const adminUsersQueryOptions = (params: AdminUserListQuery) =>
  queryOptions({
    queryKey: adminKeys.userList(params),
    queryFn: ({ signal }) => apiGet<AdminUserPage>('/admin/users', { ...params }, signal),
    // Keep showing the last page while the next sort/filter/page loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export const useAdminUsers = (params: AdminUserListQuery) => useQuery(adminUsersQueryOptions(params));
