// Crochet hook sizes, metric with the US letter/number. Sources (see shared reference standards.md §2):
// Craft Yarn Council "Getting Started" hook chart (S6) and the conversion charts S9, S10, S13, which agree on
// every row below except where noted. Match on millimetres, never on letters: letters vary between makers.

export interface HookSize {
  mm: number;
  us: string | null;
}

export const hookSizes: readonly HookSize[] = [
  { mm: 2.25, us: 'B-1' },
  { mm: 2.75, us: 'C-2' },
  { mm: 3.25, us: 'D-3' },
  { mm: 3.5, us: 'E-4' },
  { mm: 3.75, us: 'F-5' },
  { mm: 4, us: 'G-6' },
  { mm: 4.5, us: '7' },
  { mm: 5, us: 'H-8' },
  { mm: 5.5, us: 'I-9' },
  { mm: 6, us: 'J-10' },
  { mm: 6.5, us: 'K-10½' },
  { mm: 8, us: 'L-11' },
  { mm: 9, us: 'M/N-13' }, // S9, S14; S10 and S13 print "M-13"
  { mm: 10, us: 'N/P-15' }, // S9, S14; S10 prints "N-15"
  { mm: 11.5, us: 'P-16' }, // S10
  { mm: 15, us: 'P/Q' }, // S9, S11
  { mm: 16, us: 'Q' }, // S10 ("15.75/16"), S12
  { mm: 19, us: 'S' }, // S6, S12
];

/** The US size for a hook in mm, or null when the chart has no US name for it (e.g. 2.5 mm, 3 mm, 7 mm). */
export function usHookSize(mm: number): string | null {
  const hit = hookSizes.find((h) => Math.abs(h.mm - mm) < 0.01) ?? (Math.abs(mm - 15.75) < 0.01 ? hookSizes.find((h) => h.us === 'Q') : undefined);
  return hit?.us ?? null;
}

/** "3.5 mm (E-4)" or "2.5 mm" when there is no US size. */
export function formatHook(mm: number): string {
  const us = usHookSize(mm);
  const shown = Number.isInteger(mm) ? String(mm) : String(Number(mm.toFixed(2)));
  return us ? `${shown} mm (US ${us})` : `${shown} mm`;
}

export const hook = (mm: number) => ({ mm, us: usHookSize(mm) });
