import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPost } from '@/lib/api-client';
import type { CreateEntryInput } from '@/schemas/journal';
import type { JournalEntry } from '@/types/api';
import { journalKeys } from './keys';

export { CreateEntrySchema } from '@/schemas/journal';

export const createEntry = async (projectId: number, input: CreateEntryInput) =>
  (await apiPost<{ entry: JournalEntry }>(`/projects/${projectId}/entries`, input as Record<string, unknown>)).entry;

export function useCreateEntry(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: CreateEntryInput) => createEntry(projectId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: journalKeys.project(projectId) }),
  });
}
