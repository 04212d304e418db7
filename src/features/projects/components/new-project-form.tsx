import { useFieldArray, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { BookOpen, Plus, Trash2 } from 'lucide-react';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { CheckboxField, SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { ApiError } from '@/lib/api-client';
import { formatHook } from '@/reference/hooks';
import { cautionsFor } from '@/reference/safety';
import { NewProjectFormSchema, type NewProjectFormValues } from '@/schemas/project';
import type { Pattern, Project } from '@/types/api';
import { useCreateProject } from '../api/create-project';
import { Cautions } from './cautions';
import { NotionFields } from './notion-fields';

const hookOrNull = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));

/**
 * Start a project: from a pattern (its pieces are copied in by the server, shown here as a preview), or from
 * scratch with pieces typed in. Cautions appear as soon as the choices call for them.
 */
export function NewProjectForm({ pattern, onCreated }: { pattern?: Pattern; onCreated: (project: Project) => void }) {
  const create = useCreateProject();
  const form = useForm<NewProjectFormValues>({
    resolver: zodResolver(NewProjectFormSchema),
    defaultValues: {
      title: pattern?.title ?? '',
      recipient: '',
      forYoungChild: false,
      status: 'on_the_hook',
      pieces: pattern ? [] : [{ name: '', instructions: '', copies: 1, hookMm: null }],
      notions: pattern?.materials.notions ?? [],
      notes: '',
    },
  });
  const { errors } = form.formState;
  const pieces = useFieldArray({ control: form.control, name: 'pieces' });
  const [forYoungChild, notions] = useWatch({ control: form.control, name: ['forYoungChild', 'notions'] });
  const cautions = cautionsFor({ forYoungChild, notions: (notions ?? []).filter((n) => n?.kind) });

  const onSubmit = form.handleSubmit((v) =>
    create.mutate(
      {
        title: v.title,
        ...(pattern ? { patternId: pattern.id } : { pieces: v.pieces }),
        forYoungChild: v.forYoungChild,
        notions: v.notions,
        status: v.status,
        recipient: v.recipient || null,
        notes: v.notes || null,
      },
      {
        onSuccess: onCreated,
        onError: (err) => {
          // Put the server's words next to the field they belong to.
          if (err instanceof ApiError) for (const i of err.issues) if (i.path) form.setError(i.path as never, { message: i.message });
        },
      },
    ),
  );

  return (
    <form onSubmit={onSubmit} noValidate className="flex flex-col gap-5">
      {create.error ? (
        <Banner tone="warning" title="The project was not started">
          {create.error.message}
        </Banner>
      ) : null}

      <TextField label="Title" autoComplete="off" error={errors.title?.message} {...form.register('title')} />
      <TextField label="Who is it for?" hint="Optional: a name, or “me”." autoComplete="off" error={errors.recipient?.message} {...form.register('recipient')} />
      <SelectField label="Status" {...form.register('status')}>
        <option value="on_the_hook">On the hook — starting now</option>
        <option value="planned">Planned — starting later</option>
      </SelectField>

      {pattern ? (
        <section aria-labelledby="pieces-from-pattern">
          <h2 id="pieces-from-pattern" className="mb-2 flex items-center gap-2 text-lg font-bold">
            <BookOpen aria-hidden className="h-5 w-5 text-moss" /> Pieces from “{pattern.title}”
          </h2>
          <p className="mb-3 text-sm text-ink/70 dark:text-oat/70">
            The project keeps its own copy of these, so later changes to the pattern never move your counts.
          </p>
          <ul className="flex flex-col gap-2">
            {pattern.pieces.map((p) => (
              <li key={p.id} className="flex flex-wrap items-baseline justify-between gap-x-3 rounded-soft bg-wool/50 px-4 py-3 dark:bg-white/5">
                <span className="font-semibold">
                  {p.name}
                  {p.copies > 1 ? <span className="font-normal"> · make {p.copies}</span> : null}
                </span>
                <span className="text-sm tabular">
                  {p.check.rounds.length} {p.check.rounds.length === 1 ? 'round' : 'rounds'}
                  {p.hookMm ? ` · ${formatHook(p.hookMm)}` : ''}
                </span>
              </li>
            ))}
          </ul>
        </section>
      ) : (
        <section aria-labelledby="pieces-typed">
          <h2 id="pieces-typed" className="mb-2 text-lg font-bold">
            Pieces
          </h2>
          <p className="mb-3 text-sm text-ink/70 dark:text-oat/70">Type or paste each piece’s rounds, one per line, e.g. “Rnd 2: inc x6 (12)”.</p>
          {errors.pieces?.message ? <p className="mb-2 text-sm font-semibold text-clay">⚠ {errors.pieces.message}</p> : null}
          <ul className="flex flex-col gap-4">
            {pieces.fields.map((f, i) => (
              <li key={f.id}>
                <Card className="flex flex-col gap-3 p-4">
                  <div className="grid grid-cols-2 gap-3 sm:grid-cols-[2fr_1fr_1fr]">
                    <TextField label="Piece name" className="col-span-2 sm:col-span-1" placeholder="Body" error={errors.pieces?.[i]?.name?.message} {...form.register(`pieces.${i}.name`)} />
                    <TextField label="How many" inputMode="numeric" error={errors.pieces?.[i]?.copies?.message} {...form.register(`pieces.${i}.copies`)} />
                    <TextField
                      label="Hook (mm)"
                      inputMode="decimal"
                      error={errors.pieces?.[i]?.hookMm?.message}
                      {...form.register(`pieces.${i}.hookMm`, { setValueAs: hookOrNull })}
                    />
                  </div>
                  <TextAreaField
                    label="Instructions"
                    className="font-normal"
                    spellCheck={false}
                    placeholder={'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)'}
                    error={errors.pieces?.[i]?.instructions?.message}
                    {...form.register(`pieces.${i}.instructions`)}
                  />
                  <div className="flex justify-end">
                    <Button variant="quiet" onClick={() => pieces.remove(i)}>
                      <Trash2 aria-hidden className="h-5 w-5" /> Remove this piece
                    </Button>
                  </div>
                </Card>
              </li>
            ))}
          </ul>
          <Button variant="secondary" className="mt-3" onClick={() => pieces.append({ name: '', instructions: '', copies: 1, hookMm: null })}>
            <Plus aria-hidden className="h-5 w-5" /> Add a piece
          </Button>
        </section>
      )}

      <NotionFields control={form.control} register={form.register} errors={errors} />

      <div className="rounded-soft bg-wool/40 px-4 py-2 dark:bg-white/5">
        <CheckboxField label="For a child under 3" {...form.register('forYoungChild')} />
        <p className="pb-2 text-sm text-ink/70 dark:text-oat/70">Whorlbook then reminds you to embroider features instead of using small parts.</p>
      </div>

      <Cautions cautions={cautions} />

      <TextAreaField label="Notes" hint="Optional: yarn substitutions, changes you plan…" error={errors.notes?.message} {...form.register('notes')} />

      <Button type="submit" size="lg" pending={create.isPending}>
        Start the project
      </Button>
    </form>
  );
}
