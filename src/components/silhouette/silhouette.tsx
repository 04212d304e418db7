import { useId } from 'react';
import { Ruler } from 'lucide-react';
import { cn } from '@/utils/cn';
import { roundTo, silhouetteShape, type SilhouetteMark, type SilhouetteRound, type StitchSize } from './geometry';

const VB_W = 340;
const SHAPE_W = 170; // room for the widest round
const SHAPE_MAX_H = 280;
const AXIS_X = 30 + SHAPE_W / 2;
const LABEL_X = 30 + SHAPE_W + 14;
const PAD = 14;

const short = (s: string, n = 20) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

/**
 * The silhouette: a side profile drawn from a piece's stitch counts, with its estimated finished size and
 * marks at given rounds (placement notes, placements recorded while counting).
 */
export function Silhouette({
  rounds,
  size,
  marks = [],
  title = 'Silhouette',
  className,
}: {
  rounds: SilhouetteRound[];
  size: StitchSize;
  marks?: SilhouetteMark[];
  title?: string;
  className?: string;
}) {
  const titleId = useId();
  const shape = silhouetteShape(rounds, size, marks);

  if (shape.kind === 'empty') {
    return <p className={cn('text-sm text-ink/70 dark:text-oat/70', className)}>The silhouette appears once the piece has rounds.</p>;
  }
  if (shape.kind === 'flat') {
    return (
      <p className={cn('flex items-start gap-2 text-sm text-ink/80 dark:text-oat/80', className)}>
        <Ruler aria-hidden className="mt-0.5 h-4 w-4 shrink-0" />
        <span>
          This piece is worked in rows ({shape.rows} {shape.rows === 1 ? 'row' : 'rows'}), so it lies flat: no silhouette is drawn, because a profile
          would not tell you anything true about its shape.
        </span>
      </p>
    );
  }

  const scale = Math.min(SHAPE_W / Math.max(shape.widthCm, 0.1), SHAPE_MAX_H / Math.max(shape.heightCm, 0.1));
  const hPx = shape.heightCm * scale;
  const vbH = hPx + PAD * 2;
  const y = (cm: number) => PAD + cm * scale;
  const right = shape.points.map((p) => `${AXIS_X + p.radiusCm * scale},${y(p.yCm)}`);
  const left = [...shape.points].reverse().map((p) => `${AXIS_X - p.radiusCm * scale},${y(p.yCm)}`);
  const path = `M ${right.join(' L ')} L ${left.join(' L ')} Z`;
  const first = shape.points[0];
  const last = shape.points[shape.points.length - 1];
  const ticks = shape.points.filter((p, i) => i === 0 || i === shape.points.length - 1 || p.round % 5 === 0);
  const dims = `about ${roundTo(shape.widthCm)} cm wide and ${roundTo(shape.heightCm)} cm tall (${roundTo(shape.widthIn)} × ${roundTo(shape.heightIn)} in)`;

  return (
    <figure className={cn('flex flex-col gap-2', className)}>
      <svg
        viewBox={`0 0 ${VB_W} ${vbH}`}
        role="img"
        aria-labelledby={titleId}
        className="h-auto w-full max-w-sm text-ink dark:text-oat"
        style={{ maxHeight: `${Math.max(vbH, 120)}px` }}
      >
        <title id={titleId}>{`${title}: ${dims}, estimate, from round ${first.round} to round ${last.round}.`}</title>
        <line x1={AXIS_X} x2={AXIS_X} y1={PAD - 6} y2={vbH - PAD + 6} stroke="currentColor" strokeOpacity={0.25} strokeDasharray="3 4" />
        <path d={path} className="fill-wool stroke-moss dark:fill-[#4a423c] dark:stroke-[#9cc3a8]" strokeWidth={2} strokeLinejoin="round" />
        {ticks.map((p) => (
          <g key={`t${p.round}`}>
            <line x1={AXIS_X - p.radiusCm * scale - 4} x2={AXIS_X - p.radiusCm * scale} y1={y(p.yCm)} y2={y(p.yCm)} stroke="currentColor" strokeOpacity={0.4} />
            <text x={4} y={y(p.yCm) + 4} fontSize={11} fill="currentColor" fillOpacity={0.7} className="tabular">
              {`R${p.round}`}
            </text>
          </g>
        ))}
        {shape.marks.map((m, i) => {
          const my = y(m.yCm);
          return (
            <g key={`m${i}`}>
              <title>{`${m.label} at round ${m.round}`}</title>
              <line x1={AXIS_X - SHAPE_W / 2} x2={LABEL_X - 4} y1={my} y2={my} className="stroke-clay" strokeWidth={1.5} strokeDasharray="5 3" />
              <circle cx={LABEL_X - 4} cy={my} r={3.5} className="fill-clay" />
              <text x={LABEL_X + 4} y={my + 4} fontSize={12} fontWeight={600} fill="currentColor">
                {`◆ ${short(m.label)}`}
              </text>
            </g>
          );
        })}
      </svg>
      <figcaption className="text-sm">
        <span className="font-semibold">Estimate:</span> {dims}. Worked out from {shape.size.source}.
        {shape.marks.length ? <span className="block">◆ marks show where parts go.</span> : null}
      </figcaption>
    </figure>
  );
}
