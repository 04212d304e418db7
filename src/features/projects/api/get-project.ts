import { queryOptions, useQuery } from '@tanstack/react-query';
import { apiGet } from '@/lib/api-client';
import type { Project } from '@/types/api';
import { projectKeys } from './keys';

export const getProject = async (id: number, signal?: AbortSignal) => (await apiGet<{ project: Project }>(`/projects/${id}`, undefined, signal)).project;

export const projectQueryOptions = (id: number) =>
  queryOptions({
    queryKey: projectKeys.detail(id),
    queryFn: ({ signal }) => getProject(id, signal),
    // The detail is kept across reloads (for the Tally offline), so a copy restored from there is shown at once
    // and checked again with the server every time the page opens.
    staleTime: 0,
    // A missing project is said on the page itself, not in a toast.
    meta: { silent: true },
  });

/** `enabled: false` once the project is deleted, so nothing (a reconnect, a focus) asks the server for it again. */
export const useProject = (id: number, { enabled = true }: { enabled?: boolean } = {}) => useQuery({ ...projectQueryOptions(id), enabled });
