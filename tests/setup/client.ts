import '@testing-library/jest-dom/vitest';
import { afterAll, afterEach, beforeAll, vi } from 'vitest';
import { cleanup, configure } from '@testing-library/react';
import { server } from '../client/mocks/server';

// findBy*/waitFor give a busy shared 2-core machine time to render before calling it a failure.
configure({ asyncUtilTimeout: 5000 });

// Only the network is mocked (MSW); an unhandled request fails the test, and so does an unexpected console.error.
beforeAll(() => server.listen({ onUnhandledRequest: 'error' }));
afterEach(() => {
  server.resetHandlers();
  cleanup();
});
afterAll(() => server.close());

let consoleErrors: unknown[][] = [];
const original = console.error;
beforeAll(() => {
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    consoleErrors.push(args);
    original(...args);
  });
});
afterEach(() => {
  const errors = consoleErrors;
  consoleErrors = [];
  if (errors.length) throw new Error(`console.error was called during the test:\n${errors.map((a) => a.map(String).join(' ')).join('\n')}`);
});

// happy-dom lacks matchMedia; the theme hook asks it.
if (!window.matchMedia) {
  window.matchMedia = ((query: string) => ({
    matches: false,
    media: query,
    onchange: null,
    addListener: () => {},
    removeListener: () => {},
    addEventListener: () => {},
    removeEventListener: () => {},
    dispatchEvent: () => false,
  })) as unknown as typeof window.matchMedia;
}
