import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server, me } from '../mocks/server';
import { renderRoute } from '../render';
import type { MakerProfile, Report } from '@/types/showcase';
import { XSS } from './fixtures';

function report(overrides: Partial<Report> = {}): Report {
  return {
    id: 5,
    target: 'comment',
    reason: 'Spam link',
    status: 'open',
    createdAt: new Date().toISOString(),
    handledAt: null,
    reporter: { displayName: 'Reporter Rue' },
    handledBy: null,
    page: { title: 'Pip the pocket owl', path: '/p/tok_abcdefghijklmnopqrstuv', ownerDisplayName: 'Hazel Brook', hidden: false },
    comment: { id: 9, body: XSS, authorDisplayName: 'Spammy Sam', hidden: false },
    openReportsOnTarget: 2,
    ...overrides,
  };
}

describe('the admin report queue (/admin/reports)', () => {
  it('shows the reported comment as text and hides it after confirming', async () => {
    let reports = [report()];
    const resolved: unknown[] = [];
    server.use(
      http.get('*/api/auth/me', () => HttpResponse.json({ user: { ...me, role: 'admin' } })),
      http.get('*/api/admin/reports', ({ request }) => {
        const status = new URL(request.url).searchParams.get('status');
        return HttpResponse.json({ reports: status === 'open' ? reports.filter((r) => r.status === 'open') : reports });
      }),
      http.post('*/api/admin/reports/5/resolve', async ({ request }) => {
        resolved.push(await request.json());
        reports = [report({ status: 'hidden', handledBy: { displayName: 'Admin Ada' }, handledAt: new Date().toISOString() })];
        return HttpResponse.json({ report: reports[0] });
      }),
    );
    const { container } = renderRoute('/admin/reports');
    expect(await screen.findByRole('heading', { name: 'Reports' })).toBeInTheDocument();
    expect(await screen.findByTestId('reported-comment')).toHaveTextContent(XSS);
    expect(container.querySelector('img[src="x"]')).toBeNull();
    expect(screen.getByText('2 open reports on this')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Pip the pocket owl' })).toHaveAttribute('href', '/p/tok_abcdefghijklmnopqrstuv');

    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: /Hide comment/ }));
    await user.click(within(screen.getByRole('dialog', { hidden: true })).getByRole('button', { name: 'Hide comment', hidden: true }));
    await waitFor(() => expect(resolved).toEqual([{ action: 'hide' }]));
    expect(await screen.findByText('No open reports')).toBeInTheDocument();
    await user.click(screen.getByRole('tab', { name: /Handled/ }));
    expect(await screen.findByText(/Hidden by Admin Ada/)).toBeInTheDocument();
  });

  it('is not shown to a member', async () => {
    server.use(http.get('*/api/projects', () => HttpResponse.json({ projects: [] })));
    const { router } = renderRoute('/admin/reports');
    await waitFor(() => expect(router.state.location.pathname).toBe('/'));
  });
});

describe('the maker profile (/m/:makerId)', () => {
  it('lists the maker’s public pieces for a signed-out visitor', async () => {
    const profile: MakerProfile = {
      maker: { id: 'abc123', displayName: 'Hazel Brook' },
      projects: [{ title: 'Pip the pocket owl', url: '/p/tok_abcdefghijklmnopqrstuv', statusLabel: 'Finished', finishedOn: '2026-11-20', cover: null, cheerCount: 1 }],
    };
    server.use(
      http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in.' }, { status: 401 })),
      http.get('*/api/makers/abc123', () => HttpResponse.json(profile)),
    );
    renderRoute('/m/abc123');
    expect(await screen.findByRole('heading', { name: 'Hazel Brook’s makes' })).toBeInTheDocument();
    expect(screen.getByRole('link', { name: /Pip the pocket owl/ })).toHaveAttribute('href', '/p/tok_abcdefghijklmnopqrstuv');
    expect(screen.getByText('1 cheer')).toBeInTheDocument();
  });

  it('says nothing is shared when the maker has no public piece', async () => {
    server.use(
      http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in.' }, { status: 401 })),
      http.get('*/api/makers/nobody', () => HttpResponse.json({ error: 'That maker could not be found.' }, { status: 404 })),
    );
    renderRoute('/m/nobody');
    expect(await screen.findByText('Nothing shared here')).toBeInTheDocument();
  });
});
