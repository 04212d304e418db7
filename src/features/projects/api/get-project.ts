import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { Project } from '@/types/api';
import { projectKeys } from './keys';

export const getProject = async (id: number, signal?: AbortSignal) => (await apiGet<{ project: Project }>(`/projects/${id}`, undefined, signal)).project;

export const projectQueryOptions = (id: number) =>
  // A missing project is said on the page itself, not in a toast.
  queryOptions({ queryKey: projectKeys.detail(id), queryFn: ({ signal }) => getProject(id, signal), meta: { silent: true } });

export const useProject = (id: number) => useQuery(projectQueryOptions(id));
