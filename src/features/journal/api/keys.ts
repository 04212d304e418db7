export interface EntryFilters {
  pieceId?: number;
}

export const journalKeys = {
  all: ['journal'] as const,
  lists: () => [...journalKeys.all, 'list'] as const,
  /** Every list of one project, whatever the filter: what a change to one of its entries invalidates. */
  project: (projectId: number) => [...journalKeys.lists(), projectId] as const,
  list: (projectId: number, filters: EntryFilters = {}) => [...journalKeys.project(projectId), filters] as const,
};
