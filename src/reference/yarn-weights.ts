// Craft Yarn Council Standard Yarn Weight System, categories 0–7 (standards.md §1; S1, S2 reprints crediting CYC).
// Only categories 1–5 agree across every edition; 0, 6 and 7 changed between editions, so the edition is kept.
// Source credit required when shown: "Source: Craft Yarn Council's www.YarnStandards.com".

export interface YarnWeight {
  category: number;
  name: string;
  types: string[];
  /** Crochet gauge range in single crochet over 4 in, [min, max]; max null means "and fewer" (open-ended). */
  scPer4in: [number, number | null];
  hookMm: [number, number | null];
  hookUs: string;
  edition: string;
}

export const yarnWeights: readonly YarnWeight[] = [
  { category: 0, name: 'Lace', types: ['Fingering', '10-count crochet thread'], scPer4in: [32, 42], hookMm: [1.4, 2.25], hookUs: 'Steel 6, 7, 8; regular B-1', edition: 'S1 (2018 booklet reprint; steel hook ranges differ by edition)' },
  { category: 1, name: 'Super Fine', types: ['Sock', 'Fingering', 'Baby'], scPer4in: [21, 32], hookMm: [2.25, 3.5], hookUs: 'B-1 to E-4', edition: 'all editions agree' },
  { category: 2, name: 'Fine', types: ['Sport', 'Baby'], scPer4in: [16, 20], hookMm: [3.5, 4.5], hookUs: 'E-4 to 7', edition: 'all editions agree' },
  { category: 3, name: 'Light', types: ['DK', 'Light Worsted'], scPer4in: [12, 17], hookMm: [4.5, 5.5], hookUs: '7 to I-9', edition: 'all editions agree' },
  { category: 4, name: 'Medium', types: ['Worsted', 'Afghan', 'Aran'], scPer4in: [11, 14], hookMm: [5.5, 6.5], hookUs: 'I-9 to K-10½', edition: 'all editions agree' },
  { category: 5, name: 'Bulky', types: ['Chunky', 'Craft', 'Rug'], scPer4in: [8, 11], hookMm: [6.5, 9], hookUs: 'K-10½ to M-13', edition: 'all editions agree' },
  { category: 6, name: 'Super Bulky', types: ['Super Bulky', 'Roving'], scPer4in: [6, 9], hookMm: [9, 16], hookUs: 'M-13 to Q', edition: 'S1, S2 (Oct 2018); S4 prints 7–9 sts and 9–15 mm' },
  { category: 7, name: 'Jumbo', types: ['Jumbo', 'Roving'], scPer4in: [0, 5], hookMm: [16, null], hookUs: 'Q and larger', edition: 'S1, S2 ("5 and fewer"); S4 prints 6 or less, 15 mm+' },
];

export function yarnWeight(category: number): YarnWeight | undefined {
  return yarnWeights.find((w) => w.category === category);
}

/** "DK, Light (3)" style label: the first yarn type, the CYC name and the category number. */
export function yarnWeightLabel(category: number): string {
  const w = yarnWeight(category);
  return w ? `${w.types[0]}, ${w.name} (${w.category})` : `Category ${category}`;
}

// Ply names used in Australia, New Zealand and the UK, mapped to CYC categories. This is a convention, not a
// standard (no standards body defines ply names): shown with "≈" in the UI. Source: S17 (AU retailer) with S1;
// S11 disagrees for 4 ply (it puts UK 4 ply at sport), so 4 ply is listed as Super Fine per S17.
export const plyToCategory: Readonly<Record<string, number>> = {
  '2 ply': 0,
  '3 ply': 0,
  '4 ply': 1,
  '5 ply': 2,
  '8 ply': 3,
  '10 ply': 4,
  '12 ply': 5,
  '14 ply': 6,
  '16 ply': 7,
};

export function categoryForPly(ply: string): number | undefined {
  const m = ply.trim().toLowerCase().match(/^(\d+)\s*-?\s*ply$/);
  return m ? plyToCategory[`${m[1]} ply`] : undefined;
}

/** Default stitch width and row height (cm) for sc fabric in a weight category, from the middle of the CYC
 *  gauge range (sts per 4 in = 10.16 cm); rows assumed about as tall as stitches are wide (common practice for sc). */
export function defaultScGaugeCm(category: number): { stitchWidth: number; rowHeight: number } {
  const w = yarnWeight(category) ?? yarnWeight(3)!;
  const [lo, hi] = w.scPer4in;
  const mid = hi === null ? Math.max(lo, 4) : (lo + hi) / 2 || 4;
  const width = 10.16 / mid;
  return { stitchWidth: width, rowHeight: width };
}
