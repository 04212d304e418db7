import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';

const TOKEN = 'Abc_def-123456789012345678901234567890123';

describe('the verify-email page', () => {
  it('confirms with the token from the link, once, without signing in', async () => {
    const bodies: unknown[] = [];
    server.use(
      http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in.' }, { status: 401 })),
      http.post('*/api/auth/verify-email', async ({ request }) => {
        bodies.push(await request.json());
        return HttpResponse.json({ ok: true, email: 'ada@example.com' });
      }),
    );
    renderRoute(`/verify-email?token=${TOKEN}`);
    expect(await screen.findByText('E-mail confirmed')).toBeInTheDocument();
    expect(screen.getByText('ada@example.com')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Sign in' })).toBeInTheDocument();
    expect(bodies).toEqual([{ token: TOKEN }]);
  });

  it('shows the server’s sentence for a used link', async () => {
    server.use(
      http.post('*/api/auth/verify-email', () =>
        HttpResponse.json({ error: 'This confirmation link was already used. If your address still shows as unconfirmed, ask for a new link.' }, { status: 400 }),
      ),
    );
    renderRoute(`/verify-email?token=${TOKEN}`);
    expect(await screen.findByText(/already used/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to On the hook' })).toBeInTheDocument(); // signed in (default handler)
  });

  it('says the link is incomplete instead of sending a cut-off token', async () => {
    let sent = false;
    server.use(
      http.post('*/api/auth/verify-email', () => {
        sent = true;
        return HttpResponse.json({ ok: true, email: 'x' });
      }),
    );
    renderRoute('/verify-email?token=abc');
    expect(await screen.findByText('This link is not complete')).toBeInTheDocument();
    expect(sent).toBe(false);
  });
});
