import { queryOptions, useQuery } from '@tanstack/react-query';
import { ApiError, apiGet } from '@/lib/api-client';
import { authKeys } from './keys';

export interface Me {
  id: string;
  email: string;
  displayName: string;
  role: 'member' | 'admin';
  emailVerified: boolean;
}

/** The signed-in member, or null when signed out (a 401 is an answer here, not an error). */
export async function getMe(): Promise<Me | null> {
  try {
    return (await apiGet<{ user: Me }>('/auth/me')).user;
  } catch (e) {
    if (e instanceof ApiError && e.status === 401) return null;
    throw e;
  }
}

export const meQueryOptions = () => queryOptions({ queryKey: authKeys.me(), queryFn: getMe, staleTime: 5 * 60_000 });

export const useMe = () => useQuery(meQueryOptions());
