import { useDeferredValue, useId, useMemo, useRef, useState } from 'react';
import { useFormContext, useWatch } from 'react-hook-form';
import { Calculator, Languages } from 'lucide-react';
import { checkPiece, convertTerms } from '@/engine';
import type { Terms } from '@/engine/types';
import { Silhouette } from '@/components/silhouette/silhouette';
import { placementMarks, stitchSize } from '@/components/silhouette/geometry';
import type { CreatePatternFormValues } from '@/schemas/pattern';
import { cn } from '@/utils/cn';
import { insertLineAfter, offsetOf, positionOf } from '../utils/text-position';
import { RoundPlanner } from './round-planner';
import { RoundTable } from './round-table';

const termsName: Record<Terms, string> = { us: 'US terms', uk: 'UK terms' };

/** Sets the caret in a textarea and scrolls its line into view. */
function placeCaret(el: HTMLTextAreaElement, offset: number, end = offset) {
  el.focus();
  el.setSelectionRange(offset, end);
  const line = positionOf(el.value, offset).line;
  const lh = parseFloat(getComputedStyle(el).lineHeight) || 24;
  const top = line * lh;
  if (top < el.scrollTop || top > el.scrollTop + el.clientHeight - lh)
    el.scrollTop = Math.max(0, top - el.clientHeight / 3);
}

/**
 * One piece's instructions beside its live round table, with the US/UK reading view, the round planner and
 * the silhouette. The engine runs here in the browser on a deferred copy of the text, so typing stays smooth.
 */
