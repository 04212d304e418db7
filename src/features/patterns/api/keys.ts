export const patternKeys = {
  all: ['patterns'] as const,
  lists: () => [...patternKeys.all, 'list'] as const,
  list: () => [...patternKeys.lists(), 'mine'] as const,
  details: () => [...patternKeys.all, 'detail'] as const,
  detail: (id: number) => [...patternKeys.details(), id] as const,
};
