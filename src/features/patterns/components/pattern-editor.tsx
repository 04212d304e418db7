import { useState } from 'react';
import { FormProvider, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { CheckCircle2, Globe, Lock, Save, Users } from 'lucide-react';
import { useLeaveGuard } from '@/hooks/use-leave-guard';
import { cautionsFor } from '@/reference/safety';
import {
  CreatePatternSchema,
  patternVisibilityLabels,
  type CreatePatternFormValues,
  type CreatePatternInput,
} from '@/schemas/pattern';
import type { Pattern } from '@/types/api';
import { ApiError } from '@/lib/api-client';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { cn } from '@/utils/cn';
import { GaugeFields } from './gauge-fields';
import { MaterialsEditor } from './materials-editor';
import { blankPiece, PiecesEditor } from './pieces-editor';

export function toFormValues(p?: Pattern): CreatePatternFormValues {
  if (!p) {
    return {
      title: '',
      terms: 'us',
      designerCredit: '',
      sourceUrl: '',
      gauge: null,
      skillNotes: '',
      pieces: [blankPiece()],
      materials: { yarns: [], hooks: [], notions: [] },
      visibility: 'private',
    };
  }
  return {
    title: p.title,
    terms: p.terms,
    designerCredit: p.designerCredit ?? '',
    sourceUrl: p.sourceUrl ?? '',
    gauge: p.gauge,
    skillNotes: p.skillNotes ?? '',
    pieces: p.pieces.map((x) => ({
      id: x.id,
      name: x.name,
      copies: x.copies,
      hookMm: x.hookMm,
      instructions: x.instructions,
      yarns: x.yarns,
    })),
    materials: p.materials,
    visibility: p.visibility,
  };
}

const visibilityLook = {
  private: { icon: <Lock aria-hidden className="h-5 w-5" />, text: 'Only you can see it.' },
  testers: {
    icon: <Users aria-hidden className="h-5 w-5" />,
    text: 'For the testers you invite (inviting testers comes later; until then it stays as private).',
  },
  public: {
    icon: <Globe aria-hidden className="h-5 w-5" />,
    text: 'Any signed-in member can read it and start a project from it. Only you can change it.',
  },
} as const;

function Section({ title, children, id }: { title: string; children: React.ReactNode; id?: string }) {
  return (
    <Card className="flex flex-col gap-4" id={id}>
      <h2 className="text-xl font-bold">{title}</h2>
      {children}
    </Card>
  );
}

function SafetyCautions() {
  const notions = useWatch<CreatePatternFormValues, 'materials.notions'>({ name: 'materials.notions' }) ?? [];
  const cautions = cautionsFor({ notions: notions.filter(Boolean) });
  return cautions.map((c) => (
    <Banner key={c.code} tone="caution" title={c.title}>
      {c.message}
    </Banner>
  ));
}

/**
 * The pattern editor: one form with the same zod schema the server uses. Saving sends the whole pattern;
 * piece ids travel with the pieces so they stay the same.
 */
export function PatternEditor({
  pattern,
  onSave,
  onSaved,
  saving,
  saveError,
  footer,
}: {
  pattern?: Pattern;
  onSave: (values: CreatePatternInput) => Promise<Pattern>;
  /** Called after the form has taken the saved values, e.g. to go to the new pattern's address. */
  onSaved?: (pattern: Pattern) => void;
  saving: boolean;
  saveError: Error | null;
  footer?: React.ReactNode;
}) {
  const form = useForm<CreatePatternFormValues, unknown, CreatePatternInput>({
    resolver: zodResolver(CreatePatternSchema),
    defaultValues: toFormValues(pattern),
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const { register, formState, handleSubmit, reset } = form;
  const { errors, isDirty } = formState;
  const [justSaved, setJustSaved] = useState(false);
  const { leaving, dialog: leaveDialog } = useLeaveGuard(isDirty, 'Your changes to this pattern are not saved yet.');

  const submit = handleSubmit(async (values) => {
    try {
      leaving.current = true;
      const saved = await onSave(values);
      reset(toFormValues(saved));
      setJustSaved(true);
      onSaved?.(saved);
    } catch {
      // The banner shows the server's sentence.
    } finally {
      leaving.current = false;
    }
  });

  const visibility = useWatch({ control: form.control, name: 'visibility' }) ?? 'private';
  const issues = saveError instanceof ApiError ? saveError.issues : [];

  return (
    <FormProvider {...form}>
      <form
        onSubmit={submit}
        noValidate
        className="flex flex-col gap-5"
        aria-label={pattern ? `Edit ${pattern.title}` : 'New pattern'}
      >
        {saveError ? (
          <Banner tone="warning" title="Not saved yet">
            <p>{saveError.message}</p>
            {issues.length > 1 ? (
              <ul className="mt-1 list-disc pl-5">
                {issues.slice(0, 6).map((i) => (
                  <li key={`${i.path}${i.message}`}>
                    {i.path ? `${i.path}: ` : ''}
                    {i.message}
                  </li>
                ))}
              </ul>
            ) : null}
          </Banner>
        ) : null}

        <Section title="About the pattern">
          <TextField label="Title" error={errors.title?.message} {...register('title')} />
          <div className="grid gap-4 sm:grid-cols-2">
            <TextField
              label="Designer credit"
              placeholder="Who wrote it"
              error={errors.designerCredit?.message}
              {...register('designerCredit')}
            />
            <TextField
              label="Source link"
              type="url"
              inputMode="url"
              placeholder="https://…"
              error={errors.sourceUrl?.message}
              {...register('sourceUrl')}
            />
          </div>
          <SelectField
            label="Written in"
            hint="The terms the instructions are typed in. You can read them in the other terms beside each piece."
            error={errors.terms?.message}
            {...register('terms')}
          >
            <option value="us">US terms (sc, hdc, dc)</option>
            <option value="uk">UK terms (dc, htr, tr)</option>
          </SelectField>
          <TextAreaField
            label="Skill notes"
            placeholder="Easy. Worked in continuous spiral rounds…"
            rows={3}
            error={errors.skillNotes?.message}
            {...register('skillNotes')}
          />
        </Section>

        <Section title="Pieces">
          <PiecesEditor />
        </Section>

        <Section title="Gauge">
          <GaugeFields />
        </Section>

        <Section title="Materials">
          <MaterialsEditor />
          <SafetyCautions />
        </Section>

        <Section title="Who can see it">
          <fieldset className="flex flex-col gap-2">
            <legend className="sr-only">Who can see this pattern</legend>
            {(['private', 'testers', 'public'] as const).map((v) => (
              <label
                key={v}
                className="flex min-h-tap cursor-pointer items-start gap-3 rounded-soft p-2 hover:bg-wool/50 dark:hover:bg-white/5"
              >
                <input
                  type="radio"
                  value={v}
                  className="mt-1 h-6 w-6 accent-moss"
                  {...register('visibility')}
                />
                <span className="flex flex-col">
                  <span className="flex items-center gap-2 font-semibold">
                    {visibilityLook[v].icon} {patternVisibilityLabels[v]}
                  </span>
                  <span className="text-sm text-ink/70 dark:text-oat/70">{visibilityLook[v].text}</span>
                </span>
              </label>
            ))}
          </fieldset>
          <p className="sr-only" aria-live="polite">
            Visibility: {patternVisibilityLabels[visibility]}
          </p>
        </Section>

        {footer}

        {/* The bar follows the page only while there is something to save, so reading the pattern keeps the whole screen. */}
        <div
          className={cn(
            'z-10 flex flex-wrap items-center gap-3 rounded-blob p-2 sm:p-3',
            isDirty &&
              'sticky bottom-24 bg-oat/95 shadow-lg ring-1 ring-wool backdrop-blur sm:bottom-4 dark:bg-ink/95 dark:ring-[#4a423c]',
          )}
        >
          <Button type="submit" pending={saving}>
            <Save aria-hidden className="h-5 w-5" /> {pattern ? 'Save changes' : 'Save pattern'}
          </Button>
          <p className="text-sm" aria-live="polite">
            {isDirty ? (
              <span className="font-semibold">Unsaved changes</span>
            ) : justSaved || pattern ? (
              <span className="inline-flex items-center gap-1">
                <CheckCircle2 aria-hidden className="h-4 w-4 text-moss" />{' '}
                {justSaved ? 'Saved' : 'No changes'}
              </span>
            ) : null}
          </p>
        </div>
      </form>

      {leaveDialog}
    </FormProvider>
  );
}
