import { defineConfig } from 'vitest/config';
import react from '@vitejs/plugin-react';
import { fileURLToPath } from 'node:url';

const alias = { '@': fileURLToPath(new URL('./src', import.meta.url)) };

// In CI a failed client or server test runs once more, as the browser tests do: CI machines are shared and a
// render can miss a 5 s wait there. The default reporter marks such a test "(retry x1)", so a flake stays visible,
// and a test that fails twice still fails the run.
const retry = process.env.CI === 'true' || process.env.CI === '1' ? 1 : 0;

// Three projects: the pure stitch engine, the server (real SQLite, supertest) and the client (happy-dom).
export default defineConfig({
  resolve: { alias },
  test: {
    projects: [
      {
        resolve: { alias },
        test: {
          name: 'engine',
          environment: 'node',
          include: ['tests/engine/**/*.test.ts', 'tests/reference/**/*.test.ts'],
        },
      },
      {
        resolve: { alias },
        test: {
          name: 'server',
          environment: 'node',
          include: ['tests/server/**/*.test.ts'],
          setupFiles: ['tests/setup/server.ts'],
          retry,
          testTimeout: 20_000,
          hookTimeout: 30_000,
        },
      },
      {
        plugins: [react()],
        resolve: { alias },
        test: {
          name: 'client',
          environment: 'happy-dom',
          include: ['tests/client/**/*.test.{ts,tsx}'],
          setupFiles: ['tests/setup/client.ts'],
          retry,
          testTimeout: 30_000,
        },
      },
    ],
  },
});
