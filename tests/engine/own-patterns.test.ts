// Whole pieces of our own (original scenarios, not published patterns), each with deliberate mistakes.
// For every round: the count the engine must give and the exact sentences it must say. After a slip
// the engine carries on from its computed count, so one slip gives one complaint.
import { describe, expect, it } from 'vitest';
import { checkPiece, type PieceCheck } from '@/engine';

type Expect = [label: string, stitches: number, problems: string[]];

function expectRounds(check: PieceCheck, rows: Expect[]): void {
  expect(check.rounds.map((r) => [r.label, r.stitches, r.problems.map((p) => p.message)])).toEqual(rows);
}

describe('acorn cap (our own): BLO ridge, leftover front loops, one slip per kind', () => {
  const text = [
    'Acorn cap',
    'Rnd 1: 6 sc in MR (6)',
    'Rnd 2: inc x6 (12)',
    'Rnd 3: (sc, inc) x6 (18)',
    'Rnd 4: (2 sc, inc) x6 (25)',
    'Rnd 5: (3 sc, inc) x6 (30)',
    'Rnd 6: BLO sc around (30)',
    'Rnd 7: sc in next 26 sts',
    'Rnd 8: sc around (26)',
    'Change to color B',
    'Working in the front loops left from Rnd 6: (4 sc, inc) x6 (36)',
    'Rnd 10: scc around (36)',
    'Fasten off.',
  ].join('\n');
  const check = checkPiece(text);

  it('counts every round and says exactly what slipped', () => {
    expectRounds(check, [
      ['Rnd 1', 6, []],
      ['Rnd 2', 12, []],
      ['Rnd 3', 18, []],
      // Slip 1: the stated count is off; the next round is written for 24 and has no complaint.
      ['Rnd 4', 24, ['Round 4 makes 24 stitches, not 25']],
      ['Rnd 5', 30, []],
      ['Rnd 6', 30, []],
      // Slip 2: four stitches short, nothing said about leaving them.
      ['Rnd 7', 26, ["Round 7 works 26 of 30 stitches; 4 are left unworked — say 'leave the remaining 4 sts unworked' if that is meant"]],
      ['Rnd 8', 26, []],
      // The brim works into the 30 front loops Rnd 6 left, not into Rnd 8's 26.
      ['Rnd 9', 36, []],
      // Slip 3: a typo, read as what it resembles so the count carries on.
      ['Rnd 10', 36, ["'scc' — did you mean 'sc'?"]],
    ]);
  });

  it('records the loops and keeps the notes at their places', () => {
    expect(check.rounds[5].loops).toEqual(['blo']);
    expect(check.rounds[8]).toMatchObject({ worked: 30, loops: ['flo'] });
    expect(check.notes.map((n) => [n.text, n.kind, n.afterRound, n.beforeRound])).toEqual([
      ['Acorn cap', 'other', null, 1],
      ['Change to color B', 'colour', 8, 9],
      ['Fasten off.', 'fasten-off', 10, null],
    ]);
  });

  it('points each problem at its column', () => {
    const line = text.split('\n')[4];
    expect(check.rounds[3].problems[0].column).toBe(line.indexOf('(25)'));
    const typo = text.split('\n')[11];
    expect(check.rounds[9].problems[0].column).toBe(typo.indexOf('scc'));
  });
});

