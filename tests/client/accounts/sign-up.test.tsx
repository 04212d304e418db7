import { describe, expect, it } from 'vitest';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';

const signedOut = () => http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in to continue.' }, { status: 401 }));

describe('the sign-up page', () => {
  it('shows the shared schema’s inline errors before sending anything', async () => {
    let sent = 0;
    server.use(
      signedOut(),
      http.post('*/api/auth/signup', () => {
        sent += 1;
        return HttpResponse.json({}, { status: 500 });
      }),
    );
    renderRoute('/sign-up');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail'), 'not-an-email');
    await user.type(screen.getByLabelText('Password'), 'short');
    await user.click(screen.getByRole('button', { name: 'Make my account' }));
    expect(await screen.findByText('Enter the name other makers will see.')).toBeInTheDocument();
    expect(screen.getByText(/Enter an e-mail address/)).toBeInTheDocument();
    // NIST SP 800-63B §5.1.1: length is the rule (we ask 10).
    expect(screen.getByText('Use at least 10 characters for your password.')).toBeInTheDocument();
    expect(screen.getByLabelText('Password')).toHaveAttribute('aria-invalid', 'true');
    expect(sent).toBe(0);
  });

  it('signs up, lands on On the hook and asks to confirm the e-mail', async () => {
    let body: unknown;
    let signedIn = false;
    const newMember = { id: 'u9', email: 'ada@example.com', displayName: 'Ada Loop', role: 'member', emailVerified: false };
    server.use(
      http.get('*/api/auth/me', () => (signedIn ? HttpResponse.json({ user: newMember }) : HttpResponse.json({ error: 'Please sign in.' }, { status: 401 }))),
      http.get('*/api/projects', () => HttpResponse.json({ projects: [] })),
      http.post('*/api/auth/signup', async ({ request }) => {
        body = await request.json();
        signedIn = true;
        return HttpResponse.json({ user: newMember }, { status: 201 });
      }),
    );
    const { router } = renderRoute('/sign-up');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Your name'), '  Ada Loop ');
    await user.type(screen.getByLabelText('E-mail'), 'ada@example.com');
    await user.type(screen.getByLabelText('Password'), 'round and round we go');
    await user.click(screen.getByLabelText('Show password'));
    expect(screen.getByLabelText('Password')).toHaveAttribute('type', 'text');
    await user.click(screen.getByRole('button', { name: 'Make my account' }));

    expect(await screen.findByRole('heading', { name: 'On the hook' })).toBeInTheDocument();
    await waitFor(() => expect(router.state.location.pathname).toBe('/'));
    expect(body).toEqual({ displayName: 'Ada Loop', email: 'ada@example.com', password: 'round and round we go' });
    expect(screen.getByText('Please confirm your e-mail')).toBeInTheDocument();
  });

  it('puts "already exists" under the e-mail field with a way to sign in', async () => {
    server.use(
      signedOut(),
      http.post('*/api/auth/signup', () => HttpResponse.json({ error: 'An account with that e-mail already exists. Try signing in instead.' }, { status: 409 })),
    );
    renderRoute('/sign-up');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Your name'), 'Ada');
    await user.type(screen.getByLabelText('E-mail'), 'taken@example.com');
    await user.type(screen.getByLabelText('Password'), 'round and round we go');
    await user.click(screen.getByRole('button', { name: 'Make my account' }));
    expect(await screen.findByText(/already exists/)).toBeInTheDocument();
    expect(screen.getByLabelText('E-mail')).toHaveAttribute('aria-invalid', 'true');
    expect(screen.getByRole('link', { name: 'Sign in with that e-mail instead' })).toHaveAttribute('href', '/sign-in');
  });

  it('shows a rate-limit sentence from the server in the form', async () => {
    server.use(
      signedOut(),
      http.post('*/api/auth/signup', () => HttpResponse.json({ error: 'Too many new accounts were made from this network. Wait 42 minutes and try again.' }, { status: 429, headers: { 'Retry-After': '2520' } })),
    );
    renderRoute('/sign-up');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Your name'), 'Ada');
    await user.type(screen.getByLabelText('E-mail'), 'ada@example.com');
    await user.type(screen.getByLabelText('Password'), 'round and round we go');
    await user.click(screen.getByRole('button', { name: 'Make my account' }));
    expect(await screen.findByText(/Wait 42 minutes/)).toBeInTheDocument();
    expect(screen.getByText('No account made yet')).toBeInTheDocument();
  });
});
