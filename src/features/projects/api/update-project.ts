import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { UpdateProjectInput } from '@/schemas/project';
import type { Project } from '@/types/api';
import { projectKeys } from './keys';

export { UpdateProjectSchema } from '@/schemas/project';

export const updateProject = async (id: number, input: UpdateProjectInput) => (await apiPatch<{ project: Project }>(`/projects/${id}`, input)).project;

/** `silent` for a form that shows the error itself, beside its fields, instead of the toast. */
export function useUpdateProject(id: number, { silent = false }: { silent?: boolean } = {}) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateProjectInput) => updateProject(id, input),
    meta: silent ? { silent: true } : undefined,
    onSuccess: (project) => {
      qc.setQueryData(projectKeys.detail(id), project);
      return qc.invalidateQueries({ queryKey: projectKeys.lists() });
    },
  });
}
