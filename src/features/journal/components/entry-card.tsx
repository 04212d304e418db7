import { Clock, Pencil, Star, Trash2 } from 'lucide-react';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import type { JournalEntry, JournalPhoto } from '@/types/api';
import { formatDay, formatMinutes } from '../lib/format';
import { MarkdownBody } from './markdown-body';
import { TagBadges } from './tag-chips';

export function EntryCard({
  entry,
  onEdit,
  onDelete,
  onOpenPhoto,
}: {
  entry: JournalEntry;
  onEdit: () => void;
  onDelete: () => void;
  onOpenPhoto: (photo: JournalPhoto) => void;
}) {
  const day = formatDay(entry.entryDate);
  return (
    <Card className="flex flex-col gap-3 p-4 sm:p-5">
      <header className="flex flex-wrap items-center gap-x-3 gap-y-1">
        <h3 className="text-lg font-bold">
          <time dateTime={entry.entryDate}>{day}</time>
        </h3>
        <span className="text-sm font-semibold text-ink/80 dark:text-oat/80">{entry.pieceName ?? 'Whole project'}</span>
        {entry.minutes ? (
          <span className="tabular inline-flex items-center gap-1 text-sm text-ink/80 dark:text-oat/80">
            <Clock aria-hidden className="h-4 w-4" /> {formatMinutes(entry.minutes)}
          </span>
        ) : null}
      </header>
      <TagBadges tags={entry.tags} />
      <MarkdownBody text={entry.body} />
      {entry.photos.length ? (
        <ul className="grid grid-cols-3 gap-2 sm:grid-cols-4" aria-label="Photos">
          {entry.photos.map((photo) => (
            <li key={photo.id} className="relative">
              <button
                type="button"
                onClick={() => onOpenPhoto(photo)}
                className="block aspect-square w-full overflow-hidden rounded-soft bg-wool focus-visible:ring-4 focus-visible:ring-moss"
                aria-label={`Open photo: ${photo.alt}`}
              >
                <img src={photo.thumbUrl} alt={photo.alt} loading="lazy" width={400} height={400} className="h-full w-full object-cover" />
              </button>
              {photo.cover ? (
                <span className="pointer-events-none absolute bottom-1 left-1 inline-flex items-center gap-1 rounded-full bg-oat/95 px-2 py-0.5 text-xs font-bold text-ink">
                  <Star aria-hidden className="h-3.5 w-3.5 fill-moss text-moss" /> Cover
                </span>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      <div className="-mb-2 flex justify-end gap-1">
        <Button variant="quiet" onClick={onEdit} aria-label={`Edit the entry of ${day}`}>
          <Pencil aria-hidden className="h-4 w-4" /> Edit
        </Button>
        <Button variant="quiet" className="text-clay! dark:text-[#e59b7c]!" onClick={onDelete} aria-label={`Delete the entry of ${day}`}>
          <Trash2 aria-hidden className="h-4 w-4" /> Delete
        </Button>
      </div>
    </Card>
  );
}
