import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';

describe('the account page', () => {
  it('shows the member and changes the password, keeping the form clear afterwards', async () => {
    let body: unknown;
    server.use(
      http.post('*/api/auth/password', async ({ request }) => {
        body = await request.json();
        return HttpResponse.json({ ok: true, message: 'Your password is changed. Other devices were signed out; this one stays signed in.' });
      }),
    );
    renderRoute('/account');
    expect(await screen.findByText('maker@example.com')).toBeInTheDocument();
    expect(screen.getByText('Confirmed')).toBeInTheDocument();
    const user = userEvent.setup();
    await user.type(screen.getByLabelText('Current password'), 'old long password');
    await user.type(screen.getByLabelText('New password'), 'new long passphrase');
    await user.click(screen.getByRole('button', { name: 'Change my password' }));
    expect(await screen.findByText(/Other devices were signed out/)).toBeInTheDocument();
    expect(body).toEqual({ current: 'old long password', next: 'new long passphrase' });
    expect(screen.getByLabelText('Current password')).toHaveValue('');
  });

  it('puts a wrong current password under that field', async () => {
    server.use(
      http.post('*/api/auth/password', () =>
        HttpResponse.json({ error: 'That is not your current password.', issues: [{ path: 'current', message: 'That is not your current password.' }] }, { status: 403 }),
      ),
    );
    renderRoute('/account');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Current password'), 'not it at all');
    await user.type(screen.getByLabelText('New password'), 'new long passphrase');
    await user.click(screen.getByRole('button', { name: 'Change my password' }));
    expect(await screen.findByText('That is not your current password.')).toBeInTheDocument();
    expect(screen.getByLabelText('Current password')).toHaveAttribute('aria-invalid', 'true');
  });

  it('refuses a new password equal to the current one before sending', async () => {
    renderRoute('/account');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Current password'), 'same long password');
    await user.type(screen.getByLabelText('New password'), 'same long password');
    await user.click(screen.getByRole('button', { name: 'Change my password' }));
    expect(await screen.findByText('Choose a new password that differs from the current one.')).toBeInTheDocument();
  });
});
