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

export function readLabel(line: string): Label | null {
  const m = (PLURAL.test(line) ? LABEL_MANY : LABEL_ONE).exec(line);
  if (!m) return null;
  const word = m[2].toLowerCase();
  const spaced = /\s$/.test(m[0]);
  let end = m[0].length;
  const rest = line.slice(end);
  // What separates the label from the instructions. A bare "R" needs punctuation ("R5:"), the words
  // may be followed by a space only ("Rnd 5 sc around").
  const sep = /^\s*(?:[:.)\-–—,]|$)/.exec(rest);
  if (sep) end += sep[0].length;
  else if (word === 'r' || !(spaced || /^\s/.test(rest))) return null;
  const label = line.slice(m[1].length, m[0].length).replace(/\s*(\([^)]*\)|\[[^\]]*\])\s*$/, '').trim();
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
  const bracket = (m[5] ?? '').toLowerCase();
  const loop: Loop | null = /\b(blo|bl|back loops?)\b/.test(bracket) ? 'blo' : /\b(flo|fl|front loops?)\b/.test(bracket) ? 'flo' : null;
  return {
    label,
    kind: word.startsWith('row') ? 'row' : 'round',
    numbers,
    textStart: end,
    loop,
    problems,
  };
}
