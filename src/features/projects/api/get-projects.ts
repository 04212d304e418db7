import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { ProjectStatus } from '@/schemas/common';
import { projectKeys } from './keys';

export interface ProjectListItem {
  id: number;
  title: string;
  status: ProjectStatus;
  startedOn: string | null;
  finishedOn: string | null;
  updatedAt: string;
  pieceCount: number;
  recipient: string | null;
  patternTitle: string | null;
  forYoungChild: boolean;
  visibility: 'private' | 'link' | 'public';
  /** How many safety cautions the project page shows. */
  cautionCount: number;
}

export const projectsQueryOptions = (filters: { status?: ProjectStatus } = {}) =>
  queryOptions({
    queryKey: projectKeys.list(filters),
    queryFn: async ({ signal }) => (await apiGet<{ projects: ProjectListItem[] }>('/projects', filters, signal)).projects,
  });

export const useProjects = (filters: { status?: ProjectStatus } = {}) => useQuery(projectsQueryOptions(filters));
