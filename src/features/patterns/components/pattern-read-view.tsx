import { useMemo } from 'react';
import { checkPiece } from '@/engine';
import { formatHook } from '@/reference/hooks';
import type { Pattern, PatternPiece } from '@/types/api';
import { Silhouette } from '@/components/silhouette/silhouette';
import { placementMarks, stitchSize } from '@/components/silhouette/geometry';
import { Banner } from '@/components/ui/banner';
import { Card } from '@/components/ui/card';
import { RoundTable } from './round-table';

function PieceRead({ piece, pattern }: { piece: PatternPiece; pattern: Pattern }) {
  const check = useMemo(
    () => checkPiece(piece.instructions, { terms: pattern.terms }),
    [piece.instructions, pattern.terms],
  );
  const weight =
    pattern.materials.yarns.find((y) => piece.yarns.includes(y.name) && y.weight != null)?.weight ?? null;
  return (
    <Card className="flex flex-col gap-4">
      <h3 className="text-xl font-bold">
        {piece.name}
        {piece.copies > 1 ? <span className="ml-2 text-base font-semibold">make {piece.copies}</span> : null}
      </h3>
      {piece.hookMm != null ? <p className="text-sm">Hook: {formatHook(piece.hookMm)}</p> : null}
      <div className="grid gap-4 lg:grid-cols-2">
        <pre
          aria-label={`${piece.name} instructions`}
          className="overflow-x-auto rounded-soft bg-oat px-4 py-3 font-sans tabular text-base leading-7 whitespace-pre-wrap dark:bg-ink"
        >
          {piece.instructions}
        </pre>
        <div className="flex flex-col gap-4">
          <RoundTable check={check} />
          <Silhouette
            rounds={check.rounds.map((r) => ({ number: r.number, stitches: r.stitches, kind: r.kind }))}
            size={stitchSize(pattern.gauge, weight)}
            marks={placementMarks(check.notes)}
            title={piece.name}
          />
        </div>
      </div>
    </Card>
  );
}

/** Someone else's public pattern: to read and start a project from, not to change. */
export function PatternReadView({ pattern }: { pattern: Pattern }) {
  return (
    <div className="flex flex-col gap-5">
      <Banner tone="info" title="Read-only">
        This pattern belongs to another member. Start a project from it to keep your own copy.
      </Banner>
      {pattern.cautions.map((c) => (
        <Banner key={c.code} tone="caution" title={c.title}>
          {c.message}
        </Banner>
      ))}
      {pattern.skillNotes ? <p>{pattern.skillNotes}</p> : null}
      {pattern.pieces.map((p) => (
        <PieceRead key={p.id} piece={p} pattern={pattern} />
      ))}
    </div>
  );
}
