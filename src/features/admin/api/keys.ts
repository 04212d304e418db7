import type { AdminUserListQuery } from '@/schemas/auth';

export const adminKeys = {
  all: ['admin'] as const,
  users: () => [...adminKeys.all, 'users'] as const,
  userList: (params: AdminUserListQuery) => [...adminKeys.users(), 'list', params] as const,
};
