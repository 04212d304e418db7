import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import { authKeys } from './keys';

export interface DemoAccount {
  email: string;
  password: string;
}

export const demoQueryOptions = () =>
  queryOptions({
    queryKey: authKeys.demo(),
    queryFn: async () => (await apiGet<{ demo: DemoAccount | null }>('/auth/demo')).demo,
    staleTime: Infinity,
    meta: { silent: true },
  });

export const useDemoAccount = () => useQuery(demoQueryOptions());
