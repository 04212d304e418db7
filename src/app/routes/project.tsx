import { useState } from 'react';
import { Link, useNavigate, useParams } from 'react-router-dom';
import { useQuery, useQueryClient } from '@tanstack/react-query';
import { ArrowDown, ArrowLeft, ArrowUp, ArrowUpDown, BookOpen, Calendar, Check, Gift, Pencil, Plus, Trash2 } from 'lucide-react';
import { toast } from 'sonner';
import { Banner } from '@/components/ui/banner';
import { Button, ButtonLink } from '@/components/ui/button';
import { Card } from '@/components/ui/card';
import { ConfirmDialog } from '@/components/ui/confirm-dialog';
import { SelectField } from '@/components/ui/field';
import { Loading } from '@/components/ui/page';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { projectStatusLabels, type ProjectStatus } from '@/schemas/common';
import { useProject } from '@/features/projects/api/get-project';
import { projectKeys } from '@/features/projects/api/keys';
import { useUpdateProject } from '@/features/projects/api/update-project';
import { useDeleteProject } from '@/features/projects/api/delete-project';
import { Cautions } from '@/features/projects/components/cautions';
import { MaterialsSection } from '@/features/projects/components/materials-section';
import { PieceCard } from '@/features/projects/components/piece-card';
import { PieceEditor } from '@/features/projects/components/piece-editor';
import { RemovePieceDialog } from '@/features/projects/components/remove-piece-dialog';
import { piecesMoved, piecesWith, piecesWithout, sentIndex } from '@/features/projects/lib/pieces-patch';
import { RoundTable } from '@/features/patterns/components/round-table';
import { entriesQueryOptions } from '@/features/journal/api/get-entries';
import { journalKeys } from '@/features/journal/api/keys';
import { tallyKeys } from '@/features/tally/api/keys';
import { ProjectDetailsForm } from '@/features/projects/components/project-details-form';
import { projectStatuses, StatusBadge } from '@/features/projects/components/status';
import { useYarns } from '@/features/yarns/api/get-yarns';
import { HookRollCheck } from '@/features/hooks/components/hook-roll-check';
import { JournalTimeline } from '@/features/journal/components/journal-timeline';
import { SharePanel } from '@/features/showcase/components/share-panel';
import { yarnKeys } from '@/features/yarns/api/keys';
import type { Project, ProjectPiece } from '@/types/api';

function formatDay(iso: string) {
  const d = new Date(`${iso}T12:00:00`);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleDateString(undefined, { day: 'numeric', month: 'short', year: 'numeric' });
}

/** The yarn weight the silhouette sizes a piece by: the piece's own yarn if the materials name it, else the first. */
function weightFor(project: Project, yarnNames: string[]) {
  const yarns = project.materials.yarns;
  return (yarns.find((y) => yarnNames.includes(y.name) && y.weight != null) ?? yarns.find((y) => y.weight != null))?.weight ?? null;
}

