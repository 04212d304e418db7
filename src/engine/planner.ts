// The round planner: the most even round of increases or decreases from FROM stitches to TO, written
// in our own notation, e.g. 24 → 30 "(3 sc, inc) x6", 30 → 24 "(3 sc, dec) x6".
//
// Rules:
// - Increases use "inc" (2 sc in one stitch), so at most one per stitch: TO ≤ 2·FROM.
// - Decreases use "dec" (sc2tog), each over 2 stitches: TO ≥ ceil(FROM / 2).
// - The k changes split the other stitches into k runs whose lengths differ by at most one; the
//   shorter runs come first: "(2 sc, inc) x5, (3 sc, inc) x2".
// - staggered shifts the start by about half a run ("sc, inc, (2 sc, inc) x5, sc") so the changes of
//   successive rounds do not stack into corners.

import { convertTerms } from './terms';
import type { Plan, PlanOptions } from './types';

function scRun(n: number): string {
  return n === 1 ? 'sc' : `${n} sc`;
}

function unit(sc: number, change: string): string {
  return sc === 0 ? change : `${scRun(sc)}, ${change}`;
}

function repeatOf(sc: number, change: string, times: number): string {
  if (times === 1) return unit(sc, change);
  return sc === 0 ? `${change} x${times}` : `(${unit(sc, change)}) x${times}`;
}

export function planRound(from: number, to: number, opts: PlanOptions = {}): Plan {
  if (!Number.isInteger(from) || !Number.isInteger(to)) {
    throw new RangeError(`The round planner needs whole stitch counts; got ${from} and ${to}.`);
  }
  if (from < 1) throw new RangeError(`The previous round must have at least 1 stitch; got ${from}.`);
  if (to < 1) throw new RangeError(`The new round must have at least 1 stitch; got ${to}.`);
  if (to > 2 * from) {
    throw new RangeError(
      `${from} stitches can grow to at most ${2 * from} in one round (one inc in every stitch); ${to} needs more than one round.`,
    );
  }
  if (to < Math.ceil(from / 2)) {
    throw new RangeError(
      `${from} stitches can shrink to no fewer than ${Math.ceil(from / 2)} in one round (one dec over every 2 stitches); ${to} needs more than one round.`,
    );
  }
  let instruction: string;
  if (to === from) instruction = scRun(from);
  else {
    const increasing = to > from;
    const k = increasing ? to - from : from - to;
    const change = increasing ? 'inc' : 'dec';
    const rest = increasing ? from - k : from - 2 * k;
    const q = Math.floor(rest / k);
    const r = rest % k;
    // Runs in order: k − r runs of q sc, then r runs of q + 1 sc, each followed by the change.
    const runs: Array<{ sc: number; times: number }> = [];
    if (k - r > 0) runs.push({ sc: q, times: k - r });
    if (r > 0) runs.push({ sc: q + 1, times: r });
    if (opts.staggered && runs[0].sc > 0) {
      // Split the first run: half its sc before the first change, the other half at the end.
      const first = runs[0];
      const lead = Math.floor(first.sc / 2);
      const tail = first.sc - lead;
      const parts: string[] = [unit(lead, change)];
      if (first.times > 1) parts.push(repeatOf(first.sc, change, first.times - 1));
      for (const run of runs.slice(1)) parts.push(repeatOf(run.sc, change, run.times));
      parts.push(scRun(tail));
      instruction = parts.join(', ');
    } else {
      instruction = runs.map((run) => repeatOf(run.sc, change, run.times)).join(', ');
    }
  }
  if (opts.terms === 'uk') instruction = convertTerms(instruction, 'us', 'uk');
  return { instruction };
}
