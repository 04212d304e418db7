// `npm start` on a fresh clone: build the client when dist/ is missing or older than its sources.
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import path from 'node:path';

const built = path.resolve('dist/index.html');
const sources = ['src', 'public', 'index.html', 'vite.config.ts', 'tailwind.config.ts'];

function newest(p) {
  if (!fs.existsSync(p)) return 0;
  const st = fs.statSync(p);
  if (!st.isDirectory()) return st.mtimeMs;
  return Math.max(0, ...fs.readdirSync(p).map((f) => newest(path.join(p, f))));
}

const stale = !fs.existsSync(built) || Math.max(...sources.map(newest)) > fs.statSync(built).mtimeMs;
if (stale) {
  console.log('Building the Whorlbook client (first start or sources changed)…');
  const r = spawnSync(process.execPath, [path.resolve('node_modules/vite/bin/vite.js'), 'build'], { stdio: 'inherit' });
  if (r.status !== 0) process.exit(r.status ?? 1);
}
