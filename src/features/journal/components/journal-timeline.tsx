import { useState } from 'react';
import { useSearchParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { NotebookPen } from 'lucide-react';
import { toast } from 'sonner';
import { Banner } from '@/components/ui/banner';
import { Button } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { SelectField } from '@/components/ui/field';
import { EmptyState, Loading } from '@/components/ui/page';
import type { JournalEntry, JournalPhoto } from '@/types/api';
import { useCreateEntry } from '../api/create-entry';
import { useDeleteEntry } from '../api/delete-entry';
import { useEntries } from '../api/get-entries';
import { journalKeys } from '../api/keys';
import { useUpdateEntry } from '../api/update-entry';
import { useDeletePhoto } from '../api/delete-photo';
import { useUpdatePhoto } from '../api/update-photo';
import { usePhotoUploads } from '../hooks/use-photo-uploads';
import { formatDay } from '../lib/format';
import { EntryCard } from './entry-card';
import { EntryForm, type PieceOption } from './entry-form';
import { PhotoViewer } from './photo-viewer';
import { UploadList } from './upload-list';

export interface JournalTimelineProps {
  projectId: number;
  pieces: PieceOption[];
  /** Working time the page knows from the Tally, to prefill a new entry. */
  workingMinutes?: number | null;
  /** The project's cover changed (set, cleared or its photo deleted): the page refreshes the project. */
  onCoverChange?: () => void;
}

const positive = (v: string | null) => {
  const n = Number(v);
  return v && Number.isInteger(n) && n > 0 ? n : null;
};

/**
 * The project's journal: a form to write an entry (with photos), and the entries newest first, filterable by
 * piece. A link may open the form prefilled: ?journal=new&minutes=35&piece=12 (how the Tally hands over
 * the working time it counted).
 */
export function JournalTimeline({ projectId, pieces, workingMinutes, onCoverChange }: JournalTimelineProps) {
  const [params] = useSearchParams();
  const [prefill] = useState(() => ({
    open: params.get('journal') === 'new',
    minutes: positive(params.get('minutes')) ?? workingMinutes ?? null,
    pieceId: pieces.some((p) => p.id === positive(params.get('piece'))) ? positive(params.get('piece')) : null,
  }));
  const [writing, setWriting] = useState(prefill.open);
  const [editingId, setEditingId] = useState<number | null>(null);
  const [pieceFilter, setPieceFilter] = useState<number | undefined>();
  const [deleting, setDeleting] = useState<JournalEntry | null>(null);
  const [viewing, setViewing] = useState<JournalPhoto | null>(null);

  const qc = useQueryClient();
  const list = useEntries(projectId, { pieceId: pieceFilter });
  const create = useCreateEntry(projectId);
  const update = useUpdateEntry(projectId);
  const remove = useDeleteEntry(projectId);
  const updatePhoto = useUpdatePhoto(projectId, onCoverChange);
  const deletePhoto = useDeletePhoto(projectId, onCoverChange);
  const uploads = usePhotoUploads({ onUploaded: () => void qc.invalidateQueries({ queryKey: journalKeys.project(projectId) }) });

  // Keep the open photo in step with the list (its description or cover state may have just changed).
  const allPhotos = list.data?.flatMap((e) => e.photos) ?? [];
  const shown = viewing ? (allPhotos.find((p) => p.id === viewing.id) ?? viewing) : null;

  return (
    <section aria-labelledby="journal-heading" className="flex flex-col gap-4">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h2 id="journal-heading" className="text-xl font-bold">
          Journal
        </h2>
        {!writing ? (
          <Button onClick={() => setWriting(true)}>
            <NotebookPen aria-hidden className="h-5 w-5" /> Write an entry
          </Button>
        ) : null}
      </div>

      {writing ? (
        <Card className="p-4 sm:p-5">
          <EntryForm
            pieces={pieces}
            defaultMinutes={prefill.minutes}
            defaultPieceId={prefill.pieceId ?? pieceFilter ?? null}
            pending={create.isPending}
            onCancel={() => setWriting(false)}
            onSubmit={(values, files) =>
              create.mutate(values, {
                onSuccess: (entry) => {
                  setWriting(false);
                  if (files.length) uploads.enqueue(entry.id, files);
                  toast.success(files.length ? 'Entry saved; adding the photos now.' : 'Entry saved.');
                },
              })
            }
          />
        </Card>
      ) : null}

      <UploadList items={uploads.items} onCancel={uploads.cancel} onClear={uploads.clearFinished} />

      {pieces.length > 1 ? (
        <SelectField
          label="Show entries for"
          value={pieceFilter ?? ''}
          onChange={(e) => setPieceFilter(e.target.value ? Number(e.target.value) : undefined)}
          className="max-w-xs"
        >
          <option value="">All pieces</option>
          {pieces.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name}
            </option>
          ))}
        </SelectField>
      ) : null}

      {list.isPending ? (
        <Loading label="Opening the journal…" />
      ) : list.isError ? (
        <Banner tone="warning" title="The journal did not load">
          {list.error.message}
        </Banner>
      ) : list.data.length === 0 ? (
        <EmptyState title={pieceFilter ? 'No entries for this piece yet' : 'No entries yet'}>
          Note what you did today, what you changed from the pattern and where the eyes went — with a photo of each piece.
        </EmptyState>
      ) : (
        <ol className="flex flex-col gap-4" aria-label="Journal entries, newest first">
          {list.data.map((entry) => (
            <li key={entry.id}>
              {editingId === entry.id ? (
                <Card className="p-4 sm:p-5">
                  <EntryForm
                    pieces={pieces}
                    entry={entry}
                    pending={update.isPending}
                    onCancel={() => setEditingId(null)}
                    onSubmit={(values, files) =>
                      update.mutate(
                        { entryId: entry.id, input: values },
                        {
                          onSuccess: () => {
                            setEditingId(null);
                            if (files.length) uploads.enqueue(entry.id, files);
                            toast.success('Entry updated.');
                          },
                        },
                      )
                    }
                  />
                </Card>
              ) : (
                <EntryCard entry={entry} onEdit={() => setEditingId(entry.id)} onDelete={() => setDeleting(entry)} onOpenPhoto={setViewing} />
              )}
            </li>
          ))}
        </ol>
      )}

      <ConfirmDialog
        open={deleting !== null}
        title="Delete this entry?"
        confirmLabel="Delete the entry"
        pending={remove.isPending}
        onCancel={() => setDeleting(null)}
        onConfirm={() =>
          deleting &&
          remove.mutate(deleting.id, {
            onSuccess: () => {
              if (deleting.photos.some((p) => p.cover)) onCoverChange?.();
              setDeleting(null);
              toast.success('Entry deleted.');
            },
          })
        }
      >
        {deleting ? (
          <p>
            The entry of {formatDay(deleting.entryDate)}
            {deleting.photos.length ? ` and its ${deleting.photos.length === 1 ? 'photo go' : `${deleting.photos.length} photos go`}` : ' goes'} for good.
          </p>
        ) : null}
      </ConfirmDialog>

      <PhotoViewer
        photo={shown}
        pending={updatePhoto.isPending || deletePhoto.isPending}
        onClose={() => setViewing(null)}
        onSaveAlt={(alt) => shown && updatePhoto.mutate({ photoId: shown.id, input: { alt } }, { onSuccess: () => toast.success('Description saved.') })}
        onCover={() => shown && updatePhoto.mutate({ photoId: shown.id, input: { cover: true } }, { onSuccess: () => toast.success('This photo is now the project’s cover.') })}
        onDelete={() =>
          shown &&
          deletePhoto.mutate(
            { photoId: shown.id, wasCover: shown.cover },
            {
              onSuccess: () => {
                setViewing(null);
                toast.success('Photo deleted.');
              },
            },
          )
        }
      />
    </section>
  );
}
