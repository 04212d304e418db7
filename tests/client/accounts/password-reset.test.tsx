import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';

const signedOut = () => http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in.' }, { status: 401 }));
const TOKEN = 'Abc_def-123456789012345678901234567890123';
const SAME = 'If an account uses that e-mail address, we have sent it a link to choose a new password.';

describe('forgot password', () => {
  it('sends the e-mail and shows the server’s one answer, with the outbox while the mail fake runs', async () => {
    let body: unknown;
    server.use(
      signedOut(),
      http.post('*/api/auth/password-reset/request', async ({ request }) => {
        body = await request.json();
        return HttpResponse.json({ ok: true, message: SAME }, { status: 202 });
      }),
      http.get('*/api/dev/outbox', () => HttpResponse.json([])),
    );
    renderRoute('/forgot-password');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail'), ' maker@example.com ');
    await user.click(screen.getByRole('button', { name: 'Send me a reset link' }));
    expect(await screen.findByText(SAME)).toBeInTheDocument();
    expect(body).toEqual({ email: 'maker@example.com' });
    expect(await screen.findByRole('link', { name: 'Open the outbox' })).toHaveAttribute('href', '/dev/outbox');
  });

  it('says nothing about an outbox when the server sends real e-mail', async () => {
    server.use(
      signedOut(),
      http.post('*/api/auth/password-reset/request', () => HttpResponse.json({ ok: true, message: SAME }, { status: 202 })),
      http.get('*/api/dev/outbox', () => HttpResponse.json({ error: 'There is no API route GET /api/dev/outbox.' }, { status: 404 })),
    );
    renderRoute('/forgot-password');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail'), 'maker@example.com');
    await user.click(screen.getByRole('button', { name: 'Send me a reset link' }));
    expect(await screen.findByText(SAME)).toBeInTheDocument();
    await new Promise((r) => setTimeout(r, 50));
    expect(screen.queryByRole('link', { name: 'Open the outbox' })).not.toBeInTheDocument();
  });
});

describe('reset password', () => {
  it('sends the token from the link with the new password, then offers sign-in', async () => {
    let body: unknown;
    server.use(
      signedOut(),
      http.post('*/api/auth/password-reset/confirm', async ({ request }) => {
        body = await request.json();
        return HttpResponse.json({ ok: true, message: 'Your password is changed and every device was signed out. Sign in with the new password.' });
      }),
    );
    renderRoute(`/reset-password?token=${TOKEN}`);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('New password'), 'a fresh long passphrase');
    await user.click(screen.getByRole('button', { name: 'Save my new password' }));
    expect(await screen.findByText(/every device was signed out/)).toBeInTheDocument();
    expect(body).toEqual({ token: TOKEN, password: 'a fresh long passphrase' });
    expect(screen.getByRole('link', { name: 'Sign in' })).toHaveAttribute('href', '/sign-in');
  });

  it('shows why an expired or used link failed, with a way to ask again', async () => {
    server.use(
      signedOut(),
      http.post('*/api/auth/password-reset/confirm', () =>
        HttpResponse.json({ error: 'This reset link has expired (links last 1 hour). Ask for a new one from "Forgot your password?".' }, { status: 400 }),
      ),
    );
    renderRoute(`/reset-password?token=${TOKEN}`);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('New password'), 'a fresh long passphrase');
    await user.click(screen.getByRole('button', { name: 'Save my new password' }));
    expect(await screen.findByText(/has expired/)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Ask for a new link' })).toHaveAttribute('href', '/forgot-password');
  });

  it('refuses a common password inline (NIST SP 800-63B §5.1.1.2 blocklist check)', async () => {
    server.use(signedOut());
    renderRoute(`/reset-password?token=${TOKEN}`);
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('New password'), 'password123');
    await user.click(screen.getByRole('button', { name: 'Save my new password' }));
    expect(await screen.findByText(/one of the first ones people guess/)).toBeInTheDocument();
  });

  it('explains what to do when the page is opened without a link', async () => {
    server.use(signedOut());
    renderRoute('/reset-password');
    expect(await screen.findByText('This page needs the link from your e-mail')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Ask for a reset link' })).toHaveAttribute('href', '/forgot-password');
  });
});
