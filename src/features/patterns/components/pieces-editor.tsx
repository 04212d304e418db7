import { useDeferredValue, useMemo, useState } from 'react';
import { useFieldArray, useFormContext, useWatch } from 'react-hook-form';
import { AlertTriangle, ArrowDown, ArrowUp, Plus, Trash2 } from 'lucide-react';
import { checkPiece } from '@/engine';
import type { Terms } from '@/engine/types';
import { formatHook } from '@/reference/hooks';
import type { CreatePatternFormValues } from '@/schemas/pattern';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { cn } from '@/utils/cn';
import { PieceWorkspace } from './piece-workspace';
import { HookSizeHint, YarnChoices } from '@/components/ui/piece-fields';

const numberOrNull = (v: unknown) => (v === '' || v == null ? null : Number(v));

export const blankPiece = (name = 'Body') => ({
  name,
  copies: 1,
  hookMm: null,
  instructions: '',
  yarns: [] as string[],
});

function PieceTab({
  index,
  selected,
  onSelect,
  hasError,
}: {
  index: number;
  selected: boolean;
  onSelect: () => void;
  hasError: boolean;
}) {
  const { control } = useFormContext<CreatePatternFormValues>();
  const [name, copies, text, terms] = useWatch({
    control,
    name: [`pieces.${index}.name`, `pieces.${index}.copies`, `pieces.${index}.instructions`, 'terms'],
  });
  const deferred = useDeferredValue(text ?? '');
  const problems = useMemo(
    () =>
      checkPiece(deferred, { terms: (terms ?? 'us') as Terms }).rounds.reduce(
        (n, r) => n + r.problems.length,
        0,
      ),
    [deferred, terms],
  );
  const flagged = problems > 0 || hasError;
  return (
    <button
      type="button"
      role="tab"
      aria-selected={selected}
      onClick={onSelect}
      className={cn(
        'inline-flex min-h-tap items-center gap-2 rounded-soft px-4 font-semibold',
        selected ? 'bg-moss text-oat' : 'bg-wool text-ink hover:bg-[#d9ccb4] dark:bg-white/10 dark:text-oat',
      )}
    >
      <span>{name || `Piece ${index + 1}`}</span>
      {Number(copies) > 1 ? <span className="tabular text-sm font-normal">×{copies}</span> : null}
      {flagged ? (
        <span className="inline-flex items-center gap-0.5 text-sm">
          <AlertTriangle aria-hidden className={cn('h-4 w-4', selected ? 'text-oat' : 'text-clay')} />
          <span className="sr-only">, needs a check</span>
          {problems > 0 ? (
            <span className="tabular" aria-hidden>
              {problems}
            </span>
          ) : null}
        </span>
      ) : null}
    </button>
  );
}

