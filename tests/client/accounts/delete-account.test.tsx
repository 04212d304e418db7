import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';

const slow = { timeout: 5000 };

describe('deleting the account', () => {
  it('asks for the password, then asks once more saying what goes, then deletes and leaves for the sign-in page', async () => {
    let body: unknown = null;
    server.use(
      http.delete('*/api/auth/account', async ({ request }) => {
        body = await request.json();
        return HttpResponse.json({ ok: true, message: 'Your account and everything in it are deleted.' });
      }),
    );
    const { router } = renderRoute('/account');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Delete my account' }, slow));
    expect(await screen.findByText('Enter your password to confirm.')).toBeInTheDocument();
    expect(body).toBeNull();

    await user.type(screen.getByLabelText('Your password'), 'my long password');
    await user.click(screen.getByRole('button', { name: 'Delete my account' }));
    const dialog = await screen.findByRole('dialog', { name: 'Delete your account and everything in it?' });
    // Changing one's mind sends nothing.
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    expect(body).toBeNull();

    await user.click(screen.getByRole('button', { name: 'Delete my account' }));
    await user.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Delete everything' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/sign-in'));
    expect(body).toEqual({ password: 'my long password' });
  });

  it('puts a wrong password under the field and keeps the member here', async () => {
    server.use(
      http.delete('*/api/auth/account', () =>
        HttpResponse.json({ error: 'That is not your password.', issues: [{ path: 'password', message: 'That is not your password.' }] }, { status: 403 }),
      ),
    );
    const { router } = renderRoute('/account');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Your password', {}, slow), 'not it');
    await user.click(screen.getByRole('button', { name: 'Delete my account' }));
    await user.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Delete everything' }));
    expect(await screen.findByText('That is not your password.')).toBeInTheDocument();
    expect(screen.getByLabelText('Your password')).toHaveAttribute('aria-invalid', 'true');
    expect(router.state.location.pathname).toBe('/account');
  });

  it("shows the server's sentence when the only admin tries to leave", async () => {
    server.use(
      http.delete('*/api/auth/account', () =>
        HttpResponse.json({ error: 'You are the only admin. Make another member an admin before deleting your account.' }, { status: 409 }),
      ),
    );
    renderRoute('/account');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Your password', {}, slow), 'my long password');
    await user.click(screen.getByRole('button', { name: 'Delete my account' }));
    await user.click(within(await screen.findByRole('dialog')).getByRole('button', { name: 'Delete everything' }));
    expect(await screen.findByText(/You are the only admin/)).toBeInTheDocument();
    expect(screen.getByText('Your account was not deleted')).toBeInTheDocument();
  });
});
