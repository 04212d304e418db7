import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { CreateProjectInput } from '@/schemas/project';
import type { Project } from '@/types/api';
import { projectKeys } from './keys';

export { CreateProjectSchema } from '@/schemas/project';

export const createProject = async (input: CreateProjectInput) => (await apiPost<{ project: Project }>('/projects', input)).project;

export function useCreateProject() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: createProject,
    // The form shows what went wrong beside its fields.
    meta: { silent: true },
    onSuccess: (project) => {
      qc.setQueryData(projectKeys.detail(project.id), project);
      return qc.invalidateQueries({ queryKey: projectKeys.lists() });
    },
  });
}
