// Lines that are not rounds: kept as notes at their place, classified where they can be.
import { describe, expect, it } from 'vitest';
import { checkPiece, classifyNote } from '@/engine';

describe('note kinds', () => {
  it.each([
    ['Change to color B', 'colour'],
    ['Change colour to pink', 'colour'],
    ['With B, continue', 'colour'],
    ['Join yellow yarn', 'colour'],
    ['With plum yarn:', 'colour'],
    ['Change to the bark yarn', 'colour'],
    ['Switch to a 3 mm hook', 'hook'],
    ['change to 2.5mm hook', 'hook'],
    ['Use a G-6 hook from here', 'hook'],
    ['Stuff firmly', 'stuffing'],
    ['Begin stuffing the head', 'stuffing'],
    ['Place safety eyes between Rnds 10 and 11, 6 sts apart', 'placement'],
    ['Sew the ears to Rnd 20', 'placement'],
    ['Fasten off', 'fasten-off'],
    ['FO, leaving a long tail for sewing', 'fasten-off'],
    ['Head (make 1)', 'other'],
    ['Place marker in the first st', 'other'],
  ])('%s → %s', (text, kind) => {
    expect(classifyNote(text).kind).toBe(kind);
  });

  it('reads the hook size in mm', () => {
    expect(classifyNote('Switch to a 3 mm hook').hookMm).toBe(3);
    expect(classifyNote('change to 2.5mm hook').hookMm).toBe(2.5);
    expect(classifyNote('change to a 3,5 mm hook').hookMm).toBe(3.5);
    // Source: US hook letters to mm, standards.md §2 (S9, S10, S13): G-6 = 4 mm.
    expect(classifyNote('Use a G-6 hook from here').hookMm).toBe(4);
    expect(classifyNote('Switch to the smaller hook').hookMm).toBeUndefined();
  });

  it('reads what is placed, between which rounds and how far apart', () => {
    expect(classifyNote('Place safety eyes between Rnds 10 and 11, 6 sts apart').placement).toEqual({
      label: 'safety eyes',
      betweenRounds: [10, 11],
      atRound: null,
      apart: 6,
    });
    expect(classifyNote('Insert the eyes at Rnd 8 with 7 sts between them').placement).toEqual({
      label: 'eyes',
      betweenRounds: null,
      atRound: 8,
      apart: 7,
    });
    expect(classifyNote('Sew the arms between R12 & R13').placement).toMatchObject({ label: 'arms', betweenRounds: [12, 13] });
  });

  it('flags small parts so the app can show the caution (product.md safety note)', () => {
    expect(classifyNote('Place safety eyes between Rnds 10 and 11').smallParts).toBe(true);
    expect(classifyNote('Sew on two buttons').smallParts).toBe(true);
    expect(classifyNote('Embroider the eyes with black yarn').smallParts).toBeUndefined();
  });
});

describe('notes in a piece', () => {
  const check = checkPiece(
    [
      'Bunny head',
      'Rnd 1: 6 sc in MR (6)',
      'Rnd 2: inc x6 (12)',
      'Place safety eyes between Rnds 2 and 3, 3 sts apart',
      'Rnd 3: with color B, (sc, inc) x6 (18)',
      'Rnd 4: (sc, dec) x6 (12). Stuff firmly.',
      'Rnd 5: dec x6, fasten off (6)',
    ].join('\n'),
  );

  it('are not rounds and not errors', () => {
    expect(check.rounds.map((r) => r.stitches)).toEqual([6, 12, 18, 12, 6]);
    expect(check.rounds.flatMap((r) => r.problems)).toEqual([]);
  });

  it('sit between the rounds they come between, including notes written inside a round line', () => {
    expect(check.notes.map((n) => [n.text, n.kind, n.line, n.afterRound, n.beforeRound])).toEqual([
      ['Bunny head', 'other', 0, null, 1],
      ['Place safety eyes between Rnds 2 and 3, 3 sts apart', 'placement', 3, 2, 3],
      ['with color B', 'colour', 4, 2, 3],
      ['Stuff firmly.', 'stuffing', 5, 4, 5],
      ['fasten off', 'fasten-off', 6, 5, null],
    ]);
  });
});
