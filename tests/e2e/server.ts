import { spawn, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';

export interface RunningServer {
  url: string;
  dataDir: string;
  uploadsDir: string;
  child: ChildProcess;
  stop: (signal?: NodeJS.Signals) => Promise<void>;
}

/**
 * Starts the real Whorlbook server (tsx server/index.ts) on a free port with fresh data and uploads folders,
 * and resolves once it prints its "ready at" line. Reuse `dataDir` to restart on the same database.
 */
export async function startServer(options: { dataDir?: string; env?: Record<string, string> } = {}): Promise<RunningServer> {
  const root = options.dataDir ? path.dirname(options.dataDir) : fs.mkdtempSync(path.join(os.tmpdir(), 'whorlbook-e2e-'));
  const dataDir = options.dataDir ?? path.join(root, 'data');
  const uploadsDir = path.join(root, 'uploads');
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], {
    cwd: process.cwd(),
    env: { ...process.env, NODE_ENV: 'production', PORT: '0', HOST: '127.0.0.1', DATA_DIR: dataDir, UPLOADS_DIR: uploadsDir, LOG_LEVEL: 'warn', ...options.env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  const url = await new Promise<string>((resolve, reject) => {
    const timer = setTimeout(() => reject(new Error(`server did not start in 60 s:\n${output}`)), 60_000);
    const onData = (chunk: Buffer) => {
      output += chunk.toString();
      const m = output.match(/ready at (http:\/\/127\.0\.0\.1:\d+)/);
      if (m) {
        clearTimeout(timer);
        resolve(m[1]);
      }
    };
    child.stdout!.on('data', onData);
    child.stderr!.on('data', (c: Buffer) => (output += c.toString()));
    child.on('exit', (code) => {
      clearTimeout(timer);
      reject(new Error(`server exited with ${code} before it was ready:\n${output}`));
    });
  });
  return {
    url,
    dataDir,
    uploadsDir,
    child,
    stop: (signal = 'SIGTERM') =>
      new Promise((resolve) => {
        if (child.exitCode !== null || child.signalCode) return resolve();
        child.once('exit', () => resolve());
        child.kill(signal);
      }),
  };
}
