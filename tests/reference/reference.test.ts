import { describe, expect, it } from 'vitest';
import { formatHook, usHookSize } from '@/reference/hooks';
import { categoryForPly, defaultScGaugeCm, yarnWeight, yarnWeightLabel, yarnWeights } from '@/reference/yarn-weights';
import { cautionsFor } from '@/reference/safety';

describe('hook sizes', () => {
  // Source: Craft Yarn Council hook chart ("Getting Started", S6) and the
  // conversion charts S9, S10 and S13 of shared/reference/standards.md §2 — these rows agree in all of them.
  it.each([
    [2.25, 'B-1'],
    [2.75, 'C-2'],
    [3.25, 'D-3'],
    [3.5, 'E-4'],
    [3.75, 'F-5'],
    [4, 'G-6'],
    [4.5, '7'],
    [5, 'H-8'],
    [5.5, 'I-9'],
    [6, 'J-10'],
    [6.5, 'K-10½'],
    [8, 'L-11'],
  ])('%s mm is US %s', (mm, us) => {
    expect(usHookSize(mm)).toBe(us);
  });

  it('gives no US size where the chart has none, and never guesses from a neighbour', () => {
    expect(usHookSize(2.5)).toBeNull();
    expect(usHookSize(3)).toBeNull();
    expect(usHookSize(7)).toBeNull();
  });

  it('reads 15.75 mm as Q (S10 prints "15.75/16")', () => {
    expect(usHookSize(15.75)).toBe('Q');
  });

  it('formats mm with the US size beside it', () => {
    expect(formatHook(3.5)).toBe('3.5 mm (US E-4)');
    expect(formatHook(2.5)).toBe('2.5 mm');
  });
});

describe('Craft Yarn Council Standard Yarn Weight System', () => {
  // Source: CYC Standard Yarn Weight System, reprinted in S1 and S2 (standards.md §1). Categories 1–5 agree in
  // every edition; those are the rows checked exactly.
  it('has the eight categories 0–7 with their names', () => {
    expect(yarnWeights.map((w) => `${w.category} ${w.name}`)).toEqual([
      '0 Lace',
      '1 Super Fine',
      '2 Fine',
      '3 Light',
      '4 Medium',
      '5 Bulky',
      '6 Super Bulky',
      '7 Jumbo',
    ]);
  });

  it.each([
    [1, [21, 32], [2.25, 3.5]],
    [2, [16, 20], [3.5, 4.5]],
    [3, [12, 17], [4.5, 5.5]],
    [4, [11, 14], [5.5, 6.5]],
    [5, [8, 11], [6.5, 9]],
  ])('category %i: sc per 4 in %j, hook %j mm', (cat, gauge, hooks) => {
    expect(yarnWeight(cat)!.scPer4in).toEqual(gauge);
    expect(yarnWeight(cat)!.hookMm).toEqual(hooks);
  });

  it('labels DK as Light (3)', () => {
    expect(yarnWeightLabel(3)).toBe('DK, Light (3)');
  });

  // Source: S17 (AU/NZ ply guide) with S1: 8 ply is DK, Light (3); 10 ply worsted (4); 12 ply bulky (5).
  it('maps AU/NZ/UK ply names to categories', () => {
    expect(categoryForPly('8 ply')).toBe(3);
    expect(categoryForPly('8-ply')).toBe(3);
    expect(categoryForPly('10 ply')).toBe(4);
    expect(categoryForPly('12 ply')).toBe(5);
    expect(categoryForPly('5 ply')).toBe(2);
    expect(categoryForPly('worsted')).toBeUndefined();
  });

  it('derives a default sc stitch width from the middle of the gauge range', () => {
    // Light (3): 12–17 sc per 4 in → 14.5 per 10.16 cm → about 0.70 cm a stitch.
    expect(defaultScGaugeCm(3).stitchWidth).toBeCloseTo(10.16 / 14.5, 5);
  });
});

describe('toy-safety cautions', () => {
  it('warns about small parts when safety eyes, buttons or beads are used', () => {
    const c = cautionsFor({ notions: [{ kind: 'safety_eyes' }, { kind: 'stuffing' }] });
    expect(c).toHaveLength(1);
    expect(c[0].code).toBe('small-parts');
    expect(c[0].message).toMatch(/choking hazard for children under 3/);
    expect(c[0].message).toMatch(/16 CFR 1501/);
    expect(c[0].message).toMatch(/ASTM F963/);
    expect(c[0].message).toMatch(/EN 71-1/);
    expect(c[0].message).toMatch(/embroider/i);
  });

  it('warns for a child under 3 even without small parts, and says nothing otherwise', () => {
    expect(cautionsFor({ forYoungChild: true }).map((c) => c.code)).toEqual(['young-child']);
    expect(cautionsFor({ notions: [{ kind: 'stuffing' }, { kind: 'stitch_markers' }] })).toEqual([]);
  });
});
