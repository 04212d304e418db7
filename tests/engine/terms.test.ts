// US ↔ UK rewrite (standards.md §5: S11, S20, S21, S22), keeping everything else as written.
import { describe, expect, it } from 'vitest';
import { checkPiece, convertTerms } from '@/engine';

describe('convertTerms', () => {
  it('rewrites only the terms', () => {
    const us = 'Rnd 3: *sc in next 2 sts, 2 hdc in next st; rep from * around (24)\nRnd 4: dc2tog, tr, skip 2, sc2tog — 30 sts';
    const uk = 'Rnd 3: *dc in next 2 sts, 2 htr in next st; rep from * around (24)\nRnd 4: tr2tog, dtr, miss 2, dc2tog — 30 sts';
    expect(convertTerms(us, 'us', 'uk')).toBe(uk);
    expect(convertTerms(uk, 'uk', 'us')).toBe(us);
  });

  it('does not chain rewrites (sc → dc never goes on to dc → tr)', () => {
    expect(convertTerms('sc, dc, tr, dtr', 'us', 'uk')).toBe('dc, tr, dtr, ttr');
    expect(convertTerms('dc, tr, dtr, ttr', 'uk', 'us')).toBe('sc, dc, tr, dtr');
  });

  it('keeps case, spacing and numbers glued to stitches', () => {
    expect(convertTerms('Sc 6 in MR; SC around; 6sc', 'us', 'uk')).toBe('Dc 6 in MR; DC around; 6dc');
    expect(convertTerms('Single crochet  in each st; half double crochet; Yarn Over', 'us', 'uk')).toBe(
      'Double crochet  in each st; half treble crochet; Yarn Round Hook',
    );
    expect(convertTerms('treble crochet, double treble crochet', 'us', 'uk')).toBe('double treble crochet, triple treble crochet');
  });

  it('leaves sl st, sk and mixed-case words as written', () => {
    expect(convertTerms('sl st in next st, sk 1, sC', 'us', 'uk')).toBe('sl st in next st, sk 1, sC');
  });

  it('the converted text checks the same in the other terms', () => {
    const us = 'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)\nRnd 3: (sc, hdc inc) x6 (18)\nRnd 4: (sc, dc, dc2tog) x4, hdc in next 2 (14)';
    const a = checkPiece(us, { terms: 'us' });
    const b = checkPiece(convertTerms(us, 'us', 'uk'), { terms: 'uk' });
    expect(b.rounds.map((r) => [r.stitches, r.made, r.problems.length])).toEqual(a.rounds.map((r) => [r.stitches, r.made, r.problems.length]));
  });

  it('the same terms give the text back', () => {
    expect(convertTerms('sc around', 'us', 'us')).toBe('sc around');
  });
});
