import { useFieldArray, type ArrayPath, type Control, type FieldErrors, type FieldValues, type Path, type UseFormRegister } from 'react-hook-form';
import { Plus, X } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { cn } from '@/utils/cn';
import { NotionKind, notionLabels } from '@/schemas/materials';

// The same look as the shared fields, for the compact notion rows.
const controlClass =
  'min-h-tap rounded-soft border-2 border-wool bg-white px-3 py-2.5 text-base text-ink focus:border-moss focus:outline-none dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat aria-[invalid=true]:border-clay';

const numberOrUndefined = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v));

/** Notions as editable rows (kind, size, how many). Used by the new-project form and the materials editor. */
export function NotionFields<T extends FieldValues>({
  control,
  register,
  errors,
  name = 'notions' as ArrayPath<T>,
}: {
  control: Control<T>;
  register: UseFormRegister<T>;
  errors?: FieldErrors<T>;
  name?: ArrayPath<T>;
}) {
  const { fields, append, remove } = useFieldArray({ control, name });
  const at = (i: number, key: string) => `${name}.${i}.${key}` as Path<T>;
  const errorAt = (i: number, key: string) => {
    const list = String(name).split('.').reduce<any>((acc, k) => acc?.[k], errors);
    return list?.[i]?.[key]?.message as string | undefined;
  };
  return (
    <fieldset className="flex flex-col gap-3">
      <legend className="mb-1 font-semibold">Notions</legend>
      {fields.length === 0 ? <p className="text-sm text-ink/70 dark:text-oat/70">No notions yet: add safety eyes, stuffing, markers…</p> : null}
      <ul className="flex flex-col gap-3">
        {fields.map((f, i) => {
          const sizeError = errorAt(i, 'sizeMm');
          const qtyError = errorAt(i, 'quantity');
          return (
            <li key={f.id} className="flex flex-col gap-2 rounded-soft bg-wool/40 p-2 sm:flex-row sm:items-center dark:bg-white/5">
              <div className="flex flex-1 items-center gap-1">
                <select aria-label={`Notion ${i + 1}`} className={cn(controlClass, 'flex-1')} {...register(at(i, 'kind'))}>
                  {NotionKind.options.map((k) => (
                    <option key={k} value={k}>
                      {notionLabels[k]}
                    </option>
                  ))}
                </select>
                <Button variant="quiet" aria-label={`Remove notion ${i + 1}`} onClick={() => remove(i)} className="px-2 sm:order-last">
                  <X aria-hidden className="h-5 w-5" />
                </Button>
              </div>
              <div className="flex items-center gap-2 pr-14 sm:pr-0">
                <input
                  aria-label={`Notion ${i + 1} size in mm`}
                  inputMode="decimal"
                  className={cn(controlClass, 'w-20')}
                  aria-invalid={sizeError ? true : undefined}
                  {...register(at(i, 'sizeMm'), { setValueAs: numberOrUndefined })}
                />
                <span aria-hidden className="font-semibold">
                  mm
                </span>
                <span aria-hidden className="ml-2 font-semibold">
                  ×
                </span>
                <input
                  aria-label={`Notion ${i + 1} how many`}
                  inputMode="numeric"
                  className={cn(controlClass, 'w-20')}
                  aria-invalid={qtyError ? true : undefined}
                  {...register(at(i, 'quantity'), { setValueAs: numberOrUndefined })}
                />
              </div>
              {sizeError || qtyError ? (
                <p role="alert" className="text-sm font-semibold text-clay sm:basis-full">
                  ⚠ {sizeError ?? qtyError}
                </p>
              ) : null}
            </li>
          );
        })}
      </ul>
      {fields.length ? <p className="-mt-1 text-sm text-ink/70 dark:text-oat/70">Size in mm (for eyes, buttons, beads) and how many.</p> : null}
      <div>
        <Button variant="secondary" onClick={() => append({ kind: 'safety_eyes' } as never)}>
          <Plus aria-hidden className="h-5 w-5" /> Add a notion
        </Button>
      </div>
    </fieldset>
  );
}
