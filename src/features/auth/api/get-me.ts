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

// The member may be restored from the device's persisted cache (offline use). Anything older than this page load
// is asked of the server again, so a session that ended elsewhere (signed out on another device, password reset,
// disabled by an admin) sends this browser to sign-in instead of showing a signed-in shell; offline, it stays.
const pageLoadedAt = Date.now();

export const meQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.me(),
    queryFn: getMe,
    staleTime: 5 * 60_000,
    refetchOnMount: (query) => (query.state.dataUpdatedAt < pageLoadedAt ? 'always' : true),
  });

export const useMe = () => useQuery(meQueryOptions());