describe('small mushroom (our own): chain start, star repeats, hdc slip, stuffing', () => {
  const check = checkPiece(
    [
      'Mushroom cap',
      'Rnd 1: ch 2, 6 sc in 2nd ch from hook (6)',
      'Rnd 2: 2 sc in each st around (12)',
      'Rnd 3: *sc, inc; rep from * around (18)',
      'Rnd 4: *2 sc, inc; rep from * around (24)',
      'Rnd 5: (hdc, inc) x8 (24)',
      'Rnd 6: sc in each st around (24)',
      'Rnds 7-8: sc around (24)',
      'Rnd 9: (2 sc, dec) x6 (18)',
      'Stuff lightly.',
      'Rnd 10: (sc, dec) x6 (12)',
      'Rnd 11: dec x6 (6)',
      'Fasten off and close the hole.',
    ].join('\n'),
  );

  it('counts every round', () => {
    expectRounds(check, [
      ['Rnd 1', 6, []],
      ['Rnd 2', 12, []],
      ['Rnd 3', 18, []],
      ['Rnd 4', 24, []],
      // Slip: (hdc, inc) works 2 a repeat, so 8 repeats cover only 16 of 24 (the count happens to match).
      ['Rnd 5', 24, ["Round 5 works 16 of 24 stitches; 8 are left unworked — say 'leave the remaining 8 sts unworked' if that is meant"]],
      ['Rnd 6', 24, []],
      ['Rnds 7-8', 24, []],
      ['Rnds 7-8', 24, []],
      ['Rnd 9', 18, []],
      ['Rnd 10', 12, []],
      ['Rnd 11', 6, []],
    ]);
    expect(check.rounds[4].made).toEqual({ hdc: 8, sc: 16 });
  });

  it('keeps stuffing and fastening off as notes between the right rounds', () => {
    const stuff = check.notes.find((n) => n.kind === 'stuffing');
    expect(stuff).toMatchObject({ text: 'Stuff lightly.', afterRound: 9, beforeRound: 10 });
    expect(check.notes.find((n) => n.kind === 'fasten-off')).toMatchObject({ afterRound: 11, beforeRound: null });
  });
});

describe('pebble (our own): oval start, bracket slip, over-working slip', () => {
  const check = checkPiece(
    [
      'Pebble',
      'Rnd 1: ch 7, sc in 2nd ch from hook, sc in next 4 ch, 3 sc in last ch, working on the other side of the chain, sc in next 4 ch, 2 sc in last ch (14)',
      'Rnd 2: inc, sc in next 4, inc x3, sc in next 4, inc x2 (20)',
      'Rnd 3: sc, inc, sc in next 4, (sc, inc) x3, sc in next 4, (sc, inc) x2 (26)',
      'Rnd 4: sc around (27)',
      'Rnd 5: sc around (26)',
      'Rnd 6: (sc in next 11, dec) x2 (24)',
      'Rnd 7: (2 sc, dec] x6 (18)',
      'Rnd 8: (sc, dec) x6 (12)',
      'Rnd 9: dec x7 (6)',
    ].join('\n'),
  );

  it('counts every round', () => {
    expectRounds(check, [
      ['Rnd 1', 14, []],
      ['Rnd 2', 20, []],
      ['Rnd 3', 26, []],
      ['Rnd 4', 26, ['Round 4 makes 26 stitches, not 27']],
      ['Rnd 5', 26, []],
      ['Rnd 6', 24, []],
      // Mismatched brackets are a warning; the count is still right.
      ['Rnd 7', 18, ["'(' is closed by ']'"]],
      ['Rnd 8', 12, []],
      // Seven decreases need 14 stitches: one sentence, with the stated count folded in.
      ['Rnd 9', 7, ['Round 9 works 14 stitches, but Round 8 has only 12 (it makes 7, not the 6 stated)']],
    ]);
    expect(check.rounds[0].worked).toBe(11);
    expect(check.rounds[6].problems[0].severity).toBe('warning');
  });
});

