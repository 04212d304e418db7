// The round planner: the most even round of increases or decreases, in our own notation.
import { describe, expect, it } from 'vitest';
import { checkPiece, planRound } from '@/engine';

describe('planRound', () => {
  it.each([
    // Flat circle steps (common practice, standards.md §8).
    [24, 30, '(3 sc, inc) x6'],
    [30, 24, '(3 sc, dec) x6'],
    [6, 12, 'inc x6'],
    [12, 6, 'dec x6'],
    [12, 18, '(sc, inc) x6'],
    // Uneven: shorter runs first.
    [23, 30, '(2 sc, inc) x5, (3 sc, inc) x2'],
    [7, 12, 'inc x3, (sc, inc) x2'],
    [7, 4, 'dec x2, sc, dec'],
    [25, 30, '(4 sc, inc) x5'],
    [26, 30, '(5 sc, inc) x2, (6 sc, inc) x2'],
    [24, 24, '24 sc'],
    [1, 1, 'sc'],
    [1, 2, 'inc'],
  ])('%i → %i: %s', (from, to, instruction) => {
    expect(planRound(from, to).instruction).toBe(instruction);
  });

  it.each([
    [18, 24, 'sc, inc, (2 sc, inc) x5, sc'],
    [24, 30, 'sc, inc, (3 sc, inc) x5, 2 sc'],
    [12, 18, 'inc, (sc, inc) x5, sc'],
    [30, 24, 'sc, dec, (3 sc, dec) x5, 2 sc'],
    // Nothing to shift when every stitch changes.
    [6, 12, 'inc x6'],
  ])('staggered %i → %i: %s', (from, to, instruction) => {
    expect(planRound(from, to, { staggered: true }).instruction).toBe(instruction);
  });

  it('writes UK terms when asked', () => {
    expect(planRound(24, 30, { terms: 'uk' }).instruction).toBe('(3 dc, inc) x6');
  });

  it.each([
    [0, 6, /at least 1 stitch/],
    [6, 0, /at least 1 stitch/],
    [6, 13, /at most 12 in one round/],
    [12, 5, /no fewer than 6 in one round/],
    [6.5, 12, /whole stitch counts/],
  ])('refuses %s → %s with a clear sentence', (from, to, message) => {
    expect(() => planRound(from, to)).toThrow(RangeError);
    expect(() => planRound(from, to)).toThrow(message);
  });

  it('reads back exactly for every FROM 1–150 and TO from ceil(FROM/2) to 2·FROM, plain and staggered', () => {
    let checked = 0;
    const wrong: string[] = [];
    for (let from = 1; from <= 150; from++) {
      for (let to = Math.ceil(from / 2); to <= 2 * from; to++) {
        for (const staggered of [false, true]) {
          const { instruction } = planRound(from, to, { staggered });
          const r = checkPiece(`Rnd 2: ${instruction} (${to})`, { start: from }).rounds[0];
          checked++;
          if (r.worked !== from || r.stitches !== to || r.problems.length) wrong.push(`${from}→${to}${staggered ? ' staggered' : ''}: ${instruction}`);
        }
      }
    }
    expect(wrong).toEqual([]);
    expect(checked).toBe(2 * Array.from({ length: 150 }, (_, i) => 2 * (i + 1) - Math.ceil((i + 1) / 2) + 1).reduce((a, b) => a + b, 0));
  }, 60_000);
});
