import { setupServer } from 'msw/node';
import { http, HttpResponse } from 'msw';

/** Default handlers: a signed-in demo member with no demo banner. Tests add their own with server.use(). */
export const me = { id: 'u1', email: 'maker@example.com', displayName: 'Test maker', role: 'member', emailVerified: true };

export const defaultHandlers = [
  http.get('*/api/auth/me', () => HttpResponse.json({ user: me })),
  http.get('*/api/auth/demo', () => HttpResponse.json({ demo: null })),
  // The project page asks the hook roll about each piece's hook; an empty roll unless a test says otherwise.
  http.get('*/api/hooks', () => HttpResponse.json({ hooks: [] })),
];

export const server = setupServer(...defaultHandlers);
