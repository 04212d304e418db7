import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Button } from '@/components/ui/button';
import { TextAreaField, TextField } from '@/components/ui/field';
import { PlacementFormSchema, type PlacementFormValues } from '@/schemas/progress';
import { Sheet } from './sheet';

/** "Mark here": what was placed at this round and stitch, so the next copy can match it. */
export function MarkSheet({
  open,
  onClose,
  where,
  suggestions,
  onSave,
}: {
  open: boolean;
  onClose: () => void;
  /** "Rnd 9, stitch 15 (copy 1)". */
  where: string;
  suggestions: string[];
  onSave: (values: { label: string; note: string }) => void;
}) {
  const form = useForm<PlacementFormValues>({
    resolver: zodResolver(PlacementFormSchema),
    defaultValues: { label: '', note: '' },
  });
  const close = () => {
    form.reset();
    onClose();
  };
  return (
    <Sheet open={open} onClose={close} title="Mark here">
      <form
        noValidate
        className="flex flex-col gap-5"
        onSubmit={form.handleSubmit((v) => {
          onSave({ label: v.label.trim(), note: (v.note ?? '').trim() });
          close();
        })}
      >
        <p className="text-lg">
          At <span className="font-bold">{where}</span>
        </p>
        <TextField
          label="What went here"
          placeholder="left eye, arm, mouth…"
          autoComplete="off"
          error={form.formState.errors.label?.message}
          {...form.register('label')}
        />
        {suggestions.length ? (
          <div className="flex flex-wrap gap-2" aria-label="Suggestions">
            {suggestions.map((s) => (
              <button
                key={s}
                type="button"
                onClick={() => form.setValue('label', s, { shouldValidate: true })}
                className="min-h-tap rounded-full border-2 border-wool bg-white px-4 text-base font-semibold text-ink hover:border-moss dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat"
              >
                {s}
              </button>
            ))}
          </div>
        ) : null}
        <TextAreaField
          label="Note (optional)"
          placeholder="6 sts apart, a little below the middle…"
          error={form.formState.errors.note?.message}
          {...form.register('note')}
        />
        <Button type="submit" size="lg">
          Save the mark
        </Button>
      </form>
    </Sheet>
  );
}
