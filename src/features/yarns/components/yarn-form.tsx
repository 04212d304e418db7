import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { NotSavedBanner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { SelectField, TextAreaField, TextField } from '@/components/ui/field';
import { categoryForPly, yarnWeightLabel } from '@/reference/yarn-weights';
import { ShelfYarnInputSchema, type ShelfYarnInput } from '@/schemas/yarn';
import type { ShelfYarn } from '@/types/api';

const num = (v: unknown) => (v === '' || v === null || v === undefined ? null : Number(v));
const text = (v: unknown) => (typeof v === 'string' && v.trim() ? v : null);
// 1 yd = 0.9144 m exactly (international yard).
const M_PER_YD = 0.9144;

/** Add or change a shelf yarn. The ply, when it is a known ply name, suggests its weight category. */
export function YarnForm({
  yarn,
  pending,
  error,
  onSave,
  onCancel,
}: {
  yarn?: ShelfYarn;
  pending?: boolean;
  error?: Error | null;
  onSave: (v: ShelfYarnInput) => void;
  onCancel: () => void;
}) {
  const form = useForm<ShelfYarnInput>({
    resolver: zodResolver(ShelfYarnInputSchema) as never,
    defaultValues: {
      name: yarn?.name ?? '',
      colour: yarn?.colour ?? null,
      fibre: yarn?.fibre ?? null,
      weight: yarn?.weight ?? null,
      ply: yarn?.ply ?? null,
      metersPerSkein: yarn?.metersPerSkein ?? null,
      yardsPerSkein: yarn?.yardsPerSkein ?? null,
      skeinsOwned: yarn?.skeinsOwned ?? 1,
      notes: yarn?.notes ?? null,
    },
  });
  const { errors } = form.formState;
  const [ply, weight, meters, yards] = useWatch({ control: form.control, name: ['ply', 'weight', 'metersPerSkein', 'yardsPerSkein'] });
  const plyCategory = ply ? categoryForPly(ply) : undefined;

  return (
    <form onSubmit={form.handleSubmit(onSave)} noValidate className="flex flex-col gap-4">
      <NotSavedBanner error={error ?? null} />
      <TextField label="Name" placeholder="Plum cotton" error={errors.name?.message} {...form.register('name')} />
      <div className="grid grid-cols-2 gap-3">
        <TextField label="Colour" error={errors.colour?.message} {...form.register('colour', { setValueAs: text })} />
        <TextField label="Fibre" placeholder="cotton" error={errors.fibre?.message} {...form.register('fibre', { setValueAs: text })} />
        <TextField
          label="Ply"
          placeholder="8 ply"
          hint={plyCategory != null ? `≈ ${yarnWeightLabel(plyCategory)}` : undefined}
          error={errors.ply?.message}
          {...form.register('ply', { setValueAs: text })}
        />
        <SelectField label="Weight" error={errors.weight?.message} {...form.register('weight', { setValueAs: num })}>
          <option value="">Not sure</option>
          {[0, 1, 2, 3, 4, 5, 6, 7].map((w) => (
            <option key={w} value={w}>
              {yarnWeightLabel(w)}
            </option>
          ))}
        </SelectField>
        <TextField
          label="Meters per skein"
          inputMode="decimal"
          hint={!meters && yards ? `≈ ${Math.round(Number(yards) * M_PER_YD)} m` : undefined}
          error={errors.metersPerSkein?.message}
          {...form.register('metersPerSkein', { setValueAs: num })}
        />
        <TextField
          label="Yards per skein"
          inputMode="decimal"
          hint={!yards && meters ? `≈ ${Math.round(Number(meters) / M_PER_YD)} yd` : undefined}
          error={errors.yardsPerSkein?.message}
          {...form.register('yardsPerSkein', { setValueAs: num })}
        />
        <TextField label="Skeins owned" inputMode="decimal" error={errors.skeinsOwned?.message} {...form.register('skeinsOwned', { setValueAs: (v) => (v === '' ? undefined : Number(v)) })} />
      </div>
      {plyCategory != null && weight == null ? (
        <Button variant="quiet" className="self-start" onClick={() => form.setValue('weight', plyCategory)}>
          Use {yarnWeightLabel(plyCategory)} for the weight
        </Button>
      ) : null}
      <TextAreaField label="Notes" error={errors.notes?.message} {...form.register('notes', { setValueAs: text })} />
      <p className="text-xs text-ink/60 dark:text-oat/60">Weight categories: Source: Craft Yarn Council's www.YarnStandards.com. Ply names are a convention and map only roughly.</p>
      <div className="flex flex-wrap justify-end gap-3">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" pending={pending}>
          {yarn ? 'Save the yarn' : 'Add to the shelf'}
        </Button>
      </div>
    </form>
  );
}
