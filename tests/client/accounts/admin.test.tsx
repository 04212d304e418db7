import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';

const adminMe = { id: 'a1', email: 'admin@example.com', displayName: 'Head admin', role: 'admin', emailVerified: true };

function member(i: number, over: Record<string, unknown> = {}) {
  return {
    id: `m${i}`,
    email: `maker${i}@example.com`,
    displayName: `Maker ${i}`,
    role: 'member',
    emailVerified: true,
    disabled: false,
    disabledAt: null,
    lastSignInAt: i % 2 ? '2026-11-30T10:00:00.000Z' : null,
    createdAt: '2026-11-01T10:00:00.000Z',
    projectCount: i,
    ...over,
  };
}

/** A small fake of GET /api/admin/users that records every query it is asked. */
function fakeMembers(total = 45) {
  const asked: URLSearchParams[] = [];
  const disabled = new Set<string>();
  const admins = new Set<string>();
  server.use(
    http.get('*/api/auth/me', () => HttpResponse.json({ user: adminMe })),
    http.get('*/api/admin/users', ({ request }) => {
      const q = new URL(request.url).searchParams;
      asked.push(q);
      const page = Number(q.get('page') ?? 1);
      const query = q.get('query') ?? '';
      const all = Array.from({ length: total }, (_, i) => member(i + 1, { disabled: disabled.has(`m${i + 1}`), role: admins.has(`m${i + 1}`) ? 'admin' : 'member' })).filter((m) => m.displayName.toLowerCase().includes(query.toLowerCase()));
      return HttpResponse.json({ users: all.slice((page - 1) * 20, page * 20), page, pageSize: 20, total: all.length, pageCount: Math.max(1, Math.ceil(all.length / 20)) });
    }),
    http.post('*/api/admin/users/:id/role', async ({ params, request }) => {
      const { role } = (await request.json()) as { role: string };
      if (role === 'admin') admins.add(String(params.id));
      else admins.delete(String(params.id));
      return HttpResponse.json({ user: member(Number(String(params.id).slice(1)), { role }) });
    }),
    http.post('*/api/admin/users/:id/disable', ({ params }) => {
      disabled.add(String(params.id));
      return HttpResponse.json({ user: member(Number(String(params.id).slice(1)), { disabled: true }) });
    }),
  );
  return { asked, disabled, admins };
}

describe('the admin members screen', () => {
  it('lists members with project counts and last sign-in, asking the server for the first page, newest first', async () => {
    const { asked } = fakeMembers();
    renderRoute('/admin');
    expect(await screen.findByRole('heading', { name: 'Members' })).toBeInTheDocument();
    const row = (await screen.findByText('Maker 3', { selector: 'p' })).closest('tr')!;
    expect(within(row).getByText('3')).toBeInTheDocument();
    expect(within(row).getByText('maker3@example.com')).toBeInTheDocument();
    expect(within((await screen.findByText('Maker 2', { selector: 'p' })).closest('tr')!).getByText('Never')).toBeInTheDocument();
    expect(screen.getByText(/Page/).textContent).toMatch(/Page 1 of 3 · 45 members/);
    expect(asked[0]!.get('page')).toBe('1');
    expect(asked[0]!.get('sort')).toBe('-created');
  });

  it('sorts on the server when a column header is pressed, and from the sort menu', async () => {
    const { asked } = fakeMembers();
    renderRoute('/admin');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: /^Projects/ }));
    await waitFor(() => expect(asked.at(-1)!.get('sort')).toBe('-projects')); // most first on the first press
    expect(screen.getByRole('columnheader', { name: /Projects/ })).toHaveAttribute('aria-sort', 'descending');
    await user.click(screen.getByRole('button', { name: /^Projects/ }));
    await waitFor(() => expect(asked.at(-1)!.get('sort')).toBe('projects'));
    await user.selectOptions(screen.getByLabelText('Sort by'), 'email');
    await waitFor(() => expect(asked.at(-1)!.get('sort')).toBe('email'));
  });

  it('pages on the server, and a new search goes back to page 1', async () => {
    const { asked } = fakeMembers();
    renderRoute('/admin');
    const user = userEvent.setup();
    await screen.findByText('Maker 1', { selector: 'p' });
    await user.click(screen.getByRole('button', { name: /Next/ }));
    expect(await screen.findByText('Maker 21', { selector: 'p' })).toBeInTheDocument();
    expect(asked.at(-1)!.get('page')).toBe('2');
    await user.type(screen.getByLabelText('Find a member'), 'Maker 4');
    await waitFor(() => expect(asked.at(-1)!.get('query')).toBe('Maker 4'));
    expect(asked.at(-1)!.get('page')).toBe('1');
    expect(await screen.findByText('Maker 40', { selector: 'p' })).toBeInTheDocument();
    expect(screen.queryByText('Maker 21', { selector: 'p' })).not.toBeInTheDocument();
  });

  it('disables a member only after the confirmation, then shows them as disabled', async () => {
    const { disabled } = fakeMembers(3);
    renderRoute('/admin');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Disable Maker 2' }));
    expect(await screen.findByText('Disable Maker 2?')).toBeInTheDocument();
    expect(disabled.size).toBe(0);
    await user.click(screen.getByRole('button', { name: 'Disable member' }));
    await waitFor(() => expect(disabled.has('m2')).toBe(true));
    const row = (await screen.findByText('Maker 2', { selector: 'p' })).closest('tr')!;
    expect(await within(row).findByText('Disabled')).toBeInTheDocument();
    expect(within(row).getByRole('button', { name: 'Re-enable Maker 2' })).toBeInTheDocument();
  });

  it('makes a member an admin after the confirmation, shows the badge, and can make them a member again', async () => {
    const { admins } = fakeMembers(3);
    renderRoute('/admin');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Make admin Maker 3' }));
    expect(await screen.findByText('Make Maker 3 an admin?')).toBeInTheDocument();
    expect(admins.size).toBe(0);
    await user.click(within(screen.getByRole('dialog')).getByRole('button', { name: 'Make admin' }));
    await waitFor(() => expect(admins.has('m3')).toBe(true));
    const row = (await screen.findByText('Maker 3', { selector: 'p' })).closest('tr')!;
    expect(await within(row).findByText('Admin')).toBeInTheDocument();
    await user.click(within(row).getByRole('button', { name: 'Make member Maker 3' }));
    await user.click(within(screen.getByRole('dialog')).getByRole('button', { name: 'Make member' }));
    await waitFor(() => expect(admins.has('m3')).toBe(false));
  });

  it('does not offer to disable the admin themselves', async () => {
    fakeMembers(0);
    server.use(
      http.get('*/api/admin/users', () =>
        HttpResponse.json({ users: [member(1, { id: 'a1', displayName: 'Head admin', role: 'admin' })], page: 1, pageSize: 20, total: 1, pageCount: 1 }),
      ),
    );
    renderRoute('/admin');
    expect(await screen.findByText('(you)')).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Disable/ })).not.toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Make member/ })).not.toBeInTheDocument();
  });

  it('is not open to a member: the route sends them home', async () => {
    server.use(http.get('*/api/projects', () => HttpResponse.json({ projects: [] })));
    const { router } = renderRoute('/admin');
    expect(await screen.findByRole('heading', { name: 'On the hook' })).toBeInTheDocument();
    expect(router.state.location.pathname).toBe('/');
  });
});
