import '@testing-library/jest-dom/vitest';
import { afterAll, afterEach, beforeAll, vi } from 'vitest';
import { cleanup, configure } from '@testing-library/react';
import { server } from '../client/mocks/server';
import { clearQueryClients } from '../client/render';

// findBy*/waitFor give a busy shared 2-core machine time to render before calling it a failure.
configure({ asyncUtilTimeout: 5000 });

// Requests still on their way when a test ends (a page the test navigated to, a refetch) must be answered by that
// test's handlers, not fall through to the next test as "unhandled". So the hook below waits for them.
const inFlight = new Set<string>();
server.events.on('request:start', ({ requestId }) => void inFlight.add(requestId));
server.events.on('request:end', ({ requestId }) => void inFlight.delete(requestId));

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

// MSW announces a request a few ticks after fetch() is called, so "nothing in flight" must hold across a pause.
async function networkIdle(limitMs = 3000) {
  const until = Date.now() + limitMs;
  do await sleep(20);
  while (inFlight.size && Date.now() < until);
  inFlight.clear();
}

// Only the network is mocked (MSW); an unhandled request fails the test, and so does an unexpected console.error.
beforeAll(() => server.listen({ onUnhandledRequest: 'error' }));
afterAll(() => server.close());

let consoleErrors: unknown[][] = [];
const original = console.error;
beforeAll(() => {
  vi.spyOn(console, 'error').mockImplementation((...args: unknown[]) => {
    consoleErrors.push(args);
    original(...args);
  });
});

// One hook, in this order, so a failing check can never skip the clean-up: unmount the page (a test left mounted
// would be found by the next test's queries), let its last requests finish under its own handlers, reset the
// handlers, and only then fail the test for any console.error it caused.
afterEach(async () => {
  cleanup();
  clearQueryClients();
  await networkIdle();
  server.resetHandlers();
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