describe('little bunting flag (our own): rows, turning chains, short rows', () => {
  const check = checkPiece(
    [
      'Flag',
      'Row 1: ch 11, sc in 2nd ch from hook and in each ch across, turn (10)',
      'Row 2: ch 1, sc in each st across, turn (10)',
      'Rows 3-4: rep row 2',
      'Row 5: ch 1, sk 1, sc in next 7 sts, sk 1, sc in last st, turn (8)',
      'Row 6: ch 1, sc in next 6 sts, turn (6)',
      'Row 7: ch 1, sc2tog, sc in next 2, sc2tog, leave remaining sts unworked, turn (4)',
      'Row 8: ch 1, sc2tog twice (2)',
    ].join('\n'),
  );

  it('counts every row', () => {
    expectRounds(check, [
      ['Row 1', 10, []],
      ['Row 2', 10, []],
      ['Rows 3-4', 10, []],
      ['Rows 3-4', 10, []],
      ['Row 5', 8, []],
      // Slip: two stitches left at the end of a row, not said.
      ['Row 6', 6, ["Row 6 works 6 of 8 stitches; 2 are left unworked — say 'leave the remaining 2 sts unworked' if that is meant"]],
      ['Row 7', 4, []],
      ['Row 8', 2, []],
    ]);
  });

  it('walks a turning chain as a step that makes nothing', () => {
    const row2 = check.rounds[1];
    expect(row2.steps[0]).toMatchObject({ action: 'ch 1', makes: 0, worksInto: 0 });
    expect(row2.steps).toHaveLength(11);
  });
});

describe('bee body in UK terms (our own): the ambiguous sc and the US-looking hint', () => {
  const check = checkPiece(
    [
      'Bee body (UK terms)',
      'Rnd 1: 6 dc in MR (6)',
      'Rnd 2: 2 dc in each st around (12)',
      'Rnd 3: (dc, htr) in next st, dc in next st, rep 5 more times (18)',
      'Rnd 4: (2 dc, dc2tog) x4, sc in next 2 (14)',
      'Rnd 5: ss in next st, miss 1, tr in next 12 (13)',
      'Rnd 6: (hdc, dc) x6, dc in next st (13)',
    ].join('\n'),
    { terms: 'uk' },
  );

  it('reads UK terms, says sc is ambiguous once, and hints at US terms once', () => {
    expectRounds(check, [
      ['Rnd 1', 6, []],
      ['Rnd 2', 12, []],
      ['Rnd 3', 18, []],
      [
        'Rnd 4',
        14,
        ["'sc' is ambiguous in UK terms: older UK patterns use it for a slip stitch (ss), US patterns for UK dc. Write 'ss' or 'dc'; it is counted as one stitch here"],
      ],
      ['Rnd 5', 13, []],
      ['Rnd 6', 13, []],
    ]);
    expect(check.rounds[2].made).toEqual({ sc: 12, hdc: 6 });
    expect(check.rounds[5].made).toEqual({ hdc: 6, sc: 7 });
    expect(check.hints).toEqual(['This looks like US terms (sc, hdc): if the pattern is written in US terms, check it with US terms']);
  });
});

describe('bear head (our own): recovering from broken brackets and unknown words', () => {
  const check = checkPiece(
    [
      'Rnd 1: 6 sc in MR (6)',
      'Rnd 2: inc in each st around (12)',
      'Rnd 3: (sc, inc x6 (18)',
      'Rnd 4: (2 sc, inc)) x6 (24)',
      'Rnd 5: sc in nxet 5, bobbel, sc in next 18 (24)',
      'Rnd 6: sc in next 5, xyzzy, sc in next 18 (24)',
      'Rnd 7: hcd in each st around (24)',
      'Place safety eyes between Rnds 6 and 7, 5 sts apart.',
    ].join('\n'),
  );

  it('says one thing per slip and keeps counting', () => {
    expectRounds(check, [
      ['Rnd 1', 6, []],
      ['Rnd 2', 12, []],
      ['Rnd 3', 18, ["'(' is never closed — add ')' where the group ends"]],
      ['Rnd 4', 24, ["This ')' has no opening bracket before it"]],
      ['Rnd 5', 24, ["'nxet' — did you mean 'next'?", "'bobbel' — did you mean 'bobble'?"]],
      ['Rnd 6', 24, ["'xyzzy' is not a stitch Whorlbook knows; it is counted as one stitch"]],
      ['Rnd 7', 24, ["'hcd' — did you mean 'hdc'?"]],
    ]);
    const eyes = check.notes[0];
    expect(eyes).toMatchObject({
      kind: 'placement',
      smallParts: true,
      afterRound: 7,
      placement: { label: 'safety eyes', betweenRounds: [6, 7], atRound: null, apart: 5 },
    });
  });
});
