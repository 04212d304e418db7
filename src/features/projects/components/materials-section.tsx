import { useState } from 'react';
import { useFieldArray, useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Library, Pencil, Plus, X } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { SelectField, TextField } from '@/components/ui/field';
import { formatHook } from '@/reference/hooks';
import { yarnWeightLabel } from '@/reference/yarn-weights';
import { MaterialsSchema, notionLabels, type Materials } from '@/schemas/materials';
import type { ShelfYarn } from '@/types/api';
import { NotionFields } from './notion-fields';

const num = (v: unknown) => (v === '' || v === null || v === undefined ? undefined : Number(v));
const fmt = (n: number) => String(Number(n.toFixed(1)));

function yarnAmount(y: Materials['yarns'][number]) {
  const parts: string[] = [];
  if (y.metersUsed != null) parts.push(`${fmt(y.metersUsed)} m used`);
  if (y.skeinsUsed != null) parts.push(`${fmt(y.skeinsUsed)} ${y.skeinsUsed === 1 ? 'skein' : 'skeins'} used`);
  return parts.join(' · ');
}

export function MaterialsList({ materials }: { materials: Materials }) {
  const empty = !materials.yarns.length && !materials.hooks.length && !materials.notions.length;
  if (empty) return <p className="text-ink/70 dark:text-oat/70">No materials noted yet.</p>;
  return (
    <div className="grid gap-4 sm:grid-cols-3">
      {materials.yarns.length ? (
        <div>
          <h3 className="mb-1 font-semibold">Yarns</h3>
          <ul className="flex flex-col gap-2 text-sm">
            {materials.yarns.map((y, i) => (
              <li key={i}>
                <span className="font-semibold">{y.name}</span>
                {y.shelfYarnId ? (
                  <span className="ml-2 inline-flex items-center gap-1 rounded-full bg-wool px-2 text-xs font-semibold dark:bg-[#3a3430]">
                    <Library aria-hidden className="h-3 w-3" /> from your shelf
                  </span>
                ) : null}
                <span className="block text-ink/70 dark:text-oat/70">
                  {[y.colour, y.fibre, y.weight != null ? yarnWeightLabel(y.weight) : null, yarnAmount(y)].filter(Boolean).join(' · ')}
                </span>
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {materials.hooks.length ? (
        <div>
          <h3 className="mb-1 font-semibold">Hooks</h3>
          <ul className="flex flex-col gap-1 text-sm tabular">
            {materials.hooks.map((h, i) => (
              <li key={i}>
                {formatHook(h.mm)}
                {h.note ? ` · ${h.note}` : ''}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
      {materials.notions.length ? (
        <div>
          <h3 className="mb-1 font-semibold">Notions</h3>
          <ul className="flex flex-col gap-1 text-sm">
            {materials.notions.map((n, i) => (
              <li key={i}>
                {notionLabels[n.kind]}
                <span className="tabular">
                  {n.sizeMm ? `, ${fmt(n.sizeMm)} mm` : ''}
                  {n.quantity ? ` × ${n.quantity}` : ''}
                </span>
                {n.note ? ` · ${n.note}` : ''}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}

/** Materials actually used: typed in, or picked from the yarn shelf (which then counts them off what is left). */
export function MaterialsEditor({
  materials,
  shelf,
  pending,
  onSave,
  onCancel,
}: {
  materials: Materials;
  shelf: ShelfYarn[];
  pending?: boolean;
  onSave: (m: Materials) => void;
  onCancel: () => void;
}) {
  const form = useForm<Materials>({ resolver: zodResolver(MaterialsSchema) as never, defaultValues: materials });
  const yarns = useFieldArray({ control: form.control, name: 'yarns' });
  const hooks = useFieldArray({ control: form.control, name: 'hooks' });
  const { errors } = form.formState;
  const [pick, setPick] = useState('');
  const shelfById = new Map(shelf.map((y) => [y.id, y]));

  const addFromShelf = (id: number) => {
    const y = shelfById.get(id);
    if (!y) return;
    yarns.append({
      name: y.name,
      colour: y.colour,
      fibre: y.fibre,
      weight: y.weight,
      ply: y.ply,
      metersPerSkein: y.metersPerSkein,
      yardsPerSkein: y.yardsPerSkein,
      shelfYarnId: y.id,
    });
    setPick('');
  };

  return (
    <form onSubmit={form.handleSubmit(onSave)} noValidate className="flex flex-col gap-5">
      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 font-semibold">Yarns</legend>
        <ul className="flex flex-col gap-3">
          {yarns.fields.map((f, i) => {
            const shelfId = form.getValues(`yarns.${i}.shelfYarnId`);
            const fromShelf = shelfId ? shelfById.get(shelfId) : undefined;
            return (
              <li key={f.id}>
                <Card className="flex flex-col gap-3 p-4">
                  <div className="flex items-end gap-2">
                    <TextField label="Yarn" className="flex-1" error={errors.yarns?.[i]?.name?.message} {...form.register(`yarns.${i}.name`)} />
                    <Button variant="quiet" aria-label={`Remove yarn ${i + 1}`} onClick={() => yarns.remove(i)}>
                      <X aria-hidden className="h-5 w-5" />
                    </Button>
                  </div>
                  {shelfId ? (
                    <p className="flex items-center gap-1 text-sm">
                      <Library aria-hidden className="h-4 w-4" />
                      From your yarn shelf
                      {fromShelf?.metersLeft != null ? ` · ${fmt(fromShelf.metersLeft)} m left before this change` : ''}
                    </p>
                  ) : null}
                  <div className="grid grid-cols-2 gap-3">
                    <TextField label="Colour" {...form.register(`yarns.${i}.colour`, { setValueAs: (v) => v || undefined })} />
                    <SelectField label="Weight" {...form.register(`yarns.${i}.weight`, { setValueAs: num })}>
                      <option value="">Not sure</option>
                      {[0, 1, 2, 3, 4, 5, 6, 7].map((w) => (
                        <option key={w} value={w}>
                          {yarnWeightLabel(w)}
                        </option>
                      ))}
                    </SelectField>
                    <TextField label="Meters used" inputMode="decimal" error={errors.yarns?.[i]?.metersUsed?.message} {...form.register(`yarns.${i}.metersUsed`, { setValueAs: num })} />
                    <TextField label="Skeins used" inputMode="decimal" error={errors.yarns?.[i]?.skeinsUsed?.message} {...form.register(`yarns.${i}.skeinsUsed`, { setValueAs: num })} />
                  </div>
                </Card>
              </li>
            );
          })}
        </ul>
        <div className="flex flex-col gap-3 sm:flex-row sm:items-end">
          {shelf.length ? (
            <SelectField
              label="Add from your yarn shelf"
              className="flex-1"
              value={pick}
              onChange={(e) => {
                setPick(e.target.value);
                if (e.target.value) addFromShelf(Number(e.target.value));
              }}
            >
              <option value="">Choose a yarn…</option>
              {shelf.map((y) => (
                <option key={y.id} value={y.id}>
                  {y.name}
                  {y.colour ? `, ${y.colour}` : ''}
                  {y.metersLeft != null ? ` (${fmt(y.metersLeft)} m left)` : ''}
                </option>
              ))}
            </SelectField>
          ) : null}
          <Button variant="secondary" onClick={() => yarns.append({ name: '' })}>
            <Plus aria-hidden className="h-5 w-5" /> Type in a yarn
          </Button>
        </div>
      </fieldset>

      <fieldset className="flex flex-col gap-3">
        <legend className="mb-1 font-semibold">Hooks</legend>
        <ul className="flex flex-col gap-2">
          {hooks.fields.map((f, i) => (
            <li key={f.id} className="flex items-end gap-2">
              <TextField label="Hook (mm)" inputMode="decimal" className="flex-1" error={errors.hooks?.[i]?.mm?.message} {...form.register(`hooks.${i}.mm`, { setValueAs: num })} />
              <Button variant="quiet" aria-label={`Remove hook ${i + 1}`} onClick={() => hooks.remove(i)}>
                <X aria-hidden className="h-5 w-5" />
              </Button>
            </li>
          ))}
        </ul>
        <div>
          <Button variant="secondary" onClick={() => hooks.append({ mm: undefined as unknown as number })}>
            <Plus aria-hidden className="h-5 w-5" /> Add a hook
          </Button>
        </div>
      </fieldset>

      <NotionFields control={form.control} register={form.register} errors={errors} />

      <div className="flex flex-wrap justify-end gap-3">
        <Button variant="secondary" onClick={onCancel}>
          Cancel
        </Button>
        <Button type="submit" pending={pending}>
          Save materials
        </Button>
      </div>
    </form>
  );
}

export function MaterialsSection({
  materials,
  shelf,
  saving,
  onSave,
}: {
  materials: Materials;
  shelf: ShelfYarn[];
  saving?: boolean;
  onSave: (m: Materials, done: () => void) => void;
}) {
  const [editing, setEditing] = useState(false);
  return (
    <section aria-labelledby="materials-heading" className="flex flex-col gap-3">
      <div className="flex items-center justify-between gap-3">
        <h2 id="materials-heading" className="text-xl font-bold">
          Materials
        </h2>
        {!editing ? (
          <Button variant="quiet" onClick={() => setEditing(true)}>
            <Pencil aria-hidden className="h-4 w-4" /> Edit materials
          </Button>
        ) : null}
      </div>
      {editing ? (
        <MaterialsEditor materials={materials} shelf={shelf} pending={saving} onCancel={() => setEditing(false)} onSave={(m) => onSave(m, () => setEditing(false))} />
      ) : (
        <MaterialsList materials={materials} />
      )}
    </section>
  );
}
