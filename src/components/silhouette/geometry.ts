// Pure geometry for the silhouette: a side profile of a piece worked in rounds, drawn from its stitch counts.
// Shared by the pattern editor, the project page and the Tally, so it takes plain numbers, not engine objects.
import type { Note } from '@/engine/types';
import { defaultScGaugeCm, yarnWeightLabel } from '@/reference/yarn-weights';

export const CM_PER_INCH = 2.54;

export interface SilhouetteRound {
  number: number;
  stitches: number;
  kind?: 'round' | 'row';
}

export interface SilhouetteMark {
  /** Round number the mark sits at; halves sit between two rounds (9.5 is between Rnds 9 and 10). */
  round: number;
  label: string;
}

export interface GaugeLike {
  stitches: number;
  rows: number;
  over: '10cm' | '4in';
}

export interface StitchSize {
  stitchWidthCm: number;
  rowHeightCm: number;
  /** Where the size came from, in words for the maker. */
  source: string;
}

/**
 * cm per stitch = 10 ÷ sts per 10 cm, or 10.16 ÷ sts per 4 in (1 in = 2.54 cm exactly); rows the same way.
 * Without a gauge, the middle of the Craft Yarn Council sc range for the yarn weight (defaultScGaugeCm).
 */
export function stitchSize(gauge: GaugeLike | null | undefined, weight?: number | null): StitchSize {
  if (gauge && gauge.stitches > 0 && gauge.rows > 0) {
    const span = gauge.over === '4in' ? 4 * CM_PER_INCH : 10;
    const per = gauge.over === '4in' ? '4 in' : '10 cm';
    return {
      stitchWidthCm: span / gauge.stitches,
      rowHeightCm: span / gauge.rows,
      source: `the gauge, ${gauge.stitches} sts and ${gauge.rows} rows per ${per}`,
    };
  }
  const w = weight ?? 3;
  const d = defaultScGaugeCm(w);
  return {
    stitchWidthCm: d.stitchWidth,
    rowHeightCm: d.rowHeight,
    source: `a typical single crochet gauge for ${yarnWeightLabel(w)} yarn${weight == null ? ' (no gauge or yarn weight given)' : ''}`,
  };
}

export interface ProfilePoint {
  round: number;
  stitches: number;
  radiusCm: number;
  /** Distance of the round's middle from the top edge of the first round. */
  yCm: number;
}

export type SilhouetteShape =
  | { kind: 'empty' }
  | { kind: 'flat'; rows: number }
  | {
      kind: 'rounds';
      points: ProfilePoint[];
      widthCm: number;
      heightCm: number;
      widthIn: number;
      heightIn: number;
      marks: Array<SilhouetteMark & { yCm: number }>;
      size: StitchSize;
    };

/**
 * radius of a round ≈ stitches × stitch width ÷ 2π. Each round adds one row height along the fabric's surface,
 * so going up it rises by √(h² − Δr²): a straight tube rises a full row per round (height = rounds × row height),
 * while a round that widens a lot mostly spreads outwards. The rise is kept to at least half a row, because
 * stuffing domes the flat increase rounds of a ball. This is an estimate; yarn, hook and hands change it.
 */
export function silhouetteShape(
  rounds: SilhouetteRound[],
  size: StitchSize,
  marks: SilhouetteMark[] = [],
): SilhouetteShape {
  if (!rounds.length) return { kind: 'empty' };
  const inRounds = rounds.filter((r) => (r.kind ?? 'round') === 'round');
  if (!inRounds.length) return { kind: 'flat', rows: rounds.length };
  const w = size.stitchWidthCm;
  const h = size.rowHeightCm;
  const points: ProfilePoint[] = [];
  let y = h / 2;
  for (const [i, r] of inRounds.entries()) {
    const radiusCm = (Math.max(0, r.stitches) * w) / (2 * Math.PI);
    if (i > 0) {
      const dr = radiusCm - points[i - 1].radiusCm;
      y += Math.sqrt(Math.max(h * h - dr * dr, (h / 2) ** 2));
    }
    points.push({ round: r.number, stitches: r.stitches, radiusCm, yCm: y });
  }
  const widthCm = 2 * Math.max(...points.map((p) => p.radiusCm));
  const heightCm = y + h / 2;
  return {
    kind: 'rounds',
    points,
    widthCm,
    heightCm,
    widthIn: widthCm / CM_PER_INCH,
    heightIn: heightCm / CM_PER_INCH,
    marks: marks.flatMap((m) => {
      const yCm = yAtRound(points, m.round);
      return yCm === null ? [] : [{ ...m, yCm }];
    }),
    size,
  };
}

/** y of a (possibly fractional) round number, between the rounds around it; null outside the piece. */
export function yAtRound(points: ProfilePoint[], round: number): number | null {
  if (!points.length) return null;
  const exact = points.find((p) => p.round === round);
  if (exact) return exact.yCm;
  for (let i = 1; i < points.length; i++) {
    const a = points[i - 1];
    const b = points[i];
    if (round > a.round && round < b.round)
      return a.yCm + ((round - a.round) / (b.round - a.round)) * (b.yCm - a.yCm);
  }
  return null;
}

/** Marks for the engine's placement notes: "between Rnds 9 and 10" sits at 9.5, "at Rnd 8" at 8. */
export function placementMarks(notes: Note[]): SilhouetteMark[] {
  return notes.flatMap((n) => {
    if (n.kind !== 'placement') return [];
    const label = n.placement?.label || n.text;
    const between = n.placement?.betweenRounds;
    if (between) return [{ round: (between[0] + between[1]) / 2, label }];
    if (n.placement?.atRound != null) return [{ round: n.placement.atRound, label }];
    if (n.afterRound != null)
      return [{ round: n.beforeRound != null ? (n.afterRound + n.beforeRound) / 2 : n.afterRound, label }];
    return [];
  });
}

export const roundTo = (n: number, digits = 1) => Number(n.toFixed(digits));
