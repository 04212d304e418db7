import { useRef, useState, type DragEvent } from 'react';
import { Camera, ImagePlus, X } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { cn } from '@/utils/cn';

/**
 * Three ways in: drag and drop, the file picker (several at once), and the phone camera on its own button
 * (capture="environment" opens the back camera on phones; desktops fall back to the file picker).
 */
export function PhotoPicker({ files, onChange, disabled }: { files: File[]; onChange: (files: File[]) => void; disabled?: boolean }) {
  const pick = useRef<HTMLInputElement>(null);
  const camera = useRef<HTMLInputElement>(null);
  const [over, setOver] = useState(false);

  const add = (list: FileList | null) => {
    if (!list?.length) return;
    onChange([...files, ...Array.from(list)]);
  };
  const onDrop = (e: DragEvent) => {
    e.preventDefault();
    setOver(false);
    if (!disabled) add(e.dataTransfer.files);
  };

  return (
    <div className="flex flex-col gap-3">
      <div
        onDragOver={(e) => {
          e.preventDefault();
          if (!disabled) setOver(true);
        }}
        onDragLeave={() => setOver(false)}
        onDrop={onDrop}
        className={cn(
          'flex flex-col items-center gap-3 rounded-soft border-2 border-dashed p-4 text-center',
          over ? 'border-moss bg-[#dce8df] dark:bg-moss/20' : 'border-wool dark:border-[#4a423c]',
        )}
      >
        <div className="flex flex-wrap justify-center gap-2">
          <Button variant="secondary" disabled={disabled} onClick={() => pick.current?.click()}>
            <ImagePlus aria-hidden className="h-5 w-5" /> Choose photos
          </Button>
          <Button variant="secondary" disabled={disabled} onClick={() => camera.current?.click()}>
            <Camera aria-hidden className="h-5 w-5" /> Take a photo
          </Button>
        </div>
        <p className="text-sm text-ink/70 dark:text-oat/70">{over ? 'Let go to add them.' : 'or drop photos here'}</p>
        <input
          ref={pick}
          type="file"
          accept="image/*"
          multiple
          hidden
          aria-label="Photo files"
          onChange={(e) => {
            add(e.target.files);
            e.target.value = '';
          }}
        />
        <input
          ref={camera}
          type="file"
          accept="image/*"
          capture="environment"
          hidden
          aria-label="Camera"
          onChange={(e) => {
            add(e.target.files);
            e.target.value = '';
          }}
        />
      </div>
      {files.length ? (
        <ul className="flex flex-col gap-2" aria-label="Photos to add">
          {files.map((f, i) => (
            <li key={`${f.name}-${i}`} className="flex items-center gap-2 rounded-soft bg-wool/60 py-1 pr-1 pl-3 text-sm dark:bg-[#3a3430]">
              <span className="min-w-0 flex-1 truncate font-semibold">{f.name || 'photo'}</span>
              <span className="tabular shrink-0 text-ink/70 dark:text-oat/70">{formatBytes(f.size)}</span>
              <button
                type="button"
                className="flex min-h-tap min-w-tap items-center justify-center rounded-soft hover:bg-wool dark:hover:bg-white/10"
                aria-label={`Leave out ${f.name || 'this photo'}`}
                onClick={() => onChange(files.filter((_, k) => k !== i))}
              >
                <X aria-hidden className="h-5 w-5" />
              </button>
            </li>
          ))}
        </ul>
      ) : null}
    </div>
  );
}

export function formatBytes(n: number) {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${Math.round(n / 1024)} KB`;
  return `${(n / 1024 / 1024).toFixed(1)} MB`;
}
