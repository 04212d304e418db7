// Round and row labels: "Rnd 5:", "Round 5:", "R5:", "Row 3:", "Rnds 8-12:", "Rnds 8–12:", "Rounds 9 and 10:",
// "Rows 3-8:", "Rnds 3, 5 and 7:", "Row 2 (RS):".

import type { Loop, Problem } from './types';

export interface Label {
  /** As written, without the separator: "Rnds 8-12". */
  label: string;
  kind: 'round' | 'row';
  numbers: number[];
  /** Column where the instructions start. */
  textStart: number;
  /** A loop named in the label's bracket: "Rnd 6 (BLO):". */
  loop: Loop | null;
  /** A count in the label's bracket: "Round 5 (36 sts):", "Rnd 5 [36]:". */
  stated: number | null;
  /** Column of that bracket. */
  statedCol: number | null;
  problems: Problem[];
}

/** Longest range a label may expand to: beyond this it is almost surely a slip (and would flood the counter). */
export const MAX_RANGE = 1000;

const WORD = String.raw`(?:rounds?|rnds?|rds?|rows?|r)`;
const RANGE_CONN = String.raw`-|–|—|to|through|thru`;
// "Rnds 3, 5 and 7" lists need the plural; "Rnd 1, 6 sc in MR" is round 1.
const LIST_CONN = String.raw`${RANGE_CONN}|and|&|,`;
const labelRe = (conn: string) =>
  new RegExp(
    String.raw`^(\s*(?:[-•·]\s+)?)(${WORD})\.?\s*#?\s*(\d{1,6})((?:\s*(?:${conn})\s*(?:${WORD}\.?\s*)?\d{1,6})*)\s*(\([^)]*\)|\[[^\]]*\])?`,
    'i',
  );
const LABEL_ONE = labelRe(RANGE_CONN);
const LABEL_MANY = labelRe(LIST_CONN);
const PLURAL = /^\s*(?:[-•·]\s+)?(?:rounds|rnds|rds|rows)\b/i;
/** "(36)", "[36 sts]", "(36 stitches)", "(total 36)", "(36 sc)": a count, not an aside. */
const COUNT_BRACKET =
  /^[([]\s*(?:total:?\s*)?(\d{1,6})\s*(?:sts?\.?|stitch(?:es)?|sc|hdc|dc|tr|htr|dtr)?\s*(?:total|in all)?\s*[)\]]$/i;
/** What a bracket right after the number may say and still belong to the label. */
const ASIDE_BRACKET = /^[([]\s*(?:rs|ws|right side|wrong side|blo|flo|bl|fl|back loops?(?: only)?|front loops?(?: only)?|make \d+|x\s*\d+|\d+\s*x|optional)\s*[)\]]$/i;

export function readLabel(line: string): Label | null {
  const m = (PLURAL.test(line) ? LABEL_MANY : LABEL_ONE).exec(line);
  if (!m) return null;
  const word = m[2].toLowerCase();
  let whole = m[0];
  let bracketText = m[5] ?? '';
  if (bracketText) {
    // "Rnd 3 (sc, inc) x6 (18)": without a separator after it, a bracket that is neither a count nor
    // an aside is the round's first group, not part of the label.
    const after = line.slice(whole.length);
    // ("Rnd 2 (2 sc) in each st": a count of stitches named by a stitch word belongs to the label only
    // with a separator after it.)
    const plainCount = COUNT_BRACKET.test(bracketText) && !/\d\s*(?:sc|hdc|dc|tr|htr|dtr)\b/i.test(bracketText);
    const labelish = plainCount || ASIDE_BRACKET.test(bracketText) || /^\s*[:.\-–—,]/.test(after);
    if (!labelish) {
      whole = whole.slice(0, whole.length - bracketText.length);
      bracketText = '';
    }
  }
  const spaced = /\s$/.test(whole);
  let end = whole.length;
  const rest = line.slice(end);
  // What separates the label from the instructions. A bare "R" needs punctuation ("R5:"), the words
  // may be followed by a space only ("Rnd 5 sc around").
  const sep = /^\s*(?:[:.)\-–—,]|$)/.exec(rest);
  if (sep) end += sep[0].length;
  else if (word === 'r' || !(spaced || /^\s/.test(rest))) return null;
  const label = line.slice(m[1].length, whole.length).replace(/\s*(\([^)]*\)|\[[^\]]*\])\s*$/, '').trim();
  const problems: Problem[] = [];
  const numbers: number[] = [];
  const first = Number(m[3]);
  numbers.push(first);
  const tail = m[4] ?? '';
  const parts = /(-|–|—|to|through|thru|and|&|,)\s*(?:[a-z]+\.?\s*)?(\d{1,6})/gi;
  let last = first;
  for (let p = parts.exec(tail); p; p = parts.exec(tail)) {
    const n = Number(p[2]);
    const conn = p[1].toLowerCase();
    if (conn === '-' || conn === '–' || conn === '—' || conn === 'to' || conn === 'through' || conn === 'thru') {
      if (n < last) {
        problems.push({ message: `'${label}' runs backwards; read as ${label.replace(/\d+\D+\d+$/, '')}${last} only`, column: m[1].length, severity: 'warning' });
        continue;
      }
      if (n - last > MAX_RANGE) {
        problems.push({ message: `'${label}' spans more than ${MAX_RANGE} rounds; only the first ${MAX_RANGE} are read`, column: m[1].length, severity: 'error' });
      }
      for (let k = last + 1; k <= Math.min(n, last + MAX_RANGE); k++) numbers.push(k);
    } else numbers.push(n);
    last = n;
  }
  if (numbers.length > MAX_RANGE) numbers.length = MAX_RANGE;
  const bracket = bracketText.toLowerCase();
  const loop: Loop | null = /\b(blo|bl|back loops?)\b/.test(bracket) ? 'blo' : /\b(flo|fl|front loops?)\b/.test(bracket) ? 'flo' : null;
  const count = COUNT_BRACKET.exec(bracketText);
  return {
    label,
    kind: word.startsWith('row') ? 'row' : 'round',
    numbers,
    textStart: end,
    loop,
    stated: count ? Number(count[1]) : null,
    statedCol: count ? whole.length - bracketText.length : null,
    problems,
  };
}
