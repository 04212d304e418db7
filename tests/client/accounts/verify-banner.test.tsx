import { beforeEach, describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { me, server } from '../mocks/server';
import { renderRoute } from '../render';

const unverified = { ...me, emailVerified: false };

beforeEach(() => {
  sessionStorage.clear();
  server.use(
    http.get('*/api/auth/me', () => HttpResponse.json({ user: unverified })),
    http.get('*/api/projects', () => HttpResponse.json({ projects: [] })),
  );
});

describe('the unconfirmed-e-mail banner', () => {
  it('asks an unconfirmed member to confirm and re-sends the link', async () => {
    let sent = 0;
    server.use(
      http.post('*/api/auth/verify-email/resend', () => {
        sent += 1;
        return HttpResponse.json({ ok: true, message: 'We sent a new confirmation link to maker@example.com. It lasts 48 hours.' }, { status: 202 });
      }),
    );
    renderRoute('/');
    expect(await screen.findByText('Please confirm your e-mail')).toBeInTheDocument();
    await userEvent.setup().click(screen.getByRole('button', { name: 'Send the link again' }));
    expect(await screen.findByText(/We sent a new confirmation link/)).toBeInTheDocument();
    expect(sent).toBe(1);
  });

  it('shows the rate-limit sentence when the member asked too often', async () => {
    server.use(
      http.post('*/api/auth/verify-email/resend', () =>
        HttpResponse.json({ error: 'We have already sent several confirmation e-mails. Check your inbox and spam folder, or wait 51 minutes to ask again.' }, { status: 429 }),
      ),
    );
    renderRoute('/');
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Send the link again' }));
    expect(await screen.findByRole('alert')).toHaveTextContent(/wait 51 minutes/);
  });

  it('hides for the rest of the browser session after "Not now"', async () => {
    const first = renderRoute('/');
    await userEvent.setup().click(await screen.findByRole('button', { name: 'Not now' }));
    expect(screen.queryByText('Please confirm your e-mail')).not.toBeInTheDocument();
    first.unmount();
    renderRoute('/');
    expect(await screen.findByRole('heading', { name: 'On the hook' })).toBeInTheDocument();
    expect(screen.queryByText('Please confirm your e-mail')).not.toBeInTheDocument();
  });

  it('is not shown to a confirmed member', async () => {
    server.use(http.get('*/api/auth/me', () => HttpResponse.json({ user: me })));
    renderRoute('/');
    expect(await screen.findByRole('heading', { name: 'On the hook' })).toBeInTheDocument();
    expect(screen.queryByText('Please confirm your e-mail')).not.toBeInTheDocument();
  });
});
