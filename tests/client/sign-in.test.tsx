import { describe, expect, it } from 'vitest';
import { screen, waitFor } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server, me } from './mocks/server';
import { renderRoute } from './render';

describe('the sign-in page', () => {
  it('sends a signed-out visitor from a member page to sign-in, and back after signing in', async () => {
    let signedIn = false;
    server.use(
      http.get('*/api/auth/me', () => (signedIn ? HttpResponse.json({ user: me }) : HttpResponse.json({ error: 'Please sign in to continue.' }, { status: 401 }))),
      http.get('*/api/projects', () => HttpResponse.json({ projects: [] })),
      http.post('*/api/auth/signin', async ({ request }) => {
        const body = (await request.json()) as { email: string; password: string };
        if (body.password !== 'loops-and-rounds') return HttpResponse.json({ error: 'That e-mail and password do not match an account.' }, { status: 401 });
        signedIn = true;
        return HttpResponse.json({ user: me });
      }),
    );
    const { router } = renderRoute('/');
    expect(await screen.findByRole('heading', { name: 'Welcome back' })).toBeInTheDocument();
    expect(router.state.location.search).toBe('?next=%2F');

    const user = userEvent.setup();
    await user.type(screen.getByLabelText('E-mail'), 'maker@example.com');
    await user.type(screen.getByLabelText('Password'), 'wrong-password');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText(/do not match an account/)).toBeInTheDocument();

    await user.clear(screen.getByLabelText('Password'));
    await user.type(screen.getByLabelText('Password'), 'loops-and-rounds');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByRole('heading', { name: 'On the hook' })).toBeInTheDocument();
    await waitFor(() => expect(router.state.location.pathname).toBe('/'));
  });

  it('shows inline errors from the shared zod schema before sending anything', async () => {
    server.use(http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in.' }, { status: 401 })));
    renderRoute('/sign-in');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('E-mail'), 'not-an-email');
    await user.click(screen.getByRole('button', { name: 'Sign in' }));
    expect(await screen.findByText(/Enter an e-mail address/)).toBeInTheDocument();
    expect(screen.getByText('Enter your password.')).toBeInTheDocument();
  });

  it('offers the demo account when the server has demo data', async () => {
    server.use(
      http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in.' }, { status: 401 })),
      http.get('*/api/auth/demo', () => HttpResponse.json({ demo: { email: 'demo-maker@example.com', password: 'loops-and-rounds' } })),
    );
    renderRoute('/sign-in');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Fill in the demo account' }));
    expect(screen.getByLabelText('E-mail')).toHaveValue('demo-maker@example.com');
  });
});
