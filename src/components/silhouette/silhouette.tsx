import { useId } from 'react';
import { Ruler } from 'lucide-react';
import { cn } from '@/utils/cn';
import {
  roundTo,
  silhouetteShape,
  type SilhouetteMark,
  type SilhouetteRound,
  type StitchSize,
} from './geometry';

const VB_W = 340;
const SHAPE_W = 170; // room for the widest round
const SHAPE_MAX_H = 280;
const AXIS_X = 30 + SHAPE_W / 2;
const LABEL_X = 30 + SHAPE_W + 14;
const PAD = 14;

const short = (s: string, n = 20) => (s.length > n ? `${s.slice(0, n - 1)}…` : s);

type Pt = [number, number];

/** A smooth line through the points (Catmull-Rom as cubic Béziers): stuffed fabric curves, it has no corners. */
function smooth(points: Pt[]): string {
  if (points.length < 3) return points.map((p) => `L ${p[0]},${p[1]}`).join(' ');
  let d = '';
  for (let i = 0; i < points.length - 1; i++) {
    const p0 = points[Math.max(0, i - 1)];
    const p1 = points[i];
    const p2 = points[i + 1];
    const p3 = points[Math.min(points.length - 1, i + 2)];
    const c1: Pt = [p1[0] + (p2[0] - p0[0]) / 6, p1[1] + (p2[1] - p0[1]) / 6];
    const c2: Pt = [p2[0] - (p3[0] - p1[0]) / 6, p2[1] - (p3[1] - p1[1]) / 6];
    d += ` C ${c1[0]},${c1[1]} ${c2[0]},${c2[1]} ${p2[0]},${p2[1]}`;
  }
  return d;
}

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
    return (
      <p className={cn('text-sm text-ink/70 dark:text-oat/70', className)}>
        The silhouette appears once the piece has rounds.
      </p>
    );
  }
  if (shape.kind === 'flat') {
    return (
      <p className={cn('flex items-start gap-2 text-sm text-ink/80 dark:text-oat/80', className)}>
        <Ruler aria-hidden className="mt-0.5 h-4 w-4 shrink-0" />
        <span>
          This piece is worked in rows ({shape.rows} {shape.rows === 1 ? 'row' : 'rows'}), so it lies flat: no
          silhouette is drawn, because a profile would not tell you anything true about its shape.
        </span>
      </p>
    );
  }

  const scale = Math.min(SHAPE_W / Math.max(shape.widthCm, 0.1), SHAPE_MAX_H / Math.max(shape.heightCm, 0.1));
  const hPx = shape.heightCm * scale;
  const vbH = hPx + PAD * 2;
  const y = (cm: number) => PAD + cm * scale;
  const right: Pt[] = shape.points.map((p) => [AXIS_X + p.radiusCm * scale, y(p.yCm)]);
  const left: Pt[] = [...shape.points].reverse().map((p) => [AXIS_X - p.radiusCm * scale, y(p.yCm)]);
  // First and last rounds are drawn as straight edges: the opening (or the closed ring) of the piece.
  const path = `M ${right[0][0]},${right[0][1]}${smooth(right)} L ${left[0][0]},${left[0][1]}${smooth(left)} Z`;
  const first = shape.points[0];
  const last = shape.points[shape.points.length - 1];
  // Round numbers down the side: the first, the last and every fifth, never so close that they overlap.
  const ticks: typeof shape.points = [];
  for (const [i, p] of shape.points.entries()) {
    const isLast = i === shape.points.length - 1;
    if (!(i === 0 || isLast || p.round % 5 === 0)) continue;
    const prev = ticks[ticks.length - 1];
    if (prev && y(p.yCm) - y(prev.yCm) < 13) {
      if (!isLast || ticks.length === 1) continue;
      ticks.pop();
    }
    ticks.push(p);
  }
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
        <title
          id={titleId}
        >{`${title}: ${dims}, estimate, from round ${first.round} to round ${last.round}.`}</title>
        <line
          x1={AXIS_X}
          x2={AXIS_X}
          y1={PAD - 6}
          y2={vbH - PAD + 6}
          stroke="currentColor"
          strokeOpacity={0.25}
          strokeDasharray="3 4"
        />
        <path
          d={path}
          className="fill-wool stroke-moss dark:fill-[#4a423c] dark:stroke-[#9cc3a8]"
          strokeWidth={2}
          strokeLinejoin="round"
        />
        {ticks.map((p) => (
          <g key={`t${p.round}`}>
            <line
              x1={AXIS_X - p.radiusCm * scale - 4}
              x2={AXIS_X - p.radiusCm * scale}
              y1={y(p.yCm)}
              y2={y(p.yCm)}
              stroke="currentColor"
              strokeOpacity={0.4}
            />
            <text
              x={4}
              y={y(p.yCm) + 4}
              fontSize={11}
              fill="currentColor"
              fillOpacity={0.7}
              className="tabular"
            >
              {`R${p.round}`}
            </text>
          </g>
        ))}
        {shape.marks.map((m, i) => {
          const my = y(m.yCm);
          return (
            <g key={`m${i}`}>
              <title>{`${m.label} at round ${m.round}`}</title>
              <line
                x1={AXIS_X - SHAPE_W / 2}
                x2={LABEL_X - 4}
                y1={my}
                y2={my}
                className="stroke-clay"
                strokeWidth={1.5}
                strokeDasharray="5 3"
              />
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
