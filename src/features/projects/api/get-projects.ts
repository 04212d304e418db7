import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { ProjectStatus } from '@/schemas/common';
import type { ProjectListItem } from '@/types/api';
import { projectKeys } from './keys';

export type { ProjectListItem };


export const projectsQueryOptions = (filters: { status?: ProjectStatus } = {}) =>
  queryOptions({
    queryKey: projectKeys.list(filters),
    queryFn: async ({ signal }) => (await apiGet<{ projects: ProjectListItem[] }>('/projects', filters, signal)).projects,
  });

export const useProjects = (filters: { status?: ProjectStatus } = {}) => useQuery(projectsQueryOptions(filters));
