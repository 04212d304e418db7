import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { UpdateProjectInput } from '@/schemas/project';
import type { Project } from '@/types/api';
import { projectKeys } from './keys';

export { UpdateProjectSchema } from '@/schemas/project';

export const updateProject = async (id: number, input: UpdateProjectInput) => (await apiPatch<{ project: Project }>(`/projects/${id}`, input)).project;

export function useUpdateProject(id: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: UpdateProjectInput) => updateProject(id, input),
    onSuccess: (project) => {
      qc.setQueryData(projectKeys.detail(id), project);
      return qc.invalidateQueries({ queryKey: projectKeys.lists() });
    },
  });
}
