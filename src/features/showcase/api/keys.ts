/** Query keys for the showcase area: the public page, its comments, the owner's share state, profiles, reports. */
export const showcaseKeys = {
  all: ['showcase'] as const,
  details: () => [...showcaseKeys.all, 'detail'] as const,
  detail: (token: string) => [...showcaseKeys.details(), token] as const,
  comments: (token: string) => [...showcaseKeys.detail(token), 'comments'] as const,
  makers: () => [...showcaseKeys.all, 'maker'] as const,
  maker: (id: string) => [...showcaseKeys.makers(), id] as const,
};

export const shareKeys = {
  all: ['share'] as const,
  statuses: () => [...shareKeys.all, 'status'] as const,
  status: (projectId: number) => [...shareKeys.statuses(), projectId] as const,
  settings: () => [...shareKeys.all, 'settings'] as const,
};

export const reportKeys = {
  all: ['reports'] as const,
  lists: () => [...reportKeys.all, 'list'] as const,
  list: (status: 'open' | 'handled' | 'all') => [...reportKeys.lists(), status] as const,
};
