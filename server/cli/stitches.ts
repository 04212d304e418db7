// npm run --silent stitches -- FILE [--terms us|uk] [--start N]
// npm run --silent stitches -- --plan FROM TO [--staggered]
// A thin shell over the stitch engine: prints JSON on stdout; bad arguments print a usage line on stderr
// and exit 2. FILE may be "-" for standard input.

import { readFileSync } from 'node:fs';
import { checkPiece, planRound, type Terms } from '../../src/engine/index';

const USAGE = 'usage: stitches FILE [--terms us|uk] [--start N] | stitches --plan FROM TO [--staggered]';

function fail(reason?: string): never {
  process.stderr.write(`${USAGE}\n`);
  if (reason) process.stderr.write(`stitches: ${reason}\n`);
  process.exit(2);
}

function wholeNumber(s: string | undefined, what: string, min: number): number {
  if (s === undefined || !/^\d+$/.test(s)) fail(`${what} must be a whole number`);
  const n = Number(s);
  if (!Number.isSafeInteger(n) || n < min) fail(`${what} must be a whole number of at least ${min}`);
  return n;
}

function main(argv: string[]): void {
  if (argv.includes('--plan')) {
    const rest = argv.filter((a) => a !== '--plan' && a !== '--staggered');
    const extra = argv.filter((a) => a.startsWith('--') && a !== '--plan' && a !== '--staggered');
    if (extra.length) fail(`unknown option ${extra[0]}`);
    if (rest.length !== 2) fail('--plan needs FROM and TO');
    const from = wholeNumber(rest[0], 'FROM', 1);
    const to = wholeNumber(rest[1], 'TO', 1);
    try {
      const plan = planRound(from, to, { staggered: argv.includes('--staggered') });
      process.stdout.write(JSON.stringify({ instruction: plan.instruction }) + '\n');
    } catch (e) {
      fail(e instanceof RangeError ? e.message : String(e));
    }
    return;
  }
  let file: string | undefined;
  let terms: Terms = 'us';
  let start = 0;
  for (let i = 0; i < argv.length; i++) {
    const a = argv[i];
    if (a === '--terms') {
      const v = argv[++i];
      if (v !== 'us' && v !== 'uk') fail('--terms must be us or uk');
      terms = v;
    } else if (a.startsWith('--terms=')) {
      const v = a.slice(8);
      if (v !== 'us' && v !== 'uk') fail('--terms must be us or uk');
      terms = v;
    } else if (a === '--start') start = wholeNumber(argv[++i], '--start', 0);
    else if (a.startsWith('--start=')) start = wholeNumber(a.slice(8), '--start', 0);
    else if (a.startsWith('--')) fail(`unknown option ${a}`);
    else if (file === undefined) file = a;
    else fail('only one FILE');
  }
  if (file === undefined) fail('FILE is missing');
  let text: string;
  try {
    text = readFileSync(file === '-' ? 0 : file, 'utf8');
  } catch (e) {
    fail(`cannot read ${file}: ${(e as NodeJS.ErrnoException).code ?? 'error'}`);
  }
  const check = checkPiece(text, { terms, start });
  const out = {
    terms: check.terms,
    rounds: check.rounds.map((r) => ({
      number: r.number,
      label: r.label,
      stitches: r.stitches,
      worked: r.worked,
      stated: r.stated,
      made: r.made,
      problems: r.problems.map((p) => p.message),
    })),
    notes: check.notes,
  };
  process.stdout.write(JSON.stringify(out, null, 2) + '\n');
}

main(process.argv.slice(2));
