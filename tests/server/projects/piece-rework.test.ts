import { describe, expect, it } from 'vitest';
import { checkPiece } from '@/engine/index';
import { alignRounds, copiesProblem, reworkPiece, reworkRounds } from '@/schemas/piece-rework';

// The rules the project page shows before saving and the server applies on saving (one module for both).
// Rounds are read by the real stitch engine. Common practice: 6 sc in a magic ring, then +6 a round.

const rounds = (lines: string[]) => reworkRounds(checkPiece(lines.join('\n'), { terms: 'us' }).rounds);
const body = [
  'Rnd 1: 6 sc in MR (6)',
  'Rnd 2: inc x6 (12)',
  'Rnd 3: (sc, inc) x6 (18)',
  'Rnd 4: (2 sc, inc) x6 (24)',
  'Rnds 5-7: sc around (24)',
  'Rnd 8: (2 sc, dec) x6 (18)',
];
const renumber = (lines: string[]) => lines.map((l, i) => l.replace(/^Rnds? [\d-]+/, `Rnd ${i + 1}`));

describe('alignRounds', () => {
  it('matches rounds by what they say, not by their number', () => {
    const before = rounds(body);
    const after = rounds(renumber([body[0], body[1], 'Rnd 3: sc around (12)', ...body.slice(2, 4), 'Rnd 6: sc around (24)', 'Rnd 7: sc around (24)', 'Rnd 8: sc around (24)', body[5]]));
    expect(alignRounds(before, after)).toEqual([0, 1, 3, 4, 5, 6, 7, 8]);
  });

  it('leaves changed and removed rounds unmatched', () => {
    const before = rounds(body);
    const after = rounds([body[0], 'Rnd 2: inc 6 times (12)', body[2]]);
    expect(alignRounds(before, after)).toEqual([0, null, 2, null, null, null, null, null]);
  });
});

