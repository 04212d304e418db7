import { describe, expect, it } from 'vitest';
import { render, screen } from '@testing-library/react';
import { placementMarks, silhouetteShape, stitchSize, yAtRound } from '@/components/silhouette/geometry';
import { Silhouette } from '@/components/silhouette/silhouette';
import type { Note } from '@/engine/types';

const tube = (n: number, sts: number) =>
  Array.from({ length: n }, (_, i) => ({ number: i + 1, stitches: sts, kind: 'round' as const }));

describe('stitch size for the silhouette', () => {
  it('comes from the gauge: cm per stitch = 10 ÷ sts per 10 cm, or 10.16 ÷ sts per 4 in', () => {
    // Finished-size arithmetic, standards.md §9 (1 in = 2.54 cm exactly).
    const metric = stitchSize({ stitches: 20, rows: 25, over: '10cm' });
    expect(metric.stitchWidthCm).toBeCloseTo(0.5, 10);
    expect(metric.rowHeightCm).toBeCloseTo(0.4, 10);
    const imperial = stitchSize({ stitches: 16, rows: 16, over: '4in' });
    expect(imperial.stitchWidthCm).toBeCloseTo(0.635, 10);
    expect(imperial.source).toMatch(/16 sts and 16 rows per 4 in/);
  });

  it('falls back to the middle of the CYC sc range for the yarn weight when there is no gauge', () => {
    // Source: Craft Yarn Council Standard Yarn Weight System — Light (3) is 12–17 sc per 4 in, so 14.5.
    const s = stitchSize(null, 3);
    expect(s.stitchWidthCm).toBeCloseTo(10.16 / 14.5, 10);
    expect(s.source).toMatch(/DK, Light \(3\)/);
    expect(stitchSize(null).source).toMatch(/no gauge or yarn weight given/);
  });
});

describe('silhouette geometry', () => {
  const size = { stitchWidthCm: 0.5, rowHeightCm: 0.4, source: 'test' };

  it('draws a straight tube as rounds × row height tall and stitches × width ÷ π wide', () => {
    const s = silhouetteShape(tube(10, 20), size);
    if (s.kind !== 'rounds') throw new Error(s.kind);
    expect(s.heightCm).toBeCloseTo(10 * 0.4, 10);
    expect(s.widthCm).toBeCloseTo((20 * 0.5) / Math.PI, 10);
    expect(s.points[0].radiusCm).toBeCloseTo((20 * 0.5) / (2 * Math.PI), 10);
    expect(s.widthIn).toBeCloseTo(s.widthCm / 2.54, 10);
    expect(s.heightIn).toBeCloseTo(s.heightCm / 2.54, 10);
  });

  it('makes a ball about as tall as it is wide, widest in the middle', () => {
    const counts = [6, 12, 18, 24, 30, 36, 36, 36, 36, 36, 36, 36, 30, 24, 18, 12, 6];
    const s = silhouetteShape(
      counts.map((stitches, i) => ({ number: i + 1, stitches })),
      { stitchWidthCm: 10 / 22, rowHeightCm: 10 / 24, source: 'test' },
    );
    if (s.kind !== 'rounds') throw new Error(s.kind);
    expect(s.widthCm).toBeCloseTo((36 * 10) / 22 / Math.PI, 10);
    expect(s.heightCm / s.widthCm).toBeGreaterThan(0.75);
    expect(s.heightCm / s.widthCm).toBeLessThan(1.4);
    // increases rise less than a full row each: the ball is shorter than 17 rows
    expect(s.heightCm).toBeLessThan(17 * (10 / 24));
    const ys = s.points.map((p) => p.yCm);
    expect([...ys].sort((a, b) => a - b)).toEqual(ys);
  });

  it('puts marks at their round, halves between two rounds, and drops marks outside the piece', () => {
    const s = silhouetteShape(tube(12, 24), size, [
      { round: 9.5, label: 'Eyes' },
      { round: 3, label: 'Arm' },
      { round: 40, label: 'Nowhere' },
    ]);
    if (s.kind !== 'rounds') throw new Error(s.kind);
    expect(s.marks.map((m) => m.label)).toEqual(['Eyes', 'Arm']);
    expect(s.marks[0].yCm).toBeCloseTo((yAtRound(s.points, 9)! + yAtRound(s.points, 10)!) / 2, 10);
    expect(s.marks[1].yCm).toBeCloseTo(s.points[2].yCm, 10);
  });

  it('gives no shape for a piece worked in rows', () => {
    expect(
      silhouetteShape(
        [
          { number: 1, stitches: 10, kind: 'row' },
          { number: 2, stitches: 10, kind: 'row' },
        ],
        size,
      ),
    ).toEqual({ kind: 'flat', rows: 2 });
    expect(silhouetteShape([], size)).toEqual({ kind: 'empty' });
  });

  it('reads placement notes as marks', () => {
    const note = (n: Partial<Note>): Note => ({
      line: 0,
      text: 'x',
      kind: 'placement',
      afterRound: null,
      beforeRound: null,
      ...n,
    });
    expect(
      placementMarks([
        note({
          text: 'Place safety eyes between Rnds 9 and 10',
          placement: { label: 'Safety eyes', betweenRounds: [9, 10], atRound: null, apart: 6 },
        }),
        note({
          text: 'Sew the arm at Rnd 4',
          placement: { label: 'Arm', betweenRounds: null, atRound: 4, apart: null },
        }),
        note({ text: 'Stuff firmly', kind: 'stuffing', afterRound: 8, beforeRound: 9 }),
        note({ text: 'Add the tail here', afterRound: 5, beforeRound: 6 }),
      ]),
    ).toEqual([
      { round: 9.5, label: 'Safety eyes' },
      { round: 4, label: 'Arm' },
      { round: 5.5, label: 'Add the tail here' },
    ]);
  });
});

describe('<Silhouette>', () => {
  it('draws the profile with its size in cm and in, labelled as an estimate, and the marks', () => {
    render(
      <Silhouette
        rounds={tube(10, 20)}
        size={{ stitchWidthCm: 0.5, rowHeightCm: 0.4, source: 'the gauge' }}
        marks={[{ round: 5, label: 'Safety eyes' }]}
        title="Leg"
      />,
    );
    const img = screen.getByRole('img');
    expect(img).toHaveAccessibleName(/Leg: about 3\.2 cm wide and 4 cm tall \(1\.3 × 1\.6 in\), estimate/);
    expect(screen.getByText(/Estimate:/)).toBeInTheDocument();
    expect(screen.getByText('◆ Safety eyes')).toBeInTheDocument();
  });

  it('shows a note instead of a shape for flat pieces', () => {
    render(
      <Silhouette
        rounds={[{ number: 1, stitches: 10, kind: 'row' }]}
        size={{ stitchWidthCm: 0.5, rowHeightCm: 0.4, source: 'x' }}
      />,
    );
    expect(screen.queryByRole('img')).not.toBeInTheDocument();
    expect(screen.getByText(/worked in rows/)).toBeInTheDocument();
  });
});
