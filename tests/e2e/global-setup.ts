import fs from 'node:fs';
import { spawnSync } from 'node:child_process';
import path from 'node:path';
import { chromiumPath } from '../../playwright.config';
import { startServer } from './server';

/** Builds the client, starts the real server on a free port with a temporary DATA_DIR, and hands its URL on. */
export default async function globalSetup() {
  if (!fs.existsSync(chromiumPath)) {
    throw new Error(`Chromium was not found at ${chromiumPath}. Install it with: apt-get install -y chromium (or set CHROME_PATH).`);
  }
  const build = spawnSync(process.execPath, [path.resolve('scripts/ensure-build.mjs')], { stdio: 'inherit' });
  if (build.status !== 0) throw new Error('The client build failed; see the output above.');
  const server = await startServer();
  process.env.E2E_BASE_URL = server.url;
  process.env.E2E_DATA_DIR = server.dataDir;
  return async () => {
    await server.stop();
  };
}
