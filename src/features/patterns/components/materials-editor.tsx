import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { Plus, Trash2 } from 'lucide-react';
import { formatHook } from '@/reference/hooks';
import { categoryForPly, yarnWeightLabel, yarnWeights } from '@/reference/yarn-weights';
import { NotionKind, notionLabels } from '@/schemas/materials';
import type { CreatePatternFormValues } from '@/schemas/pattern';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';

const numberOrUndefined = (v: unknown) => (v === '' || v == null ? undefined : Number(v));
// 1 yd = 0.9144 m exactly (international yard).
const M_PER_YD = 0.9144;
const SIZED = new Set(['safety_eyes', 'buttons', 'beads']);

function Group({
  title,
  children,
  onAdd,
  addLabel,
}: {
  title: string;
  children: React.ReactNode;
  onAdd: () => void;
  addLabel: string;
}) {
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-1 text-lg font-bold">{title}</legend>
      {children}
      <div>
        <Button variant="quiet" onClick={onAdd}>
          <Plus aria-hidden className="h-5 w-5" /> {addLabel}
        </Button>
      </div>
    </fieldset>
  );
}

function RemoveButton({ label, onClick }: { label: string; onClick: () => void }) {
  return (
    <Button variant="quiet" className="text-clay" aria-label={label} title={label} onClick={onClick}>
      <Trash2 aria-hidden className="h-5 w-5" />
      <span className="sm:sr-only">Remove</span>
    </Button>
  );
}

function YarnRow({ index, onRemove }: { index: number; onRemove: () => void }) {
  const { control, register, setValue, formState } = useFormContext<CreatePatternFormValues>();
  const yarn = useWatch({ control, name: `materials.yarns.${index}` });
  const e = formState.errors.materials?.yarns?.[index];
  const plyCat = yarn?.ply ? categoryForPly(yarn.ply) : undefined;
  const m = yarn?.metersPerSkein;
  const yd = yarn?.yardsPerSkein;
  return (
    <div className="grid gap-3 rounded-soft bg-wool/40 p-3 sm:grid-cols-3 dark:bg-white/5">
      <TextField label="Yarn name" error={e?.name?.message} {...register(`materials.yarns.${index}.name`)} />
      <TextField label="Colour" {...register(`materials.yarns.${index}.colour`)} />
      <TextField
        label="Fibre"
        placeholder="cotton, acrylic…"
        {...register(`materials.yarns.${index}.fibre`)}
      />
      {/* Controlled from the form value too, so "Use this weight" shows at once in every DOM. */}
      <SelectField
        label="Weight"
        hint="Craft Yarn Council categories 0–7"
        {...register(`materials.yarns.${index}.weight`, { setValueAs: numberOrUndefined })}
        value={yarn?.weight ?? ''}
      >
        <option value="">Not given</option>
        {yarnWeights.map((w) => (
          <option key={w.category} value={w.category}>
            {yarnWeightLabel(w.category)}
          </option>
        ))}
      </SelectField>
      <div className="flex flex-col gap-1.5">
        <TextField
          label="Ply (as on the ball band)"
          placeholder="8 ply"
          {...register(`materials.yarns.${index}.ply`)}
        />
        {plyCat !== undefined ? (
          <p className="text-sm">
            <span className="font-semibold">≈ {yarnWeightLabel(plyCat)}</span>{' '}
            {yarn?.weight !== plyCat ? (
              <button
                type="button"
                className="min-h-tap font-semibold text-moss underline dark:text-[#9cc3a8]"
                onClick={() => setValue(`materials.yarns.${index}.weight`, plyCat, { shouldDirty: true })}
              >
                Use this weight
              </button>
            ) : null}
          </p>
        ) : yarn?.ply ? (
          <p className="text-sm text-ink/70 dark:text-oat/70">
            No weight category is known for “{yarn.ply}”.
          </p>
        ) : null}
      </div>
      <div className="grid grid-cols-2 gap-3">
        <TextField
          label="Meters per skein"
          type="number"
          inputMode="decimal"
          hint={m && !yd ? `≈ ${Math.round(m / M_PER_YD)} yd` : undefined}
          error={e?.metersPerSkein?.message}
          {...register(`materials.yarns.${index}.metersPerSkein`, { setValueAs: numberOrUndefined })}
        />
        <TextField
          label="Yards per skein"
          type="number"
          inputMode="decimal"
          hint={yd && !m ? `≈ ${Math.round(yd * M_PER_YD)} m` : undefined}
          error={e?.yardsPerSkein?.message}
          {...register(`materials.yarns.${index}.yardsPerSkein`, { setValueAs: numberOrUndefined })}
        />
      </div>
      <div className="sm:col-span-3 flex justify-end">
        <RemoveButton label={`Remove yarn ${yarn?.name || index + 1}`} onClick={onRemove} />
      </div>
    </div>
  );
}

