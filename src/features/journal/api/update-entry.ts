import { useMutation, useQueryClient } from '@tanstack/react-query';
import { apiPatch } from '@/lib/api-client';
import type { UpdateEntryInput } from '@/schemas/journal';
import type { JournalEntry } from '@/types/api';
import { journalKeys } from './keys';

export { UpdateEntrySchema } from '@/schemas/journal';

export const updateEntry = async (entryId: number, input: UpdateEntryInput) =>
  (await apiPatch<{ entry: JournalEntry }>(`/entries/${entryId}`, input as Record<string, unknown>)).entry;

export function useUpdateEntry(projectId: number) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ entryId, input }: { entryId: number; input: UpdateEntryInput }) => updateEntry(entryId, input),
    onSuccess: () => qc.invalidateQueries({ queryKey: journalKeys.project(projectId) }),
  });
}
