export const yarnKeys = {
  all: ['yarns'] as const,
  lists: () => [...yarnKeys.all, 'list'] as const,
  list: () => [...yarnKeys.lists()] as const,
};
