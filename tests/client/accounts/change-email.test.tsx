import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';

const slow = { timeout: 5000 };
const token = 'T'.repeat(43);

describe('changing the e-mail on the Me page', () => {
  it('checks the fields before sending, then says where the link went and clears the form', async () => {
    let body: unknown = null;
    server.use(
      http.post('*/api/auth/email', async ({ request }) => {
        body = await request.json();
        return HttpResponse.json(
          { ok: true, message: 'We sent a link to new@example.com. Your sign-in address changes when you open it (within 24 hours); until then it stays as it is.' },
          { status: 202 },
        );
      }),
    );
    renderRoute('/account');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Send the link' }, slow));
    expect(await screen.findByText('Enter an e-mail address like name@example.com.')).toBeInTheDocument();
    expect(body).toBeNull();

    await user.type(screen.getByLabelText('New e-mail'), 'new@example.com');
    await user.type(screen.getByLabelText('Password'), 'my long password');
    await user.click(screen.getByRole('button', { name: 'Send the link' }));
    expect(await screen.findByText(/We sent a link to new@example.com/)).toBeInTheDocument();
    expect(body).toEqual({ email: 'new@example.com', password: 'my long password' });
    expect(screen.getByLabelText('New e-mail')).toHaveValue('');
    // The address shown is still the current one until the link is opened.
    expect(screen.getByText('maker@example.com')).toBeInTheDocument();
  });

  it('puts the server’s field issue under the field it names', async () => {
    server.use(
      http.post('*/api/auth/email', () =>
        HttpResponse.json({ error: 'That is already your e-mail address.', issues: [{ path: 'email', message: 'That is already your e-mail address.' }] }, { status: 422 }),
      ),
    );
    renderRoute('/account');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('New e-mail', {}, slow), 'maker@example.com');
    await user.type(screen.getByLabelText('Password'), 'my long password');
    await user.click(screen.getByRole('button', { name: 'Send the link' }));
    expect(await screen.findByText('That is already your e-mail address.')).toBeInTheDocument();
    expect(screen.getByLabelText('New e-mail')).toHaveAttribute('aria-invalid', 'true');
  });
});

describe('the link from the new address', () => {
  it('confirms the change once and says so', async () => {
    let calls = 0;
    server.use(
      http.post('*/api/auth/email/confirm', async ({ request }) => {
        calls += 1;
        expect(await request.json()).toEqual({ token });
        return HttpResponse.json({ ok: true, email: 'new@example.com', message: 'Done: you now sign in with new@example.com.' });
      }),
    );
    renderRoute(`/change-email?token=${token}`);
    expect(await screen.findByText('Done: you now sign in with new@example.com.', {}, slow)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Go to Me' })).toHaveAttribute('href', '/account');
    expect(calls).toBe(1);
  });

  it('shows the server’s sentence for a used or expired link, and a clear one for a cut-off link', async () => {
    server.use(
      http.post('*/api/auth/email/confirm', () =>
        HttpResponse.json({ error: 'This link to change your e-mail has expired (links last 24 hours). Ask again from the Me page.' }, { status: 400 }),
      ),
    );
    const first = renderRoute(`/change-email?token=${token}`);
    expect(await screen.findByText(/has expired \(links last 24 hours\)/, {}, slow)).toBeInTheDocument();
    first.unmount();
    renderRoute('/change-email?token=abc');
    expect(await screen.findByText('That link is not complete. Open the whole link from the e-mail.', {}, slow)).toBeInTheDocument();
  });
});
