// `npm test`: typecheck, lint, Vitest (engine, server, client) and the browser tests, then one plain
// "N passed, N failed" line summed from the runners' JSON reports (the line CI reads). Exits non-zero on any failure.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const bin = (name) => path.resolve('node_modules/.bin', name);
const reports = path.resolve('reports');
fs.mkdirSync(reports, { recursive: true });
const chromium = process.env.CHROME_PATH ?? '/usr/bin/chromium';
const inCI = process.env.CI === 'true' || process.env.CI === '1';

let passed = 0;
let failed = 0;
let skipped = 0;
const failures = [];

function run(label, cmd, args, env = {}) {
  console.log(`\n━━ ${label} ━━`);
  const r = spawnSync(cmd, args, { stdio: 'inherit', env: { ...process.env, ...env } });
  return r.status === 0;
}

function step(label, cmd, args) {
  if (run(label, cmd, args)) passed += 1;
  else {
    failed += 1;
    failures.push(label);
  }
}

step('typecheck', bin('tsc'), ['--noEmit', '-p', '.']);
step('lint', bin('eslint'), ['.', '--max-warnings=0']);

const vitestJson = path.join(reports, 'vitest.json');
fs.rmSync(vitestJson, { force: true });
const vitestOk = run('vitest', bin('vitest'), ['run', '--reporter=default', '--reporter=json', `--outputFile=${vitestJson}`]);
if (fs.existsSync(vitestJson)) {
  const v = JSON.parse(fs.readFileSync(vitestJson, 'utf8'));
  passed += v.numPassedTests;
  failed += v.numFailedTests;
  skipped += v.numPendingTests + (v.numTodoTests ?? 0);
  if (!vitestOk && v.numFailedTests === 0) {
    failed += 1; // a suite that failed to load counts as a failure even with no failed test
    failures.push('vitest (a test file failed to run)');
  } else if (v.numFailedTests) failures.push(`vitest (${v.numFailedTests} failed)`);
} else {
  failed += 1;
  failures.push('vitest (no report)');
}

if (!fs.existsSync(chromium)) {
  if (inCI) {
    console.error(`\nChromium is missing at ${chromium}; the browser tests cannot run in CI. Install it with: apt-get install -y chromium`);
    failed += 1;
    failures.push('e2e (Chromium missing)');
  } else {
    console.warn(`\nSkipping the browser tests: Chromium was not found at ${chromium}. Install it with: apt-get install -y chromium`);
  }
} else {
  const pwJson = path.join(reports, 'playwright.json');
  fs.rmSync(pwJson, { force: true });
  const pwOk = run('browser tests (Playwright + Chromium)', bin('playwright'), ['test'], { PW_JSON_OUTPUT: pwJson });
  if (fs.existsSync(pwJson)) {
    const s = JSON.parse(fs.readFileSync(pwJson, 'utf8')).stats;
    passed += s.expected + (s.flaky ?? 0);
    failed += s.unexpected;
    skipped += s.skipped;
    if (s.unexpected) failures.push(`e2e (${s.unexpected} failed)`);
    else if (!pwOk) {
      failed += 1;
      failures.push('e2e (runner failed)');
    }
  } else {
    failed += 1;
    failures.push('e2e (no report)');
  }
}

console.log('');
if (failures.length) console.log(`Failed: ${failures.join(', ')}`);
console.log(`${passed} passed, ${failed} failed${skipped ? `, ${skipped} skipped` : ''}`);
process.exit(failed ? 1 : 0);
