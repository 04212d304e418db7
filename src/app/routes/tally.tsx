import { useEffect, useMemo } from 'react';
import { Link, useParams } from 'react-router-dom';
import { useQueryClient } from '@tanstack/react-query';
import { checkPiece } from '@/engine';
import { stitchSize } from '@/components/silhouette/geometry';
import { Loading } from '@/components/ui/page';
import { paths } from '@/config/paths';
import { ApiError } from '@/lib/api-client';
import { useMe } from '@/features/auth/api/get-me';
import { useProject } from '@/features/projects/api/get-project';
import { projectKeys } from '@/features/projects/api/keys';
import { TallyScreen } from '@/features/tally/components/tally-screen';
import { shapeOf, totalSteps } from '@/schemas/progress-position';
import type { Project } from '@/types/api';

/** Steps still to count on the project's other pieces (the engine's steps, the server's progress). */
function otherRemaining(project: Project, pieceId: number) {
  let left = 0;
  for (const p of project.pieces) {
    if (p.id === pieceId) continue;
    const total = totalSteps(shapeOf(checkPiece(p.instructions, { terms: project.terms }).rounds, p.copies));
    left += Math.max(0, total - (p.progress?.done ?? 0));
  }
  return left;
}

export default function TallyRoute() {
  const params = useParams();
  const projectId = Number(params.projectId);
  const pieceId = Number(params.pieceId);
  const project = useProject(projectId);
  const me = useMe();
  const qc = useQueryClient();

  // The project page shows progress and placements too: leaving the Tally, let it ask again.
  useEffect(
    () => () => void qc.invalidateQueries({ queryKey: projectKeys.detail(projectId) }),
    [qc, projectId],
  );

  const data = project.data;
  const piece = data?.pieces.find((p) => p.id === pieceId);
  const others = useMemo(() => (data && piece ? otherRemaining(data, piece.id) : null), [data, piece]);
  const size = useMemo(() => {
    const yarns = data?.materials.yarns ?? [];
    const weight =
      (
        yarns.find((y) => piece?.yarns.includes(y.name) && y.weight != null) ??
        yarns.find((y) => y.weight != null)
      )?.weight ?? null;
    return stitchSize(null, weight);
  }, [data, piece]);

  if (project.isPending) {
    return (
      <div className="flex min-h-dvh items-center justify-center">
        <Loading label="Opening the Tally…" />
      </div>
    );
  }
  if (!data || !piece || !me.data) {
    const missing = !data
      ? project.error instanceof ApiError && (project.error.status === 404 || project.error.status === 422)
      : true;
    return (
      <div className="flex min-h-dvh flex-col items-center justify-center gap-4 p-6 text-center">
        <p className="text-xl font-bold">
          {missing ? 'That piece could not be found.' : 'The Tally cannot open this piece right now.'}
        </p>
        <p>
          {missing
            ? 'It may have been removed from the project, or the link is wrong.'
            : project.error?.message}
        </p>
        <Link
          to={data ? paths.project(projectId) : paths.projects}
          className="min-h-tap rounded-soft bg-moss px-5 py-3 font-bold text-oat"
        >
          {data ? `Back to ${data.title}` : 'Back to your projects'}
        </Link>
      </div>
    );
  }

  return (
    <TallyScreen
      key={piece.id}
      piece={{ id: piece.id, name: piece.name, copies: piece.copies, instructions: piece.instructions }}
      memberId={me.data.id}
      terms={data.terms}
      projectTitle={data.title}
      backTo={paths.project(projectId)}
      otherPiecesRemaining={others}
      cautions={data.cautions.map((c) => c.message)}
      stitchSize={size}
      onPieceChanged={() => void qc.invalidateQueries({ queryKey: projectKeys.detail(projectId) })}
    />
  );
}
