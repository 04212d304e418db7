import { useDeferredValue, useId, useMemo, useRef, useState, type ComponentType } from 'react';
import { useForm, useWatch } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { Hash, Save, Trash2 } from 'lucide-react';
import { checkPiece } from '@/engine';
import type { PieceCheck, Terms } from '@/engine/types';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { TextAreaField, TextField } from '@/components/ui/field';
import { useLeaveGuard } from '@/hooks/use-leave-guard';
import { ApiError } from '@/lib/api-client';
import { formatHook } from '@/reference/hooks';
import { copiesProblem, reworkPiece, reworkRounds } from '@/schemas/piece-rework';
import { ProjectPieceFormSchema, type ProjectPieceFormOutput, type ProjectPieceFormValues } from '@/schemas/project';
import type { ProjectPiece } from '@/types/api';
import { cn } from '@/utils/cn';
import { HookSizeHint, YarnChoices } from '@/components/ui/piece-fields';

/** The round table as the patterns area draws it; the screen hands it in, since features do not import each other. */
export type RoundTableView = ComponentType<{ check: PieceCheck; onJump?: (line: number, column: number | null) => void; className?: string }>;

const termsName: Record<Terms, string> = { us: 'US terms', uk: 'UK terms' };
const fields = ['name', 'copies', 'hookMm', 'yarns', 'instructions'] as const;

function toValues(piece?: ProjectPiece): ProjectPieceFormValues {
  if (!piece) return { name: '', copies: 1, hookMm: null, yarns: [], instructions: '' };
  return { id: piece.id, name: piece.name, copies: piece.copies, hookMm: piece.hookMm, yarns: piece.yarns, instructions: piece.instructions };
}

// A comma is how many makers write 3,5 mm; an empty box means no hook given.
const millimetres = (v: unknown) => {
  if (v == null || typeof v === 'number') return v ?? null;
  const s = String(v).trim().replace(',', '.');
  return s === '' ? null : Number(s);
};
const wholeNumber = (v: unknown) => (v === '' || v == null ? Number.NaN : Number(v));

/** Start and end offsets of a line (or of one column in it) in the instructions, as the engine numbers lines. */
function rangeAt(text: string, line: number, column: number | null): [number, number] {
  const lines = text.split('\n');
  let start = 0;
  for (let i = 0; i < Math.min(line, lines.length); i += 1) start += lines[i].length + 1;
  const here = lines[line] ?? '';
  if (column == null) return [start, start + here.length];
  const at = start + Math.min(column, here.length);
  return [at, at];
}

/**
 * One piece of a project, edited on the project page: name, copies, hook, yarns and the instructions with the
 * live round table. For a piece the Tally has counted it says, before saving, what the change does to the count
 * (src/schemas/piece-rework.ts, the rules the server applies), and refuses fewer copies than the one worked.
 */
