// `npm run dev`: Vite on :5173 (proxying /api, /media and /p to Express) and the Express server, both reloading.
import { spawn } from 'node:child_process';
import path from 'node:path';

const bin = (name) => path.resolve('node_modules/.bin', name);
const children = [
  spawn(bin('tsx'), ['watch', '--clear-screen=false', 'server/index.ts'], { stdio: 'inherit', env: { ...process.env, NODE_ENV: 'development' } }),
  spawn(bin('vite'), [], { stdio: 'inherit' }),
];
const stop = () => children.forEach((c) => c.kill('SIGTERM'));
process.on('SIGINT', stop);
process.on('SIGTERM', stop);
children.forEach((c) => c.on('exit', (code) => { stop(); process.exitCode = code ?? 0; }));
