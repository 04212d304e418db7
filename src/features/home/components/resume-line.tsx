import { Play } from 'lucide-react';
import { ButtonLink } from '@/components/ui/button';
import { useProject } from '@/features/projects/api/get-project';
import { paths } from '@/config/paths';
import type { Project, ProjectPiece } from '@/types/api';

const finished = (p: ProjectPiece) => p.totals.rounds > 0 && p.totals.copiesDone >= p.copies;

/**
 * The piece to pick up: the unfinished one counted most recently, or else the first one not yet finished.
 * Null when every piece is counted (or none can be counted).
 */
export function pieceToResume(project: Pick<Project, 'pieces'>): { piece: ProjectPiece; started: boolean } | null {
  const open = project.pieces.filter((p) => p.totals.rounds > 0 && !finished(p));
  const worked = open
    .filter((p) => p.progress.done > 0 && p.progress.updatedAt)
    .sort((a, b) => (b.progress.updatedAt ?? '').localeCompare(a.progress.updatedAt ?? ''));
  if (worked[0]) return { piece: worked[0], started: true };
  return open[0] ? { piece: open[0], started: false } : null;
}

/** Where the maker is in a piece, in words: "Body · round 11 of 16", with the copy when there are several. */
export function resumeWords(piece: ProjectPiece): string {
  const round = Math.min(piece.progress.round + 1, piece.totals.rounds);
  const copy = piece.copies > 1 ? ` · copy ${piece.progress.copy} of ${piece.copies}` : '';
  return `${piece.name}${copy} · round ${round} of ${piece.totals.rounds}`;
}

/** One line under a project on the home screen, with the shortest way back into the Tally. */
export function ResumeLine({ projectId }: { projectId: number }) {
  const project = useProject(projectId);
  if (!project.data) return null;
  const next = pieceToResume(project.data);
  if (!next) {
    return <p className="text-sm text-ink/70 dark:text-oat/70">Every piece is counted. Time to stuff and sew.</p>;
  }
  const words = resumeWords(next.piece);
  return (
    <div className="flex flex-wrap items-center justify-between gap-3">
      <p className="text-sm">
        <span className="sr-only">{next.started ? 'Last counted: ' : 'Next up: '}</span>
        <span className="tabular">{words}</span>
      </p>
      <ButtonLink
        to={paths.tally(projectId, next.piece.id)}
        variant="primary"
        aria-label={`${next.started ? 'Go on counting' : 'Start counting'} ${words}`}
      >
        <Play aria-hidden className="h-5 w-5" /> {next.started ? 'Go on counting' : 'Start counting'}
      </ButtonLink>
    </div>
  );
}