export default function ProjectRoute() {
  const { projectId } = useParams();
  const id = Number(projectId);
  const [deleted, setDeleted] = useState(false);
  const project = useProject(id, { enabled: !deleted });
  const shelf = useYarns();
  const update = useUpdateProject(id);
  const remove = useDeleteProject(id);
  const qc = useQueryClient();
  const navigate = useNavigate();
  const [editing, setEditing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  // One piece form at a time (the unsaved-changes guard watches one form per screen).
  const [editingPiece, setEditingPiece] = useState<number | 'new' | null>(null);
  const [removingPiece, setRemovingPiece] = useState<ProjectPiece | null>(null);
  const [ordering, setOrdering] = useState(false);
  const savePieces = useUpdateProject(id, { silent: true });
  const movePiece = useUpdateProject(id);
  // The same list the journal below shows, to say how many entries a removed piece is linked from.
  const journal = useQuery({ ...entriesQueryOptions(id), enabled: project.isSuccess && !deleted });

  if (project.isPending) return <Loading label="Opening the project…" />;
  const missing = project.isError && project.error instanceof ApiError && (project.error.status === 404 || project.error.status === 422);
  // A failed refresh keeps showing the copy already at hand (e.g. offline), unless the project is gone.
  if (project.isError && (missing || !project.data)) {
    return (
      <div className="flex flex-col gap-4">
        <Banner tone="warning" title={missing ? 'That project could not be found' : 'The project did not load'}>
          {missing ? 'It may have been deleted, or the link is wrong.' : project.error?.message}
        </Banner>
        <ButtonLink to={paths.projects} variant="secondary">
          Back to your projects
        </ButtonLink>
      </div>
    );
  }
  const p = project.data;
  // The piece being worked: the first one not yet done.
  const current = p.pieces.find((pc) => pc.totals.rounds > 0 && pc.totals.copiesDone < pc.copies);

  const piecesSaved = (pieceIds: number[]) => {
    // Entries show the piece's name, and the Tally's count of an edited piece may have moved.
    void qc.invalidateQueries({ queryKey: journalKeys.project(id) });
    for (const pieceId of pieceIds) void qc.invalidateQueries({ queryKey: tallyKeys.piece(pieceId) });
  };
  const editorFor = (piece?: ProjectPiece) => (
    <PieceEditor
      piece={piece}
      terms={p.terms}
      yarnNames={p.materials.yarns.map((y) => y.name)}
      RoundTable={RoundTable}
      sentAt={sentIndex(p.pieces, piece?.id)}
      saving={savePieces.isPending}
      saveError={savePieces.error}
      onCancel={() => {
        savePieces.reset();
        setEditingPiece(null);
      }}
      onRemove={piece ? () => setRemovingPiece(piece) : undefined}
      onSave={(values) =>
        savePieces.mutateAsync({ pieces: piecesWith(p.pieces, values) }).then((saved) => {
          setEditingPiece(null);
          piecesSaved(piece ? [piece.id] : []);
          toast.success(piece ? `Saved ${values.name}.` : `Added ${values.name}.`);
          return saved;
        })
      }
    />
  );

  const setStatus = (status: ProjectStatus) => update.mutate({ status }, { onSuccess: () => toast.success(`Marked as ${projectStatusLabels[status].toLowerCase()}.`) });

  return (
    <article className="flex flex-col gap-6">
      <div>
        <Link to={paths.projects} className="-ml-2 inline-flex min-h-tap items-center gap-1 rounded-soft px-2 font-semibold text-moss dark:text-[#9cc3a8]">
          <ArrowLeft aria-hidden className="h-5 w-5" /> Projects
        </Link>
        <header className="mt-1 flex flex-col gap-2">
          <h1 className="text-2xl font-bold leading-tight sm:text-3xl">{p.title}</h1>
          <div className="flex flex-wrap items-center gap-x-3 gap-y-1 text-sm text-ink/80 dark:text-oat/80">
            <StatusBadge status={p.status} />
            {p.recipient ? (
              <span className="inline-flex items-center gap-1">
                <Gift aria-hidden className="h-4 w-4" /> for {p.recipient}
              </span>
            ) : null}
            {p.startedOn ? (
              <span className="inline-flex items-center gap-1 tabular">
                <Calendar aria-hidden className="h-4 w-4" /> started {formatDay(p.startedOn)}
                {p.finishedOn ? `, finished ${formatDay(p.finishedOn)}` : ''}
              </span>
            ) : p.finishedOn ? (
              <span className="tabular">finished {formatDay(p.finishedOn)}</span>
            ) : null}
          </div>
          {p.patternCredit ? (
            <p className="flex items-start gap-1.5 text-sm">
              <BookOpen aria-hidden className="mt-0.5 h-4 w-4 shrink-0 text-moss dark:text-[#9cc3a8]" />
              <span>
                From{' '}
                {p.patternId ? (
                  <Link to={paths.pattern(p.patternId)} className="font-semibold underline">
                    {p.patternCredit.title}
                  </Link>
                ) : (
                  <span className="font-semibold">{p.patternCredit.title}</span>
                )}
                {p.patternCredit.designerCredit ? ` by ${p.patternCredit.designerCredit}` : ''}
              </span>
            </p>
          ) : null}
        </header>
      </div>

      <Cautions cautions={p.cautions} />

      <SelectField label="Status" value={p.status} disabled={update.isPending} onChange={(e) => setStatus(e.target.value as ProjectStatus)} className="max-w-xs">
        {projectStatuses.map((s) => (
          <option key={s} value={s}>
            {projectStatusLabels[s]}
          </option>
        ))}
      </SelectField>

      <section aria-labelledby="pieces-heading" className="flex flex-col gap-3">
        <div className="flex flex-wrap items-center justify-between gap-2">
          <h2 id="pieces-heading" className="text-xl font-bold">
            Pieces
          </h2>
          {p.pieces.length > 1 && editingPiece === null ? (
            <Button variant="quiet" aria-pressed={ordering} onClick={() => setOrdering((v) => !v)}>
              {ordering ? <Check aria-hidden className="h-5 w-5" /> : <ArrowUpDown aria-hidden className="h-5 w-5" />}
              {ordering ? 'Done ordering' : 'Change order'}
            </Button>
          ) : null}
        </div>
        {p.pieces.length ? (
          <ul className="grid gap-4 md:grid-cols-2">
            {p.pieces.map((piece, i) => (
              <li key={piece.id} className={editingPiece === piece.id ? 'md:col-span-2' : undefined}>
                {editingPiece === piece.id ? (
                  editorFor(piece)
                ) : (
                  <PieceCard
                    projectId={p.id}
                    piece={piece}
                    terms={p.terms}
                    yarnWeight={weightFor(p, piece.yarns)}
                    showShape={piece.id === current?.id}
                    compact={ordering}
                    actions={
                      ordering ? (
                        <>
                          <Button
                            variant="secondary"
                            aria-label={`Move ${piece.name} earlier`}
                            disabled={i === 0 || movePiece.isPending}
                            onClick={() => movePiece.mutate({ pieces: piecesMoved(p.pieces, piece.id, -1) })}
                            className="px-3"
                          >
                            <ArrowUp aria-hidden className="h-5 w-5" />
                          </Button>
                          <Button
                            variant="secondary"
                            aria-label={`Move ${piece.name} later`}
                            disabled={i === p.pieces.length - 1 || movePiece.isPending}
                            onClick={() => movePiece.mutate({ pieces: piecesMoved(p.pieces, piece.id, 1) })}
                            className="px-3"
                          >
                            <ArrowDown aria-hidden className="h-5 w-5" />
                          </Button>
                        </>
                      ) : editingPiece === null ? (
                        <Button variant="quiet" aria-label={`Edit ${piece.name}`} onClick={() => setEditingPiece(piece.id)} className="px-3">
                          <Pencil aria-hidden className="h-4 w-4" /> Edit
                        </Button>
                      ) : null
                    }
                  />
                )}
                {editingPiece !== piece.id && !ordering && piece.hookMm ? <HookRollCheck mm={piece.hookMm} /> : null}
              </li>
            ))}
          </ul>
        ) : editingPiece !== 'new' ? (
          <p className="text-ink/70 dark:text-oat/70">This project has no pieces yet.</p>
        ) : null}
        {editingPiece === 'new' ? (
          editorFor()
        ) : editingPiece === null && !ordering ? (
          <Button variant="secondary" className="self-start" onClick={() => setEditingPiece('new')}>
            <Plus aria-hidden className="h-5 w-5" /> Add a piece
          </Button>
        ) : null}
      </section>
      <RemovePieceDialog
        piece={removingPiece}
        fromPattern={p.patternCredit != null}
        journalEntries={journal.data ? journal.data.filter((e) => e.pieceId === removingPiece?.id).length : null}
        pending={savePieces.isPending}
        onCancel={() => setRemovingPiece(null)}
        onConfirm={() => {
          const gone = removingPiece!;
          savePieces.mutate(
            { pieces: piecesWithout(p.pieces, gone.id) },
            {
              onSuccess: () => {
                setRemovingPiece(null);
                setEditingPiece(null);
                piecesSaved([]);
                toast.success(`Removed ${gone.name}.`);
              },
              // The piece form (still open behind the dialog) shows why.
              onError: () => setRemovingPiece(null),
            },
          );
        }}
      />

      <Card className="p-4 sm:p-5">
        <MaterialsSection
          materials={p.materials}
          shelf={shelf.data ?? []}
          saving={update.isPending}
          onSave={(materials, done) =>
            update.mutate(
              { materials },
              {
                onSuccess: () => {
                  done();
                  // What is left on the shelf depends on what projects used.
                  void qc.invalidateQueries({ queryKey: yarnKeys.all });
                },
              },
            )
          }
        />
      </Card>

      <Card className="p-4 sm:p-5">
        <div className="flex items-center justify-between gap-3">
          <h2 className="text-xl font-bold">{editing ? 'Edit the project' : 'Notes'}</h2>
          {!editing ? (
            <Button variant="quiet" onClick={() => setEditing(true)}>
              <Pencil aria-hidden className="h-4 w-4" /> Edit details
            </Button>
          ) : null}
        </div>
        {editing ? (
          <div className="mt-3">
            <ProjectDetailsForm
              project={p}
              pending={update.isPending}
              onCancel={() => setEditing(false)}
              onSave={(v) => update.mutate({ ...v, recipient: v.recipient || null, notes: v.notes || null }, { onSuccess: () => setEditing(false) })}
            />
          </div>
        ) : p.notes ? (
          <p className="mt-2 whitespace-pre-wrap leading-relaxed">{p.notes}</p>
        ) : (
          <p className="mt-2 text-ink/70 dark:text-oat/70">No notes yet.</p>
        )}
      </Card>

      {/* journal timeline (issue 7) */}
      <JournalTimeline
        projectId={p.id}
        pieces={p.pieces.map((piece) => ({ id: piece.id, name: piece.name }))}
        onCoverChange={() => void qc.invalidateQueries({ queryKey: projectKeys.detail(id) })}
      />

      {/* sharing (issue 8) */}
      <SharePanel projectId={p.id} title={p.title} onChanged={() => qc.invalidateQueries({ queryKey: projectKeys.detail(id) })} />

      <section aria-label="Delete" className="border-t border-wool pt-6 dark:border-[#4a423c]">
        <Button variant="quiet" className="text-clay! dark:text-[#e59b7c]!" onClick={() => setConfirming(true)}>
          <Trash2 aria-hidden className="h-5 w-5" /> Delete this project
        </Button>
      </section>
      <ConfirmDialog
        open={confirming}
        title="Delete this project?"
        confirmLabel="Delete the project"
        pending={remove.isPending}
        onCancel={() => setConfirming(false)}
        onConfirm={() =>
          remove.mutate(undefined, {
            onSuccess: () => {
              setDeleted(true);
              setConfirming(false);
              toast.success(`Deleted “${p.title}”.`);
              // Drop the stored copy only once this page has gone, or it would ask the server for it again.
              void Promise.resolve(navigate(paths.projects, { replace: true })).then(() => qc.removeQueries({ queryKey: projectKeys.detail(id) }));
            },
          })
        }
      >
        <p>
          “{p.title}” goes for good, with its pieces, counts, placements, journal and photos. The pattern it came from stays.
        </p>
      </ConfirmDialog>
    </article>
  );
}
