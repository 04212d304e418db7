import { useEffect, useRef, useState } from 'react';
import { Star, Trash2, X } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { TextField } from '@/components/ui/field';
import { UpdatePhotoSchema } from '@/schemas/journal';
import type { JournalPhoto } from '@/types/api';

/** The larger view of one photo, with its description (alt text), "use as cover" and delete. */
export function PhotoViewer({
  photo,
  onClose,
  onSaveAlt,
  onCover,
  onDelete,
  pending,
}: {
  photo: JournalPhoto | null;
  onClose: () => void;
  onSaveAlt: (alt: string) => void;
  onCover: () => void;
  onDelete: () => void;
  pending?: boolean;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const [alt, setAlt] = useState(photo?.alt ?? '');
  const [error, setError] = useState<string | undefined>();
  const [confirmDelete, setConfirmDelete] = useState(false);
  const [shownId, setShownId] = useState<number | null>(photo?.id ?? null);
  // A different photo opened: start from its own description.
  if ((photo?.id ?? null) !== shownId) {
    setShownId(photo?.id ?? null);
    setAlt(photo?.alt ?? '');
    setError(undefined);
    setConfirmDelete(false);
  }

  useEffect(() => {
    const d = ref.current;
    if (!d) return;
    if (photo && !d.open) d.showModal?.();
    if (!photo && d.open) d.close?.();
  }, [photo]);

  const save = () => {
    const parsed = UpdatePhotoSchema.safeParse({ alt });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message);
      return;
    }
    setError(undefined);
    onSaveAlt(parsed.data.alt!);
  };

  return (
    <dialog
      ref={ref}
      onCancel={onClose}
      aria-label="Photo"
      className="m-auto w-[min(100vw-1rem,56rem)] max-w-none rounded-blob bg-oat p-0 text-ink shadow-xl backdrop:bg-ink/70 dark:bg-ink dark:text-oat"
    >
      {photo ? (
        <div className="flex max-h-[92dvh] flex-col">
          <div className="flex items-center justify-end p-2">
            <button type="button" onClick={onClose} className="flex min-h-tap min-w-tap items-center justify-center gap-1 rounded-soft px-3 font-semibold hover:bg-wool dark:hover:bg-white/10">
              <X aria-hidden className="h-5 w-5" /> Close
            </button>
          </div>
          <div className="min-h-0 flex-1 overflow-auto px-4">
            <img src={photo.url} alt={photo.alt} width={photo.width} height={photo.height} className="mx-auto h-auto max-h-[55dvh] w-auto max-w-full rounded-soft bg-wool object-contain" />
          </div>
          <div className="flex flex-col gap-3 p-4">
            <div className="flex flex-col gap-2 sm:flex-row sm:items-end">
              <TextField
                label="Description for people who cannot see the photo"
                value={alt}
                onChange={(e) => setAlt(e.target.value)}
                error={error}
                className="flex-1"
                maxLength={300}
              />
              <Button variant="secondary" onClick={save} disabled={pending || alt.trim() === photo.alt}>
                Save description
              </Button>
            </div>
            <div className="flex flex-wrap gap-2">
              {photo.cover ? (
                <p className="inline-flex min-h-tap items-center gap-2 rounded-soft bg-[#dce8df] px-4 font-semibold text-ink">
                  <Star aria-hidden className="h-5 w-5 fill-moss text-moss" /> This is the project’s cover
                </p>
              ) : (
                <Button variant="secondary" onClick={onCover} disabled={pending}>
                  <Star aria-hidden className="h-5 w-5" /> Use as cover
                </Button>
              )}
              {confirmDelete ? (
                <>
                  <Button variant="danger" onClick={onDelete} pending={pending}>
                    <Trash2 aria-hidden className="h-5 w-5" /> Yes, delete this photo
                  </Button>
                  <Button variant="quiet" onClick={() => setConfirmDelete(false)}>
                    Keep it
                  </Button>
                </>
              ) : (
                <Button variant="quiet" className="text-clay! dark:text-[#e59b7c]!" onClick={() => setConfirmDelete(true)}>
                  <Trash2 aria-hidden className="h-5 w-5" /> Delete photo
                </Button>
              )}
            </div>
          </div>
        </div>
      ) : null}
    </dialog>
  );
}