export function PieceWorkspace({ index, weight }: { index: number; weight: number | null }) {
  const id = useId();
  const { register, control, setValue, getValues, formState } = useFormContext<CreatePatternFormValues>();
  const name = `pieces.${index}.instructions` as const;
  const text = useWatch({ control, name }) ?? '';
  const terms = (useWatch({ control, name: 'terms' }) ?? 'us') as Terms;
  const gauge = useWatch({ control, name: 'gauge' });
  const pieceName = useWatch({ control, name: `pieces.${index}.name` });
  const deferred = useDeferredValue(text);
  const check = useMemo(() => checkPiece(deferred, { terms }), [deferred, terms]);

  const taRef = useRef<HTMLTextAreaElement | null>(null);
  const [caret, setCaret] = useState(0);
  const [view, setView] = useState<Terms>(terms);
  const [seenTerms, setSeenTerms] = useState(terms);
  if (seenTerms !== terms) {
    setSeenTerms(terms);
    setView(terms);
  }
  const [planner, setPlanner] = useState(false);
  const reading = view !== terms;
  const converted = useMemo(
    () => (reading ? convertTerms(text, terms, view) : ''),
    [reading, text, terms, view],
  );

  const caretLine = positionOf(text, Math.min(caret, text.length)).line;
  const above = [...check.rounds].reverse().find((r) => r.line <= caretLine) ?? null;
  const kind = above?.kind ?? check.rounds[0]?.kind ?? 'round';

  const { ref: formRef, ...field } = register(name);
  const error = formState.errors.pieces?.[index]?.instructions?.message;

  const trackCaret = (e: React.SyntheticEvent<HTMLTextAreaElement>) =>
    setCaret(e.currentTarget.selectionStart ?? 0);

  const jump = (line: number, column: number | null) => {
    setView(terms);
    const el = taRef.current;
    if (!el) return;
    const value = el.value;
    const start = offsetOf(value, line, column ?? 0);
    // A problem with no column marks the whole line.
    const end = column == null ? offsetOf(value, line, Number.MAX_SAFE_INTEGER) : start;
    // The textarea may just have been un-hidden by switching back from the reading view.
    requestAnimationFrame(() => placeCaret(el, start, end));
    placeCaret(el, start, end);
    setCaret(start);
  };

  const insert = (line: string) => {
    const current = getValues(name) ?? '';
    const out = insertLineAfter(current, caret, line);
    setValue(name, out.text, { shouldDirty: true });
    setCaret(out.caret);
    const el = taRef.current;
    if (el) requestAnimationFrame(() => placeCaret(el, out.caret));
  };

  const size = stitchSize(gauge ?? null, weight);
  const rounds = check.rounds.map((r) => ({ number: r.number, stitches: r.stitches, kind: r.kind }));
  const marks = placementMarks(check.notes);

  return (
    <div className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center gap-2">
        <div
          role="radiogroup"
          aria-label="Show the instructions in"
          className="inline-flex rounded-soft bg-wool p-1 dark:bg-white/10"
        >
          {(['us', 'uk'] as const).map((t) => (
            <button
              key={t}
              type="button"
              role="radio"
              aria-checked={view === t}
              onClick={() => setView(t)}
              className={cn(
                'min-h-tap rounded-[1rem] px-4 text-sm font-semibold',
                view === t
                  ? 'bg-moss text-oat'
                  : 'text-ink hover:bg-white/60 dark:text-oat dark:hover:bg-white/10',
              )}
            >
              {termsName[t]}
              {t === terms ? <span className="sr-only"> (as typed)</span> : null}
            </button>
          ))}
        </div>
        <button
          type="button"
          aria-expanded={planner}
          onClick={() => setPlanner((v) => !v)}
          className="inline-flex min-h-tap items-center gap-2 rounded-soft px-4 text-sm font-semibold text-moss hover:bg-wool/60 dark:text-[#9cc3a8] dark:hover:bg-white/10"
        >
          <Calculator aria-hidden className="h-5 w-5" /> Round planner
        </button>
      </div>

      <div className="grid gap-4 lg:grid-cols-2">
        <div className="flex min-w-0 flex-col gap-3">
          <label htmlFor={`${id}-text`} className={cn('font-semibold', reading && 'sr-only')}>
            Instructions{' '}
            <span className="font-normal text-ink/70 dark:text-oat/70">
              ({termsName[terms]}, one round per line)
            </span>
          </label>
          <textarea
            id={`${id}-text`}
            {...field}
            ref={(el) => {
              formRef(el);
              taRef.current = el;
            }}
            hidden={reading}
            rows={14}
            spellCheck={false}
            onSelect={trackCaret}
            onKeyUp={trackCaret}
            onClick={trackCaret}
            onInput={trackCaret}
            aria-invalid={error ? true : undefined}
            placeholder={'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)\nRnd 3: (sc, inc) x6 (18)'}
            className="min-h-64 w-full rounded-soft border-2 border-wool bg-white px-4 py-3 font-sans tabular text-base leading-7 text-ink focus:border-moss focus:outline-none aria-[invalid=true]:border-clay dark:border-[#4a423c] dark:bg-[#332e2a] dark:text-oat"
          />
          {reading ? (
            <div className="flex flex-col gap-2">
              <p className="flex items-center gap-2 font-semibold">
                <Languages aria-hidden className="h-5 w-5" /> Read in {termsName[view]}
              </p>
              <p className="text-sm text-ink/70 dark:text-oat/70">
                A reading view: what you typed stays in {termsName[terms]}. Switch back to edit.
              </p>
              <pre
                aria-label={`Instructions in ${termsName[view]} (read-only)`}
                className="min-h-64 overflow-x-auto rounded-soft border-2 border-dashed border-wool bg-oat px-4 py-3 font-sans tabular text-base leading-7 whitespace-pre-wrap dark:border-[#4a423c] dark:bg-ink"
              >
                {converted || ' '}
              </pre>
            </div>
          ) : null}
          {error ? (
            <p role="alert" className="text-sm font-semibold text-clay">
              ⚠ {error}
            </p>
          ) : null}
          {planner ? (
            <RoundPlanner
              defaultFrom={above ? above.stitches : null}
              nextNumber={(above?.number ?? 0) + 1}
              kind={kind}
              terms={terms}
              onInsert={insert}
            />
          ) : null}
        </div>
        <div className="flex min-w-0 flex-col gap-5">
          <RoundTable check={check} onJump={jump} className="lg:max-h-[36rem] lg:overflow-y-auto lg:pr-1" />
          <section aria-label="Silhouette" className="flex flex-col gap-2">
            <h4 className="text-lg font-bold">Silhouette</h4>
            <Silhouette rounds={rounds} size={size} marks={marks} title={pieceName || 'This piece'} />
          </section>
        </div>
      </div>
    </div>
  );
}
