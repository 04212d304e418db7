import { useCallback, useEffect, useRef, useState, type PointerEvent } from 'react';
import { ChevronLeft, ChevronRight, Expand, X } from 'lucide-react';
import type { ShowcasePhoto } from '@/types/showcase';

// A horizontal drag longer than this (CSS px) counts as a swipe; shorter ones are taps (common practice for
// touch galleries: large enough not to fire while tapping, small enough for a thumb flick).
const SWIPE_PX = 48;

/** The cover large, the rest as thumbnails; tapping any opens it full-screen, where a swipe or an arrow moves on. */
export function PhotoGallery({ photos, title }: { photos: ShowcasePhoto[]; title: string }) {
  const [open, setOpen] = useState<number | null>(null);
  if (!photos.length) return null;
  const cover = photos[0]!;
  return (
    <section aria-label="Photos" className="print:break-inside-avoid">
      <button
        type="button"
        onClick={() => setOpen(0)}
        className="group relative block w-full overflow-hidden rounded-blob bg-wool dark:bg-[#3a3430] print:bg-transparent"
        aria-label={`Enlarge the cover photo: ${cover.alt}`}
      >
        <img
          src={cover.url}
          alt={cover.alt}
          width={cover.width}
          height={cover.height}
          className="mx-auto max-h-[70vh] w-full object-cover print:max-h-[9cm] print:w-auto print:rounded-soft print:object-contain"
          style={{ aspectRatio: `${cover.width} / ${cover.height}` }}
        />
        <span className="absolute bottom-3 right-3 flex items-center gap-1.5 rounded-soft bg-ink/70 px-3 py-1.5 text-sm font-semibold text-oat print:hidden">
          <Expand aria-hidden className="h-4 w-4" />
          {photos.length > 1 ? `${photos.length} photos` : 'Enlarge'}
        </span>
      </button>
      {photos.length > 1 ? (
        <ul className="mt-3 flex gap-2 overflow-x-auto pb-1 print:hidden" aria-label="More photos">
          {photos.slice(1).map((p, i) => (
            <li key={p.id} className="shrink-0">
              <button type="button" onClick={() => setOpen(i + 1)} className="block overflow-hidden rounded-soft ring-1 ring-wool dark:ring-[#4a423c]" aria-label={`Enlarge photo ${i + 2} of ${photos.length}: ${p.alt}`}>
                <img src={p.thumbUrl} alt="" className="h-20 w-20 object-cover sm:h-24 sm:w-24" loading="lazy" />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
      {open !== null ? <Lightbox photos={photos} index={open} onIndex={setOpen} onClose={() => setOpen(null)} title={title} /> : null}
    </section>
  );
}

function Lightbox({ photos, index, onIndex, onClose, title }: { photos: ShowcasePhoto[]; index: number; onIndex: (i: number) => void; onClose: () => void; title: string }) {
  const ref = useRef<HTMLDialogElement>(null);
  const start = useRef<{ x: number; y: number; id: number } | null>(null);
  const [drag, setDrag] = useState(0);
  const photo = photos[index]!;
  const many = photos.length > 1;
  const go = useCallback((delta: number) => onIndex((index + delta + photos.length) % photos.length), [index, onIndex, photos.length]);

  useEffect(() => {
    const d = ref.current;
    if (d && !d.open) d.showModal?.();
  }, []);

  useEffect(() => {
    const onKey = (e: KeyboardEvent) => {
      if (e.key === 'ArrowRight') go(1);
      if (e.key === 'ArrowLeft') go(-1);
    };
    window.addEventListener('keydown', onKey);
    return () => window.removeEventListener('keydown', onKey);
  }, [go]);

  const onPointerDown = (e: PointerEvent<HTMLDivElement>) => {
    if (!many || e.button > 0) return;
    start.current = { x: e.clientX, y: e.clientY, id: e.pointerId };
    e.currentTarget.setPointerCapture?.(e.pointerId);
  };
  const onPointerMove = (e: PointerEvent<HTMLDivElement>) => {
    if (start.current?.id === e.pointerId) setDrag(e.clientX - start.current.x);
  };
  const onPointerEnd = (e: PointerEvent<HTMLDivElement>) => {
    const s = start.current;
    start.current = null;
    setDrag(0);
    if (!s || s.id !== e.pointerId) return;
    const dx = e.clientX - s.x;
    const dy = e.clientY - s.y;
    // Mostly sideways and long enough: a swipe. Left shows the next photo, as on a phone's own gallery.
    if (Math.abs(dx) >= SWIPE_PX && Math.abs(dx) > Math.abs(dy)) go(dx < 0 ? 1 : -1);
  };

  const round = 'flex min-h-tap min-w-tap items-center justify-center rounded-full bg-ink/70 text-oat hover:bg-ink';
  return (
    <dialog
      ref={ref}
      onClose={onClose}
      onCancel={onClose}
      aria-label={`Photos of ${title}`}
      className="m-0 h-dvh max-h-none w-screen max-w-none bg-ink p-0 text-oat backdrop:bg-ink/90"
    >
      <div className="flex h-full flex-col">
        <div className="flex items-center justify-between gap-2 p-3">
          <p className="tabular px-2 font-semibold" aria-live="polite">
            Photo {index + 1} of {photos.length}
          </p>
          <button type="button" className={round} onClick={onClose} aria-label="Close the photos">
            <X aria-hidden className="h-6 w-6" />
          </button>
        </div>
        <div
          className="relative flex flex-1 touch-pan-y select-none items-center justify-center overflow-hidden px-2"
          onPointerDown={onPointerDown}
          onPointerMove={onPointerMove}
          onPointerUp={onPointerEnd}
          onPointerCancel={onPointerEnd}
          data-testid="lightbox-stage"
        >
          <img
            key={photo.id}
            src={photo.url}
            alt={photo.alt}
            draggable={false}
            className="max-h-full max-w-full rounded-soft object-contain"
            style={{ transform: drag ? `translateX(${drag}px)` : undefined, transition: drag ? 'none' : 'transform 150ms ease-out' }}
          />
          {many ? (
            <>
              <button type="button" className={`${round} absolute left-2 top-1/2 -translate-y-1/2`} onClick={() => go(-1)} aria-label="Previous photo">
                <ChevronLeft aria-hidden className="h-7 w-7" />
              </button>
              <button type="button" className={`${round} absolute right-2 top-1/2 -translate-y-1/2`} onClick={() => go(1)} aria-label="Next photo">
                <ChevronRight aria-hidden className="h-7 w-7" />
              </button>
            </>
          ) : null}
        </div>
        <p className="p-4 text-center text-sm text-oat/90">{photo.alt}</p>
      </div>
    </dialog>
  );
}