export function PieceEditor({
  piece,
  terms,
  yarnNames,
  RoundTable,
  sentAt,
  saving,
  saveError,
  onSave,
  onCancel,
  onRemove,
}: {
  /** Absent for a new piece. */
  piece?: ProjectPiece;
  terms: Terms;
  /** Yarns named in the project's materials, to tick. */
  yarnNames: string[];
  RoundTable: RoundTableView;
  /** This piece's index in the list sent, where the server's field errors point. */
  sentAt: number;
  saving: boolean;
  saveError: Error | null;
  onSave: (values: ProjectPieceFormOutput) => Promise<unknown>;
  onCancel: () => void;
  onRemove?: () => void;
}) {
  const id = useId();
  const marked = useMemo(() => piece?.placements.map((p) => p.copy) ?? [], [piece]);
  const schema = useMemo(
    () =>
      ProjectPieceFormSchema.superRefine((v, ctx) => {
        if (!piece || v.copies === piece.copies) return;
        const problem = copiesProblem(v.name, piece.progress, v.copies, marked);
        if (problem) ctx.addIssue({ code: 'custom', path: ['copies'], message: problem });
      }),
    [piece, marked],
  );
  const form = useForm<ProjectPieceFormValues, unknown, ProjectPieceFormOutput>({
    resolver: zodResolver(schema),
    defaultValues: toValues(piece),
    mode: 'onSubmit',
    reValidateMode: 'onChange',
  });
  const { register, control, handleSubmit, setError, formState } = form;
  const { errors, isDirty } = formState;
  const { dialog: leaveDialog } = useLeaveGuard(isDirty, `Your changes to ${piece ? piece.name : 'the new piece'} are not saved yet.`);
  const [dropping, setDropping] = useState(false);

  const [name, copies, hookMm, text] = useWatch({ control, name: ['name', 'copies', 'hookMm', 'instructions'] });
  const deferred = useDeferredValue(text ?? '');
  const check = useMemo(() => checkPiece(deferred, { terms }), [deferred, terms]);
  const savedRounds = useMemo(() => (piece ? reworkRounds(checkPiece(piece.instructions, { terms }).rounds) : []), [piece, terms]);

  const copiesNumber = Number(copies);
  const copiesValid = Number.isInteger(copiesNumber) && copiesNumber >= 1 && copiesNumber <= 50;
  // Said at once beside the field, not only on saving: the maker can act on it before typing anything else.
  const copiesRefused =
    piece && copiesValid && copiesNumber !== piece.copies ? copiesProblem(name?.trim() || piece.name, piece.progress, copiesNumber, marked) : null;
  const rework = useMemo(
    () =>
      piece && !copiesRefused
        ? reworkPiece({
            before: { rounds: savedRounds, copies: piece.copies },
            after: { rounds: reworkRounds(check.rounds), copies: copiesValid ? copiesNumber : piece.copies },
            position: piece.progress,
          })
        : null,
    [piece, copiesRefused, savedRounds, check.rounds, copiesValid, copiesNumber],
  );
  const moves = rework != null && piece != null && (rework.to.copy !== piece.progress.copy || rework.to.round !== piece.progress.round || rework.to.step !== piece.progress.step);

  const hookValue = typeof hookMm === 'number' && Number.isFinite(hookMm) && hookMm >= 0.5 && hookMm <= 35 ? formatHook(hookMm) : null;
  const yarnChoices = [...new Set([...yarnNames, ...(piece?.yarns ?? [])])];

  const textRef = useRef<HTMLTextAreaElement | null>(null);
  const { ref: textFormRef, ...textField } = register('instructions');
  const jump = (line: number, column: number | null) => {
    const el = textRef.current;
    if (!el) return;
    const [start, end] = rangeAt(el.value, line, column);
    el.focus();
    el.setSelectionRange(start, end);
  };

  const submit = handleSubmit(async (values) => {
    try {
      await onSave(values);
    } catch (e) {
      // The server's sentences go beside the fields they are about; the rest shows in the banner.
      if (!(e instanceof ApiError)) return;
      for (const issue of e.issues ?? []) {
        const field = fields.find((f) => issue.path === `pieces.${sentAt}.${f}` || issue.path.startsWith(`pieces.${sentAt}.${f}.`));
        if (field) setError(field, { message: issue.message });
      }
    }
  });
  const fieldIssue = saveError instanceof ApiError && saveError.issues.some((i) => fields.some((f) => i.path.startsWith(`pieces.${sentAt}.${f}`)));
  const title = piece ? `Edit ${piece.name}` : 'New piece';

  return (
    <Card className="p-4 sm:p-5">
      <form onSubmit={submit} noValidate aria-label={title} className="flex flex-col gap-5">
        <h3 className="text-xl font-bold">{title}</h3>
        {saveError && !fieldIssue ? (
          <Banner tone="warning" title="Not saved yet">
            {saveError.message}
          </Banner>
        ) : null}

        <div className="grid gap-4 sm:grid-cols-[2fr_1fr_1.4fr]">
          <TextField label="Piece name" placeholder="Body, Ear, Arm…" autoFocus={!piece} error={errors.name?.message} {...register('name')} />
          <TextField
            label="How many to make"
            type="number"
            inputMode="numeric"
            min={1}
            max={50}
            hint={piece && piece.copies > 1 ? `You are on copy ${Math.min(piece.progress.copy, piece.copies)} of ${piece.copies}.` : 'Make 2 for a pair of ears.'}
            error={errors.copies?.message ?? copiesRefused ?? undefined}
            {...register('copies', { setValueAs: wholeNumber })}
          />
          <div className="flex flex-col gap-1.5">
            <TextField
              label="Hook (mm)"
              inputMode="decimal"
              placeholder="3.5"
              autoComplete="off"
              error={errors.hookMm?.message}
              {...register('hookMm', { setValueAs: millimetres })}
            />
            <HookSizeHint label={hookValue ?? null} />
          </div>
        </div>

        <YarnChoices names={yarnChoices} field={register('yarns')} empty="Add yarns under Materials on this page, then tick the ones this piece uses.">
          {errors.yarns ? (
            <p role="alert" className="text-sm font-semibold text-clay">
              <span aria-hidden>⚠ </span>
              {errors.yarns.message ?? (Array.isArray(errors.yarns) ? errors.yarns.find(Boolean)?.message : null)}
            </p>
          ) : null}
        </YarnChoices>

        <div className="grid gap-4 lg:grid-cols-2">
          <TextAreaField
            id={`${id}-text`}
            label={
              <>
                Instructions <span className="font-normal text-ink/70 dark:text-oat/70">({termsName[terms]}, one round per line)</span>
              </>
            }
            rows={10}
            spellCheck={false}
            placeholder={'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)'}
            error={errors.instructions?.message}
            {...textField}
            ref={(el) => {
              textFormRef(el);
              textRef.current = el;
            }}
          />
          <div className="flex min-w-0 flex-col gap-2">
            <p className="flex items-center gap-2 font-semibold tabular" aria-live="polite">
              <Hash aria-hidden className="h-4 w-4 text-moss dark:text-[#9cc3a8]" />
              {check.rounds.length} {check.rounds.length === 1 ? 'round' : 'rounds'} to count{copiesValid && copiesNumber > 1 ? `, ${copiesNumber} times` : ''}
            </p>
            <RoundTable check={check} onJump={jump} className="lg:max-h-[32rem] lg:overflow-y-auto lg:pr-1" />
          </div>
        </div>

        {rework?.notable ? (
          <Banner tone="warning" title="What this does to your Tally count">
            <ul className="flex list-disc flex-col gap-1 pl-5">
              {rework.messages.map((m) => (
                <li key={m}>{m}</li>
              ))}
            </ul>
          </Banner>
        ) : null}

        {/* Only the save sticks to the screen while there is something to save; the other actions wait at the end. */}
        <div
          className={cn(
            'z-10 flex flex-wrap items-center gap-x-4 gap-y-1 rounded-blob p-2',
            isDirty && 'sticky bottom-24 bg-oat/95 shadow-lg ring-1 ring-wool backdrop-blur sm:bottom-4 dark:bg-ink/95 dark:ring-[#4a423c]',
          )}
        >
          <Button type="submit" pending={saving} className="w-full sm:w-auto">
            <Save aria-hidden className="h-5 w-5" /> {piece ? (moves ? 'Save and move the count' : 'Save the piece') : 'Add the piece'}
          </Button>
          {isDirty ? <p className="hidden px-2 text-sm font-semibold sm:block">Unsaved changes</p> : null}
        </div>
        <div className="flex flex-wrap items-center gap-3 border-t border-wool pt-3 dark:border-[#4a423c]">
          <Button variant="secondary" onClick={() => (isDirty ? setDropping(true) : onCancel())}>
            Cancel
          </Button>
          {onRemove ? (
            <Button variant="quiet" className="ml-auto text-clay! dark:text-[#e59b7c]!" onClick={onRemove}>
              <Trash2 aria-hidden className="h-5 w-5" /> Remove this piece
            </Button>
          ) : null}
        </div>
      </form>

      <ConfirmDialog
        open={dropping}
        title="Drop your changes?"
        confirmLabel="Drop the changes"
        onCancel={() => setDropping(false)}
        onConfirm={() => {
          setDropping(false);
          onCancel();
        }}
      >
        <p>What you changed on {piece ? piece.name : 'the new piece'} is not saved yet.</p>
      </ConfirmDialog>
      {leaveDialog}
    </Card>
  );
}
