// Whorlbook's demo pattern: an original design of our own ("Bramble, the blackberry sprite"), used only to show
// a new member the app working. Every stated count here is checked by the stitch engine in tests.

export const demoPattern = {
  title: 'Bramble, the blackberry sprite',
  designerCredit: 'Whorlbook demo studio',
  sourceUrl: null as string | null,
  terms: 'us' as const,
  gauge: { stitches: 22, rows: 24, over: '10cm' as const, stitch: 'sc', hookMm: 3.5 },
  skillNotes: 'Easy. Worked in continuous spiral rounds; use a stitch marker for the first stitch of each round.',
  materials: {
    yarns: [
      { name: 'Plum cotton', colour: 'plum', fibre: 'cotton', weight: 3, metersPerSkein: 125, yardsPerSkein: 137 },
      { name: 'Leaf cotton', colour: 'leaf green', fibre: 'cotton', weight: 3, metersPerSkein: 125, yardsPerSkein: 137 },
      { name: 'Bark cotton', colour: 'brown', fibre: 'cotton', weight: 3, metersPerSkein: 125, yardsPerSkein: 137 },
    ],
    hooks: [{ mm: 3.5 }, { mm: 2.5 }],
    notions: [
      { kind: 'safety_eyes', sizeMm: 8, quantity: 2 },
      { kind: 'stuffing', quantity: 1 },
      { kind: 'stitch_markers', quantity: 1 },
      { kind: 'tapestry_needle', quantity: 1 },
    ],
  },
  pieces: [
    {
      name: 'Body',
      copies: 1,
      hookMm: 3.5,
      yarns: ['Plum cotton'],
      instructions: [
        'With plum yarn:',
        'Rnd 1: 6 sc in MR (6)',
        'Rnd 2: inc x6 (12)',
        'Rnd 3: (sc, inc) x6 (18)',
        'Rnd 4: sc, inc, (2 sc, inc) x5, sc (24)',
        'Rnd 5: (3 sc, inc) x6 (30)',
        'Rnd 6: 2 sc, inc, (4 sc, inc) x5, 2 sc (36)',
        'Rnds 7-12: sc around (36)',
        'Place safety eyes between Rnds 9 and 10, 6 sts apart.',
        'Rnd 13: BLO (4 sc, dec) x6 (30)',
        'Rnd 14: 2 sc, dec, (3 sc, dec) x5, sc (24)',
        'Stuff firmly.',
        'Rnd 15: (2 sc, dec) x6 (18)',
        'Rnd 16: (sc, dec) x6 (12)',
        'Finish stuffing.',
        'Rnd 17: dec x6 (6)',
        'Fasten off, close the hole and weave in the end.',
      ].join('\n'),
    },
    {
      name: 'Leaf',
      copies: 2,
      hookMm: 3.5,
      yarns: ['Leaf cotton'],
      instructions: [
        'With leaf green yarn:',
        'Rnd 1: ch 6, sc in 2nd ch from hook, hdc, dc, hdc, 3 sc in last ch, working on the other side of the chain, hdc, dc, hdc, 2 sc in last ch (12)',
        'Join with sl st to first sc.',
        'Fasten off, leaving a long tail for sewing.',
      ].join('\n'),
    },
    {
      name: 'Stalk',
      copies: 1,
      hookMm: 2.5,
      yarns: ['Bark cotton'],
      instructions: [
        'Switch to a 2.5 mm hook for this small detail.',
        'Rnd 1: 5 sc in MR (5)',
        'Rnds 2-4: sc around (5)',
        'Fasten off, leaving a tail to sew the stalk to the top of the body, between the leaves.',
      ].join('\n'),
    },
  ],
};
