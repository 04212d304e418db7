import { forwardRef, useId, type InputHTMLAttributes, type ReactNode, type SelectHTMLAttributes, type TextareaHTMLAttributes } from 'react';
import { cn } from '@/utils/cn';

const control =
  'w-full rounded-soft border-2 border-wool bg-white px-4 py-3 text-base text-ink placeholder:text-ink/40 dark:placeholder:text-oat/45 focus:border-moss focus:outline-none min-h-tap dark:bg-[#332e2a] dark:border-[#4a423c] dark:text-oat aria-[invalid=true]:border-clay';

interface Wrap {
  label: ReactNode;
  error?: string;
  hint?: ReactNode;
  className?: string;
}

function FieldShell({ id, label, error, hint, className, children }: Wrap & { id: string; children: ReactNode }) {
  return (
    <div className={cn('flex flex-col gap-1.5', className)}>
      <label htmlFor={id} className="font-semibold">
        {label}
      </label>
      {children}
      {hint && !error ? <p id={`${id}-hint`} className="text-sm text-ink/70 dark:text-oat/70">{hint}</p> : null}
      {error ? (
        <p id={`${id}-error`} role="alert" className="text-sm font-semibold text-clay">
          <span aria-hidden>⚠ </span>
          {error}
        </p>
      ) : null}
    </div>
  );
}

const describedBy = (id: string, error?: string, hint?: ReactNode) => (error ? `${id}-error` : hint ? `${id}-hint` : undefined);

export const TextField = forwardRef<HTMLInputElement, Wrap & InputHTMLAttributes<HTMLInputElement>>(function TextField(
  { label, error, hint, className, id, ...rest },
  ref,
) {
  const auto = useId();
  const fid = id ?? auto;
  return (
    <FieldShell id={fid} label={label} error={error} hint={hint} className={className}>
      <input ref={ref} id={fid} className={control} aria-invalid={error ? true : undefined} aria-describedby={describedBy(fid, error, hint)} {...rest} />
    </FieldShell>
  );
});

export const TextAreaField = forwardRef<HTMLTextAreaElement, Wrap & TextareaHTMLAttributes<HTMLTextAreaElement>>(function TextAreaField(
  { label, error, hint, className, id, ...rest },
  ref,
) {
  const auto = useId();
  const fid = id ?? auto;
  return (
    <FieldShell id={fid} label={label} error={error} hint={hint} className={className}>
      <textarea ref={ref} id={fid} className={cn(control, 'min-h-32')} aria-invalid={error ? true : undefined} aria-describedby={describedBy(fid, error, hint)} {...rest} />
    </FieldShell>
  );
});

export const SelectField = forwardRef<HTMLSelectElement, Wrap & SelectHTMLAttributes<HTMLSelectElement>>(function SelectField(
  { label, error, hint, className, id, children, ...rest },
  ref,
) {
  const auto = useId();
  const fid = id ?? auto;
  return (
    <FieldShell id={fid} label={label} error={error} hint={hint} className={className}>
      <select ref={ref} id={fid} className={control} aria-invalid={error ? true : undefined} aria-describedby={describedBy(fid, error, hint)} {...rest}>
        {children}
      </select>
    </FieldShell>
  );
});

export function CheckboxField({ label, className, ...rest }: { label: ReactNode; className?: string } & InputHTMLAttributes<HTMLInputElement>) {
  return (
    <label className={cn('flex min-h-tap cursor-pointer items-center gap-3 font-semibold', className)}>
      <input type="checkbox" className="h-6 w-6 accent-moss" {...rest} />
      <span>{label}</span>
    </label>
  );
}
