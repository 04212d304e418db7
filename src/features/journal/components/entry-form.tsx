import { useId, useState } from 'react';
import { Controller, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { Button } from '@/components/ui/button';
import { CheckboxField, SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { CreateEntrySchema, ENTRY_MINUTES_MAX } from '@/schemas/journal';
import type { JournalEntry } from '@/types/api';
import { PhotoPicker } from './photo-picker';
import { TagToggles } from './tag-chips';

type Input = z.input<typeof CreateEntrySchema>;
export type EntryValues = z.output<typeof CreateEntrySchema>;

export interface PieceOption {
  id: number;
  name: string;
}

/** Today on the maker's own calendar (not UTC): an entry written at 11 pm belongs to today. */
export function localToday(now = new Date()) {
  const p = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${p(now.getMonth() + 1)}-${p(now.getDate())}`;
}

const numberOrNull = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

export function EntryForm({
  pieces,
  entry,
  defaultMinutes,
  defaultPieceId,
  pending,
  onSubmit,
  onCancel,
}: {
  pieces: PieceOption[];
  /** Editing this entry; otherwise a new one. */
  entry?: JournalEntry;
  /** Working time from the Tally, when the page knows it. */
  defaultMinutes?: number | null;
  defaultPieceId?: number | null;
  pending?: boolean;
  onSubmit: (values: EntryValues, files: File[]) => void;
  onCancel: () => void;
}) {
  const tagsLabel = useId();
  const [files, setFiles] = useState<File[]>([]);
  const {
    register,
    control,
    handleSubmit,
    formState: { errors },
  } = useForm<Input, unknown, EntryValues>({
    resolver: zodResolver(CreateEntrySchema),
    defaultValues: entry
      ? { body: entry.body, entryDate: entry.entryDate, minutes: entry.minutes, pieceId: entry.pieceId, tags: entry.tags, onShowcase: entry.onShowcase }
      : { body: '', entryDate: localToday(), minutes: defaultMinutes ?? null, pieceId: defaultPieceId ?? null, tags: [], onShowcase: false },
  });

  return (
    <form noValidate onSubmit={handleSubmit((values) => onSubmit(values, files))} className="flex flex-col gap-4" aria-label={entry ? 'Edit the entry' : 'New journal entry'}>
      <TextAreaField
        label="What did you do?"
        hint="Markdown works: **bold**, *italic*, and lists starting with a dash."
        error={errors.body?.message}
        rows={4}
        {...register('body')}
      />
      <div className="grid gap-4 sm:grid-cols-2">
        <TextField label="Day" type="date" max={localToday()} error={errors.entryDate?.message} {...register('entryDate')} />
        <TextField
          label="Working time (minutes)"
          type="number"
          inputMode="numeric"
          min={0}
          max={ENTRY_MINUTES_MAX}
          step={1}
          hint={!entry && defaultMinutes ? 'Filled in from your counting on the Tally.' : undefined}
          error={errors.minutes?.message}
          {...register('minutes', { setValueAs: numberOrNull })}
        />
      </div>
      {pieces.length ? (
        <Controller
          control={control}
          name="pieceId"
          render={({ field }) => (
            // Controlled: the select holds strings, the schema wants a piece id or null.
            <SelectField
              label="Piece"
              error={errors.pieceId?.message}
              ref={field.ref}
              name={field.name}
              onBlur={field.onBlur}
              value={field.value == null ? '' : String(field.value)}
              onChange={(e) => field.onChange(numberOrNull(e.target.value))}
            >
              <option value="">The whole project</option>
              {pieces.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name}
                </option>
              ))}
            </SelectField>
          )}
        />
      ) : null}
      <div className="flex flex-col gap-1.5">
        <p id={tagsLabel} className="font-semibold">
          What kind of note?
        </p>
        <Controller control={control} name="tags" render={({ field }) => <TagToggles labelId={tagsLabel} value={field.value ?? []} onChange={field.onChange} />} />
        <p className="text-sm text-ink/70 dark:text-oat/70">“Change from the pattern” entries are listed as your modifications when you share the project.</p>
      </div>
      <CheckboxField label="Show this entry when I share the project" {...register('onShowcase')} />
      <div className="flex flex-col gap-1.5">
        <p className="font-semibold">{entry ? 'Add photos' : 'Photos'}</p>
        <PhotoPicker files={files} onChange={setFiles} disabled={pending} />
      </div>
      <div className="flex flex-wrap justify-end gap-3">
        <Button variant="secondary" onClick={onCancel} disabled={pending}>
          Cancel
        </Button>
        <Button type="submit" pending={pending}>
          {entry ? 'Save changes' : 'Save entry'}
        </Button>
      </div>
    </form>
  );
}
