import { useFormContext, useWatch } from 'react-hook-form';
import { formatHook } from '@/reference/hooks';
import type { CreatePatternFormValues } from '@/schemas/pattern';
import { CheckboxField, SelectField, TextField } from '@/components/ui/field';

const numberOrUndefined = (v: unknown) => (v === '' || v == null ? undefined : Number(v));

/** Gauge: stitches and rows over 10 cm or 4 in, in a named stitch with a named hook. */
export function GaugeFields() {
  const { control, register, setValue, formState } = useFormContext<CreatePatternFormValues>();
  const gauge = useWatch({ control, name: 'gauge' });
  const e = formState.errors.gauge;
  const hookMm = gauge?.hookMm;
  return (
    <div className="flex flex-col gap-4">
      <CheckboxField
        label="This pattern gives a gauge"
        checked={Boolean(gauge)}
        onChange={(ev) =>
          setValue(
            'gauge',
            ev.target.checked ? { stitches: Number.NaN, rows: Number.NaN, over: '10cm', stitch: 'sc' } : null,
            { shouldDirty: true },
          )
        }
      />
      {gauge ? (
        <div className="grid gap-4 sm:grid-cols-2 lg:grid-cols-5">
          <TextField
            label="Stitches"
            type="number"
            inputMode="decimal"
            step="0.5"
            min={0}
            error={e?.stitches?.message}
            {...register('gauge.stitches', { setValueAs: (v) => (v === '' ? Number.NaN : Number(v)) })}
          />
          <TextField
            label="Rows"
            type="number"
            inputMode="decimal"
            step="0.5"
            min={0}
            error={e?.rows?.message}
            {...register('gauge.rows', { setValueAs: (v) => (v === '' ? Number.NaN : Number(v)) })}
          />
          <SelectField label="Over" error={e?.over?.message} {...register('gauge.over')}>
            <option value="10cm">10 cm</option>
            <option value="4in">4 in</option>
          </SelectField>
          <TextField
            label="In stitch"
            placeholder="sc"
            error={e?.stitch?.message}
            {...register('gauge.stitch')}
          />
          <TextField
            label="With hook (mm)"
            type="number"
            inputMode="decimal"
            step="0.05"
            error={e?.hookMm?.message}
            hint={
              typeof hookMm === 'number' && hookMm >= 0.5 && hookMm <= 35 ? formatHook(hookMm) : undefined
            }
            {...register('gauge.hookMm', { setValueAs: numberOrUndefined })}
          />
        </div>
      ) : (
        <p className="text-sm text-ink/70 dark:text-oat/70">
          Without a gauge, the silhouette uses a typical single crochet gauge for the yarn weight.
        </p>
      )}
    </div>
  );
}
