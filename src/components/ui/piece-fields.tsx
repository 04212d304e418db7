import type { ReactNode } from 'react';
import type { UseFormRegisterReturn } from 'react-hook-form';

/** The US size beside a hook field ("3.5 mm (US E-4)"), announced as it changes; a hint while nothing is typed. */
export function HookSizeHint({ label }: { label: string | null }) {
  return (
    <p className="text-sm font-semibold" aria-live="polite" data-testid="hook-label">
      {label ?? <span className="font-normal text-ink/70 dark:text-oat/70">US size shows here</span>}
    </p>
  );
}

/** Tick-boxes for the yarns a piece uses, out of the ones its pattern or project lists; `empty` says where to add some. */
export function YarnChoices({ names, field, empty, children }: { names: string[]; field: UseFormRegisterReturn; empty: ReactNode; children?: ReactNode }) {
  return (
    <fieldset className="flex flex-col gap-2">
      <legend className="mb-1 font-semibold">Yarns this piece uses</legend>
      {names.length ? (
        <div className="flex flex-wrap gap-x-5">
          {names.map((n) => (
            <label key={n} className="flex min-h-tap cursor-pointer items-center gap-2">
              <input type="checkbox" value={n} className="h-6 w-6 accent-moss" {...field} />
              {n}
            </label>
          ))}
        </div>
      ) : (
        <p className="text-sm text-ink/70 dark:text-oat/70">{empty}</p>
      )}
      {children}
    </fieldset>
  );
}
