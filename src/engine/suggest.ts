// "Did you mean" for unknown words: the closest known word by Damerau–Levenshtein distance
// (a swapped pair of letters, "hcd" for "hdc", counts as one slip).

import { vocabulary } from './abbreviations';
import type { Terms } from './types';

// Ordinary English words that sit one letter away from a stitch ("do" → "dc", "so" → "sc"): never "corrected".
const PLAIN_WORDS = new Set(
  (
    'do so go to at it is as or if be by up we us me my he she you your our its all any can may will would ' +
    'should must now how who why what when where here there then than them they this that these those ' +
    'make made makes work works worked keep kept pull pulled tight tightly loose loosely firmly gently ' +
    'well good nice new old yarn tail long short end ends side sides body head arm arms leg legs ear ears ' +
    'eye eyes nose mouth hat cap top bottom base piece pieces part parts color colour colors colours ' +
    'until till while before after again also only just still more less few many much some each every ' +
    'round rounds row rows not no yes use using used stuff stuffing sew sewing pin place marker markers ' +
    'see note notes photo picture tip tips optional continue continuing spiral join joined joining ' +
    'pattern stitch stitches hook hooks loop loops front back both other into onto over under through ' +
    'from with without for and but nor was were are has have had been being get got let put set sit'
  ).split(/\s+/),
);

export function isPlainWord(word: string): boolean {
  return PLAIN_WORDS.has(word);
}

function distance(a: string, b: string, limit: number): number {
  const la = a.length;
  const lb = b.length;
  if (Math.abs(la - lb) > limit) return limit + 1;
  // Full matrix: words are short (≤ 12 letters in the vocabulary), so this stays cheap.
  const d: number[][] = [];
  for (let i = 0; i <= la; i++) {
    d.push(new Array<number>(lb + 1).fill(0));
    d[i][0] = i;
  }
  for (let j = 0; j <= lb; j++) d[0][j] = j;
  for (let i = 1; i <= la; i++) {
    let rowMin = Infinity;
    for (let j = 1; j <= lb; j++) {
      const cost = a[i - 1] === b[j - 1] ? 0 : 1;
      let v = Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1, d[i - 1][j - 1] + cost);
      if (i > 1 && j > 1 && a[i - 1] === b[j - 2] && a[i - 2] === b[j - 1]) v = Math.min(v, d[i - 2][j - 2] + 1);
      d[i][j] = v;
      if (v < rowMin) rowMin = v;
    }
    if (rowMin > limit) return limit + 1;
  }
  return d[la][lb];
}

const VOCAB: Record<Terms, string[]> = { us: vocabulary('us'), uk: vocabulary('uk') };
const cache = new Map<string, string | null>();

/** The known word closest to an unknown one, or null when nothing is close enough to be a slip. */
export function suggest(word: string, terms: Terms): string | null {
  const key = terms + ':' + word;
  const hit = cache.get(key);
  if (hit !== undefined) return hit;
  let best: string | null = null;
  if (word.length >= 2 && word.length <= 14 && !PLAIN_WORDS.has(word) && /^[a-z][a-z0-9]*$/.test(word)) {
    // Short words get one slip, longer ones two.
    const limit = word.length <= 4 ? 1 : 2;
    let bestD = limit + 1;
    for (const v of VOCAB[terms]) {
      if (v.length < 2) continue;
      const dd = distance(word, v, limit);
      // Prefer stitches over structure words on ties by list order (stitches come first).
      if (dd < bestD) {
        bestD = dd;
        best = v;
      }
    }
    if (bestD > limit) best = null;
  }
  if (cache.size > 5000) cache.clear();
  cache.set(key, best);
  return best;
}