describe('reworkPiece', () => {
  const before = { rounds: rounds(body), copies: 2 };

  it('says nothing and moves nothing for a piece not started', () => {
    const out = reworkPiece({ before, after: { rounds: rounds(body.slice(0, 2)), copies: 2 }, position: { copy: 1, round: 0, step: 0 } });
    expect(out).toMatchObject({ to: { copy: 1, round: 0, step: 0 }, notable: false, messages: [] });
  });

  it('stays quietly on the same round when nothing before it changes', () => {
    const out = reworkPiece({ before, after: { rounds: rounds([...body, 'Rnd 9: dec x9 (9)']), copies: 2 }, position: { copy: 1, round: 3, step: 5 } });
    expect(out).toMatchObject({ to: { copy: 1, round: 3, step: 5 }, notable: false, messages: [] });
    // 6 + 6 + 12 steps before Rnd 4, 5 into it.
    expect(out.done).toBe(29);
  });

  it('follows the round when one is added before it, and says the new one counts as worked', () => {
    const after = { rounds: rounds(renumber([body[0], body[1], 'Rnd 3: sc around (12)', ...body.slice(2)])), copies: 2 };
    const out = reworkPiece({ before, after, position: { copy: 1, round: 3, step: 5 } });
    expect(out.to).toEqual({ copy: 1, round: 4, step: 5 });
    expect(out.notable).toBe(true);
    expect(out.messages).toEqual([
      'Rnd 3 is new and comes before your place, so the Tally counts it as worked. If you have not worked it yet, use “Jump to a round” in the Tally to go back.',
      'The Tally was at Rnd 4, step 5 of 18, copy 1 of 2; after saving it stands at Rnd 5, step 5 of 18, copy 1 of 2.',
    ]);
  });

  it('says which worked round a change alters, and keeps the place', () => {
    const after = { rounds: rounds([body[0], 'Rnd 2: inc 6 times (12)', ...body.slice(2)]), copies: 2 };
    const out = reworkPiece({ before, after, position: { copy: 1, round: 3, step: 0 } });
    expect(out.to).toEqual({ copy: 1, round: 3, step: 0 });
    expect(out.messages[0]).toBe('You have already worked Rnd 2, and this change alters it. What you made stays as it is; check it against the new instructions.');
    expect(out.messages.at(-1)).toBe('The Tally stays at the start of Rnd 4, copy 1 of 2.');
  });

  it('finishes the copy when the count is past the new last round, and names what was worked but removed', () => {
    const out = reworkPiece({ before, after: { rounds: rounds(body.slice(0, 3)), copies: 2 }, position: { copy: 1, round: 5, step: 3 } });
    expect(out.to).toEqual({ copy: 2, round: 0, step: 0 });
    expect(out.messages).toEqual([
      'The Tally is at Rnd 6, past the new last round (Rnd 3). Saving counts copy 1 as done and starts copy 2 at Rnd 1.',
      'You have already worked Rnd 4 and Rnd 5 as the instructions were, and they are no longer in them.',
      'Copy 1 was made from the instructions as they were.',
      'The Tally was at Rnd 6, step 3 of 24, copy 1 of 2; after saving it stands at the start of Rnd 1, copy 2 of 2.',
    ]);
  });

  it('counts the piece done when the last copy is past the new end', () => {
    const out = reworkPiece({ before: { ...before, copies: 1 }, after: { rounds: rounds(body.slice(0, 3)), copies: 1 }, position: { copy: 1, round: 5, step: 3 } });
    expect(out.to).toEqual({ copy: 1, round: 3, step: 0 });
    expect(out.messages[0]).toBe('The Tally is at Rnd 6, past the new last round (Rnd 3). Saving counts the piece as done.');
    expect(out.messages.at(-1)).toMatch(/after saving it stands at the end of the piece \(done\)\.$/);
  });

  it('takes a done piece back to rounds added after its end, and starts a new copy', () => {
    const done = { copy: 2, round: 8, step: 0 };
    const more = reworkPiece({ before, after: { rounds: rounds([...body, 'Rnd 9: dec x9 (9)']), copies: 2 }, position: done });
    expect(more.to).toEqual({ copy: 2, round: 8, step: 0 });
    expect(more.messages[0]).toBe('This piece was counted as done, and Rnd 9 is new after its old last round: the Tally goes back to Rnd 9 so you can count it.');
    const copies = reworkPiece({ before, after: { rounds: rounds(body), copies: 3 }, position: done });
    expect(copies.to).toEqual({ copy: 3, round: 0, step: 0 });
    expect(copies.messages[0]).toBe('Copy 3 is new: the Tally starts it at Rnd 1.');
  });

  it('warns when the round being worked changes partway through', () => {
    const after = { rounds: rounds([...body.slice(0, 3), 'Rnd 4: (3 sc, inc) x6 (30)', ...body.slice(4)]), copies: 2 };
    const out = reworkPiece({ before, after, position: { copy: 1, round: 3, step: 7 } });
    expect(out.to).toEqual({ copy: 1, round: 3, step: 7 });
    expect(out.messages[0]).toBe('You are partway through Rnd 4 (step 7 of 18) and its instructions change. The Tally keeps the steps counted; check them against the new Rnd 4.');
  });

  it('starts again from nothing when the instructions lose every round', () => {
    const out = reworkPiece({ before, after: { rounds: [], copies: 2 }, position: { copy: 1, round: 2, step: 1 } });
    expect(out).toMatchObject({ to: { copy: 1, round: 0, step: 0 }, done: 0 });
    expect(out.messages[0]).toMatch(/no rounds to count/);
  });

  it('maps history positions the same way as the count', () => {
    const after = { rounds: rounds(renumber([body[0], 'Rnd 2: sc around (6)', ...body.slice(1)])), copies: 2 };
    const out = reworkPiece({ before, after, position: { copy: 1, round: 3, step: 0 } });
    expect(out.map({ copy: 1, round: 0, step: 4 })).toEqual({ copy: 1, round: 0, step: 4 });
    expect(out.map({ copy: 1, round: 2, step: 1 })).toEqual({ copy: 1, round: 3, step: 1 });
    expect(out.map({ copy: 2, round: 1, step: 0 })).toEqual({ copy: 2, round: 2, step: 0 });
  });
});

describe('copiesProblem', () => {
  it('refuses fewer copies than the copy counted, or than a placement, in words the maker can act on', () => {
    expect(copiesProblem('Ear', { copy: 2, round: 0, step: 0 }, 1)).toBe(
      'Ear is counted up to copy 2 in the Tally, so it needs at least 2 copies. To make fewer, first go back to an earlier copy with “Jump to a round” in the Tally.',
    );
    expect(copiesProblem('Ear', { copy: 2, round: 0, step: 0 }, 2)).toBeNull();
    expect(copiesProblem('Ear', { copy: 1, round: 0, step: 0 }, 1, [2])).toMatch(/placement recorded on copy 2/);
    expect(copiesProblem('Ear', { copy: 1, round: 0, step: 0 }, 2, [2])).toBeNull();
  });
});
