import type { ReactNode } from 'react';

export function PageHeader({ title, subtitle, action }: { title: ReactNode; subtitle?: ReactNode; action?: ReactNode }) {
  return (
    <header className="mb-5 flex flex-wrap items-end justify-between gap-3">
      <div>
        <h1 className="text-2xl font-bold leading-tight sm:text-3xl">{title}</h1>
        {subtitle ? <p className="mt-1 text-ink/70 dark:text-oat/70">{subtitle}</p> : null}
      </div>
      {action}
    </header>
  );
}

export function Loading({ label = 'Loading…' }: { label?: string }) {
  return (
    <div role="status" className="flex items-center gap-3 py-8 text-ink/70 dark:text-oat/70">
      <span className="inline-block h-6 w-6 animate-spin rounded-full border-4 border-moss border-t-transparent" aria-hidden />
      {label}
    </div>
  );
}

export function EmptyState({ title, children, action }: { title: ReactNode; children?: ReactNode; action?: ReactNode }) {
  return (
    <div className="rounded-blob border-2 border-dashed border-wool p-8 text-center dark:border-[#4a423c]">
      <p className="text-lg font-bold">{title}</p>
      {children ? <div className="mt-2 text-ink/70 dark:text-oat/70">{children}</div> : null}
      {action ? <div className="mt-4 flex justify-center">{action}</div> : null}
    </div>
  );
}
