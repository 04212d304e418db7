import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { z } from 'zod';
import { Button } from '@/components/ui/button';
import { CheckboxField, TextAreaField, TextField } from '@/components/ui/field';
import { UpdateProjectSchema } from '@/schemas/project';
import type { Project } from '@/types/api';

// The same field rules as the API's PATCH, for the fields this form edits.
const shape = UpdateProjectSchema.shape;
const DetailsSchema = z.object({
  title: shape.title.unwrap(),
  recipient: shape.recipient,
  startedOn: shape.startedOn,
  finishedOn: shape.finishedOn,
  forYoungChild: z.boolean(),
  notes: shape.notes,
});
export type DetailsValues = z.infer<typeof DetailsSchema>;

const dateOrNull = (v: unknown) => (v ? String(v) : null);

export function ProjectDetailsForm({ project, pending, onSave, onCancel }: { project: Project; pending?: boolean; onSave: (v: DetailsValues) => void; onCancel: () => void }) {
  const form = useForm<DetailsValues>({
    resolver: zodResolver(DetailsSchema),
    defaultValues: {
      title: project.title,
      recipient: project.recipient ?? '',
      startedOn: project.startedOn,
      finishedOn: project.finishedOn,
      forYoungChild: project.forYoungChild,
      notes: project.notes ?? '',
    },
  });
  const { errors } = form.formState;
  return (
    <form onSubmit={form.handleSubmit(onSave)} noValidate className="flex flex-col gap-4">
      <TextField label="Title" error={errors.title?.message} {...form.register('title')} />
      <TextField label="Who is it for?" error={errors.recipient?.message} {...form.register('recipient')} />
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Started" type="date" error={errors.startedOn?.message} {...form.register('startedOn', { setValueAs: dateOrNull })} />
        <TextField label="Finished" type="date" error={errors.finishedOn?.message} {...form.register('finishedOn', { setValueAs: dateOrNull })} />
      </div>
      <CheckboxField label="For a child under 3" {...form.register('forYoungChild')} />
      <TextAreaField label="Notes" error={errors.notes?.message} {...form.register('notes')} />
      <div className="flex flex-wrap justify-end gap-3">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" pending={pending}>
          Save changes
        </Button>
      </div>
    </form>
  );
}
