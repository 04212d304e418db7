// The stitches CLI: the shape the checks rely on, spawned as the real process.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';

// Each case spawns Node with tsx (about half a second, more on a busy machine).
vi.setConfig({ testTimeout: 30_000 });

const dir = mkdtempSync(join(tmpdir(), 'whorlbook-stitches-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function run(args: string[], input?: string) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', 'server/cli/stitches.ts', ...args], {
    cwd: process.cwd(),
    encoding: 'utf8',
    input,
    timeout: 30_000,
  });
  return { status: r.status, stdout: r.stdout, stderr: r.stderr };
}

function file(name: string, text: string): string {
  const p = join(dir, name);
  writeFileSync(p, text);
  return p;
}

describe('stitches FILE', () => {
  it('prints terms, rounds (with problems as sentences) and notes', () => {
    const p = file('cap.txt', 'Acorn cap\nRnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)\nRnd 3: (sc, inc) x6 (19)\nStuff firmly');
    const r = run([p]);
    expect(r.status).toBe(0);
    const out = JSON.parse(r.stdout);
    expect(Object.keys(out)).toEqual(['terms', 'rounds', 'notes']);
    expect(out.terms).toBe('us');
    expect(out.rounds).toEqual([
      { number: 1, label: 'Rnd 1', stitches: 6, worked: 0, stated: 6, made: { sc: 6 }, problems: [] },
      { number: 2, label: 'Rnd 2', stitches: 12, worked: 6, stated: 12, made: { sc: 12 }, problems: [] },
      { number: 3, label: 'Rnd 3', stitches: 18, worked: 12, stated: 19, made: { sc: 18 }, problems: ['Round 3 makes 18 stitches, not 19'] },
    ]);
    expect(out.notes.map((n: { text: string; kind: string }) => [n.text, n.kind])).toEqual([
      ['Acorn cap', 'other'],
      ['Stuff firmly', 'stuffing'],
    ]);
  });

  it('reads UK terms and a start count', () => {
    const p = file('uk.txt', 'Rnd 7: (2 dc, dc2tog) x6 (18)');
    const out = JSON.parse(run([p, '--terms', 'uk', '--start', '24']).stdout);
    expect(out.terms).toBe('uk');
    expect(out.rounds[0]).toMatchObject({ number: 7, stitches: 18, worked: 24, made: { sc: 12, sc2tog: 6 }, problems: [] });
  });

  it('reads standard input for "-"', () => {
    const out = JSON.parse(run(['-'], 'Rnd 1: 6 sc in MR (6)\n').stdout);
    expect(out.rounds[0].stitches).toBe(6);
  });
});

describe('stitches --plan', () => {
  it('prints the instruction', () => {
    expect(JSON.parse(run(['--plan', '24', '30']).stdout)).toEqual({ instruction: '(3 sc, inc) x6' });
    expect(JSON.parse(run(['--plan', '30', '24']).stdout)).toEqual({ instruction: '(3 sc, dec) x6' });
    expect(JSON.parse(run(['--plan', '18', '24', '--staggered']).stdout)).toEqual({ instruction: 'sc, inc, (2 sc, inc) x5, sc' });
  });
});

describe('bad arguments', () => {
  it.each([
    [[]],
    [['--terms', 'fr', 'x.txt']],
    [['--start', 'many', 'x.txt']],
    [['--plan', '24']],
    [['--plan', 'a', 'b']],
    [['--plan', '10', '30']],
    [['--bogus']],
    [[join(dir, 'missing.txt')]],
  ])('%j: a usage line on stderr and exit 2', (args) => {
    const r = run(args);
    expect(r.status).toBe(2);
    expect(r.stdout).toBe('');
    expect(r.stderr.split('\n')[0]).toMatch(/^usage: stitches FILE \[--terms us\|uk\] \[--start N\]/);
  });
});
