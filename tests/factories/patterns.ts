import type { CreatePatternFormValues } from '../../src/schemas/pattern.js';

let n = 0;

/** A small pattern of our own: a round pebble with one deliberate count to check, unless overridden. */
export function buildPattern(overrides: Partial<CreatePatternFormValues> = {}): CreatePatternFormValues {
  n += 1;
  return {
    title: `Pebble no. ${n}`,
    terms: 'us',
    designerCredit: 'Test studio',
    pieces: [
      {
        name: 'Pebble',
        copies: 1,
        hookMm: 3.5,
        instructions: [
          'Rnd 1: 6 sc in MR (6)',
          'Rnd 2: inc x6 (12)',
          'Rnd 3: (sc, inc) x6 (18)',
          'Rnds 4-6: sc around (18)',
          'Rnd 7: (sc, dec) x6 (12)',
          'Rnd 8: dec x6 (6)',
        ].join('\n'),
      },
    ],
    ...overrides,
  };
}
