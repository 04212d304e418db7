import { Controller, useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { NotSavedBanner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { SelectField, TextField } from '@/components/ui/field';
import { formatHook, usHookSize } from '@/reference/hooks';
import { HookInputSchema, HookMaterialSchema, hookMaterialLabels, type HookRollInput } from '@/schemas/hooks';
import type { RollHook } from '@/types/hooks';

// Empty inputs are "not given" (null), so the zod schema can tell a blank from a typo.
const num = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(String(v).replace(',', '.')));
const text = (v: unknown) => (typeof v === 'string' && v.trim() ? v : null);

function SizeHint({ mm }: { mm: unknown }) {
  const n = typeof mm === 'number' ? mm : Number(mm);
  if (!Number.isFinite(n) || n < 0.5 || n > 35) return <>In millimetres, as printed on the hook.</>;
  const us = usHookSize(n);
  return us ? <>Shown as {formatHook(n)}.</> : <>No US size on the chart: shown as {formatHook(n)} only.</>;
}

/** Add or change a hook in the roll. The US size is looked up from the chart as the size is typed. */
export function HookForm({
  hook,
  startMm,
  pending,
  error,
  onSave,
  onCancel,
}: {
  hook?: RollHook;
  /** A size to start from, e.g. the one a project piece needs. */
  startMm?: number;
  pending?: boolean;
  error?: Error | null;
  onSave: (v: HookRollInput) => void;
  onCancel: () => void;
}) {
  const form = useForm<HookRollInput>({
    resolver: zodResolver(HookInputSchema) as never,
    defaultValues: {
      mm: hook?.mm ?? startMm,
      material: hook?.material ?? null,
      brand: hook?.brand ?? null,
      note: hook?.note ?? null,
      quantity: hook?.quantity ?? 1,
    },
  });
  const { errors } = form.formState;
  const mm = useWatch({ control: form.control, name: 'mm' });

  return (
    <form onSubmit={form.handleSubmit(onSave)} noValidate className="flex flex-col gap-4">
      <NotSavedBanner error={error ?? null} />
      <div className="grid grid-cols-[3fr_2fr] gap-3">
        <TextField label="Size (mm)" inputMode="decimal" placeholder="3.5" autoFocus={!hook} hint={<SizeHint mm={mm} />} error={errors.mm?.message} {...form.register('mm', { setValueAs: num })} />
        <TextField label="How many" inputMode="numeric" error={errors.quantity?.message} {...form.register('quantity', { setValueAs: num })} />
      </div>
      {/* Controlled, so a stored material shows when the form opens (an uncontrolled select can miss its start value). */}
      <Controller
        control={form.control}
        name="material"
        render={({ field }) => (
          <SelectField
            label="Material"
            error={errors.material?.message}
            ref={field.ref}
            name={field.name}
            value={field.value ?? ''}
            onBlur={field.onBlur}
            onChange={(e) => field.onChange(e.target.value || null)}
          >
            <option value="">Not sure</option>
            {HookMaterialSchema.options.map((m) => (
              <option key={m} value={m}>
                {hookMaterialLabels[m]}
              </option>
            ))}
          </SelectField>
        )}
      />
      <TextField label="Brand" placeholder="optional" error={errors.brand?.message} {...form.register('brand', { setValueAs: text })} />
      <TextField label="Note" placeholder="e.g. lives in the blue pouch" error={errors.note?.message} {...form.register('note', { setValueAs: text })} />
      <p className="text-xs text-ink/60 dark:text-oat/60">US sizes: Craft Yarn Council hook chart. Letters vary between makers, so Whorlbook matches hooks by mm.</p>
      <div className="flex flex-wrap justify-end gap-3">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" pending={pending}>
          {hook ? 'Save the hook' : 'Add to the roll'}
        </Button>
      </div>
    </form>
  );
}
