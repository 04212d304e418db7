// Toy-safety cautions (product brief "Safety"; standards.md §7). Whorlbook informs; it does not certify.
// Small parts rule: 16 CFR 1501 (US), ASTM F963 (US toys), EN 71-1 (EU). Embroidered features for under-3s is
// common practice (S37), given here as advice, not as a legal rule.

export const SMALL_PART_NOTIONS = ['safety_eyes', 'buttons', 'beads'] as const;

export interface SafetyInput {
  forYoungChild?: boolean;
  notions?: Array<{ kind: string }>;
}

export interface Caution {
  code: 'small-parts' | 'young-child';
  title: string;
  message: string;
}

const LAW =
  'Anyone selling toys must follow local toy-safety law — for example the US small-parts rule 16 CFR 1501 and ASTM F963, or EN 71-1 in Europe. Whorlbook informs; it does not certify.';

export function cautionsFor({ forYoungChild, notions = [] }: SafetyInput): Caution[] {
  const smallParts = notions.filter((n) => (SMALL_PART_NOTIONS as readonly string[]).includes(n.kind));
  const out: Caution[] = [];
  if (smallParts.length) {
    const names = [...new Set(smallParts.map((n) => n.kind.replace(/_/g, ' ')))].join(', ');
    out.push({
      code: 'small-parts',
      title: 'Small parts can be a choking hazard',
      message: `This uses ${names}. Small hard parts can come loose and are a choking hazard for children under 3. For toys for young children, embroider the features instead, and test that every attached part holds firmly. ${LAW}`,
    });
  }
  if (forYoungChild) {
    out.push({
      code: 'young-child',
      title: 'Made for a child under 3',
      message: `Embroider eyes and other features instead of safety eyes, buttons or beads; sew every part on securely and check seams and parts hold under a firm pull; keep loose yarn ends short and woven in. ${LAW}`,
    });
  }
  return out;
}