function HookRow({ index, onRemove }: { index: number; onRemove: () => void }) {
  const { control, register, formState } = useFormContext<CreatePatternFormValues>();
  const mm = useWatch({ control, name: `materials.hooks.${index}.mm` });
  const e = formState.errors.materials?.hooks?.[index];
  const label = typeof mm === 'number' && mm >= 0.5 && mm <= 35 ? formatHook(mm) : undefined;
  return (
    <div className="grid items-start gap-3 sm:grid-cols-[1fr_2fr_auto]">
      <TextField
        label="Hook (mm)"
        type="number"
        inputMode="decimal"
        step="0.05"
        hint={label}
        error={e?.mm?.message}
        {...register(`materials.hooks.${index}.mm`, {
          setValueAs: (v) => (v === '' ? Number.NaN : Number(v)),
        })}
      />
      <TextField
        label="What it is for"
        placeholder="body, small details…"
        {...register(`materials.hooks.${index}.note`)}
      />
      <div className="sm:pt-8">
        <RemoveButton label={`Remove hook ${label ?? index + 1}`} onClick={onRemove} />
      </div>
    </div>
  );
}

function NotionRow({ index, onRemove }: { index: number; onRemove: () => void }) {
  const { control, register, formState } = useFormContext<CreatePatternFormValues>();
  const kind = useWatch({ control, name: `materials.notions.${index}.kind` });
  const e = formState.errors.materials?.notions?.[index];
  return (
    <div className="grid items-start gap-3 sm:grid-cols-[1.3fr_1fr_1fr_1.5fr_auto]">
      <SelectField label="Notion" {...register(`materials.notions.${index}.kind`)}>
        {NotionKind.options.map((k) => (
          <option key={k} value={k}>
            {notionLabels[k]}
          </option>
        ))}
      </SelectField>
      {SIZED.has(kind ?? '') ? (
        <TextField
          label="Size (mm)"
          type="number"
          inputMode="decimal"
          error={e?.sizeMm?.message}
          {...register(`materials.notions.${index}.sizeMm`, { setValueAs: numberOrUndefined })}
        />
      ) : (
        <div className="hidden sm:block" />
      )}
      <TextField
        label="How many"
        type="number"
        inputMode="numeric"
        error={e?.quantity?.message}
        {...register(`materials.notions.${index}.quantity`, { setValueAs: numberOrUndefined })}
      />
      <TextField label="Note" {...register(`materials.notions.${index}.note`)} />
      <div className="sm:pt-8">
        <RemoveButton label={`Remove ${notionLabels[kind as NotionKind] ?? 'notion'}`} onClick={onRemove} />
      </div>
    </div>
  );
}

/** Materials: the yarns, hooks and notions the pattern asks for. */
export function MaterialsEditor() {
  const { control } = useFormContext<CreatePatternFormValues>();
  const yarns = useFieldArray({ control, name: 'materials.yarns' });
  const hooks = useFieldArray({ control, name: 'materials.hooks' });
  const notions = useFieldArray({ control, name: 'materials.notions' });
  return (
    <div className="flex flex-col gap-6">
      <Group title="Yarns" addLabel="Add a yarn" onAdd={() => yarns.append({ name: '' })}>
        {yarns.fields.map((f, i) => (
          <YarnRow key={f.id} index={i} onRemove={() => yarns.remove(i)} />
        ))}
      </Group>
      <Group title="Hooks" addLabel="Add a hook" onAdd={() => hooks.append({ mm: Number.NaN })}>
        {hooks.fields.map((f, i) => (
          <HookRow key={f.id} index={i} onRemove={() => hooks.remove(i)} />
        ))}
      </Group>
      <Group title="Notions" addLabel="Add a notion" onAdd={() => notions.append({ kind: 'stuffing' })}>
        {notions.fields.map((f, i) => (
          <NotionRow key={f.id} index={i} onRemove={() => notions.remove(i)} />
        ))}
      </Group>
      <p className="text-xs text-ink/70 dark:text-oat/70">
        Weight categories: Craft Yarn Council&apos;s www.YarnStandards.com. Ply names are a convention, not a
        standard, so they are shown with ≈.
      </p>
    </div>
  );
}
