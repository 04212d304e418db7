import { useEffect, useRef, type ReactNode } from 'react';
import { X } from 'lucide-react';
import { cn } from '@/utils/cn';

/** A full-height panel over the Tally (native <dialog>: focus stays inside, Escape closes it). */
export function Sheet({
  open,
  title,
  onClose,
  children,
  className,
}: {
  open: boolean;
  title: ReactNode;
  onClose: () => void;
  children: ReactNode;
  className?: string;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (open && !d.open) d.showModal?.();
    if (!open && d.open) d.close?.();
  }, [open]);
  return (
    <dialog
      ref={ref}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      aria-labelledby="tally-sheet-title"
      className={cn(
        'm-0 ml-auto h-dvh max-h-none w-full max-w-lg overflow-y-auto bg-oat p-0 text-ink shadow-2xl backdrop:bg-ink/60 sm:rounded-l-blob dark:bg-ink dark:text-oat',
        className,
      )}
    >
      {open ? (
        <div className="flex min-h-full flex-col">
          <header className="sticky top-0 z-10 flex items-center gap-2 border-b border-wool bg-oat/95 px-4 py-2 backdrop-blur dark:border-[#4a423c] dark:bg-ink/95">
            <h2 id="tally-sheet-title" className="flex-1 text-xl font-bold">
              {title}
            </h2>
            <button
              type="button"
              onClick={onClose}
              className="flex min-h-14 min-w-14 items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10"
              aria-label="Close"
            >
              <X aria-hidden className="h-7 w-7" />
            </button>
          </header>
          <div className="flex-1 px-4 py-4">{children}</div>
        </div>
      ) : null}
    </dialog>
  );
}
