import { useEffect, useId, useRef, type ReactNode } from 'react';
import { Button } from './button';

/** A native <dialog> asking before something that cannot be undone (delete a pattern, frog a project…). */
export function ConfirmDialog({
  open,
  title,
  children,
  confirmLabel,
  onConfirm,
  onCancel,
  pending,
}: {
  open: boolean;
  title: ReactNode;
  children?: ReactNode;
  confirmLabel: string;
  onConfirm: () => void;
  onCancel: () => void;
  pending?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const titleId = useId();
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal?.();
    if (!open && d.open) d.close?.();
  }, [open]);
  return (
    <dialog ref={ref} aria-labelledby={titleId} onCancel={onCancel} className="m-auto max-w-md rounded-blob bg-oat p-6 text-ink shadow-xl backdrop:bg-ink/50 dark:bg-ink dark:text-oat">
      <h2 id={titleId} className="text-xl font-bold">{title}</h2>
      {children ? <div className="mt-2">{children}</div> : null}
      <div className="mt-6 flex flex-wrap justify-end gap-3">
        <Button variant="secondary" onClick={onCancel}>
          Keep it
        </Button>
        <Button variant="danger" onClick={onConfirm} pending={pending}>
          {confirmLabel}
        </Button>
      </div>
    </dialog>
  );
}
