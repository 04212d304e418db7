export const hookKeys = {
  all: ['hooks'] as const,
  lists: () => [...hookKeys.all, 'list'] as const,
  list: () => [...hookKeys.lists()] as const,
};