/** The pattern's pieces: pick one to edit; add, remove and reorder them. */
export function PiecesEditor() {
  const { control, register, formState } = useFormContext<CreatePatternFormValues>();
  // keyName keeps react-hook-form's own row key away from the pieces' database ids.
  const pieces = useFieldArray({ control, name: 'pieces', keyName: 'key' });
  const [selected, setSelected] = useState(0);
  // After a refused save, show the first piece that needs a fix.
  const [seenSubmits, setSeenSubmits] = useState(formState.submitCount);
  if (seenSubmits !== formState.submitCount) {
    setSeenSubmits(formState.submitCount);
    const firstBad = Array.isArray(formState.errors.pieces) ? formState.errors.pieces.findIndex(Boolean) : -1;
    if (firstBad >= 0 && !formState.errors.pieces?.[selected]) setSelected(firstBad);
  }
  const current = Math.min(selected, pieces.fields.length - 1);
  const yarns = useWatch({ control, name: 'materials.yarns' }) ?? [];
  const pieceYarns = useWatch({ control, name: `pieces.${current}.yarns` }) ?? [];
  const hookMm = useWatch({ control, name: `pieces.${current}.hookMm` });
  const errors = formState.errors.pieces;
  const e = errors?.[current];

  const yarnNames = yarns.map((y) => y?.name?.trim()).filter((n): n is string => Boolean(n));
  const weight =
    yarns.find((y) => y?.name && pieceYarns.includes(y.name) && y.weight != null)?.weight ??
    yarns.find((y) => y?.weight != null)?.weight ??
    null;
  const hookLabel =
    typeof hookMm === 'number' && Number.isFinite(hookMm) && hookMm >= 0.5 && hookMm <= 35
      ? formatHook(hookMm)
      : null;

  return (
    <div className="flex flex-col gap-4">
      <div role="tablist" aria-label="Pieces" className="flex flex-wrap gap-2">
        {pieces.fields.map((f, i) => (
          <PieceTab
            key={f.key}
            index={i}
            selected={i === current}
            onSelect={() => setSelected(i)}
            hasError={Boolean(errors?.[i])}
          />
        ))}
        <Button
          variant="quiet"
          onClick={() => {
            pieces.append(blankPiece(`Piece ${pieces.fields.length + 1}`));
            setSelected(pieces.fields.length);
          }}
        >
          <Plus aria-hidden className="h-5 w-5" /> Add a piece
        </Button>
      </div>
      {errors?.root?.message || errors?.message ? (
        <p role="alert" className="text-sm font-semibold text-clay">
          ⚠ {errors?.root?.message ?? errors?.message}
        </p>
      ) : null}

      {pieces.fields.map((f, i) =>
        i === current ? (
          <div key={f.key} role="tabpanel" aria-label={`Piece ${i + 1}`} className="flex flex-col gap-4">
            <div className="grid gap-4 sm:grid-cols-[2fr_1fr_1.4fr]">
              <TextField
                label="Piece name"
                placeholder="Body, Ear, Arm…"
                error={e?.name?.message}
                {...register(`pieces.${i}.name`)}
              />
              <TextField
                label="How many to make"
                type="number"
                inputMode="numeric"
                min={1}
                hint="Make 2 for a pair of ears."
                error={e?.copies?.message}
                {...register(`pieces.${i}.copies`, {
                  setValueAs: (v) => (v === '' ? Number.NaN : Number(v)),
                })}
              />
              <div className="flex flex-col gap-1.5">
                <TextField
                  label="Hook (mm)"
                  type="number"
                  inputMode="decimal"
                  step="0.05"
                  min={0.5}
                  max={35}
                  placeholder="3.5"
                  error={e?.hookMm?.message}
                  {...register(`pieces.${i}.hookMm`, { setValueAs: numberOrNull })}
                />
                <HookSizeHint label={hookLabel ?? null} />
              </div>
            </div>

            <YarnChoices
              names={yarnNames}
              field={register(`pieces.${i}.yarns`)}
              empty="Add yarns under Materials below, then tick the ones this piece uses."
            />

            <PieceWorkspace index={i} weight={weight} />

            {pieces.fields.length > 1 ? (
              <div className="flex flex-wrap gap-2 border-t border-wool pt-3 dark:border-[#4a423c]">
                <Button
                  variant="secondary"
                  disabled={i === 0}
                  onClick={() => {
                    pieces.move(i, i - 1);
                    setSelected(i - 1);
                  }}
                >
                  <ArrowUp aria-hidden className="h-5 w-5" /> Move earlier
                </Button>
                <Button
                  variant="secondary"
                  disabled={i === pieces.fields.length - 1}
                  onClick={() => {
                    pieces.move(i, i + 1);
                    setSelected(i + 1);
                  }}
                >
                  <ArrowDown aria-hidden className="h-5 w-5" /> Move later
                </Button>
                <Button
                  variant="quiet"
                  className="ml-auto text-clay"
                  onClick={() => {
                    pieces.remove(i);
                    setSelected(Math.max(0, i - 1));
                  }}
                >
                  <Trash2 aria-hidden className="h-5 w-5" /> Remove this piece
                </Button>
              </div>
            ) : null}
          </div>
        ) : null,
      )}
    </div>
  );
}
