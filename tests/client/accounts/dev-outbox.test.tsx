import { describe, expect, it } from 'vitest';
import { screen } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';

const messages = [
  { to: 'ada@example.com', subject: 'Confirm your e-mail for Whorlbook', text: 'Hello Ada,\n\nConfirm my e-mail:\nhttp://127.0.0.1:3000/verify-email?token=abc123\n\nWhorlbook\n', html: '<p>Hello Ada</p>', date: '2026-12-01T10:00:00.000Z' },
  { to: 'ada@example.com', subject: 'Choose a new Whorlbook password', text: 'Choose a new password:\nhttp://127.0.0.1:3000/reset-password?token=def456\n', html: null, date: '2026-12-01T10:05:00.000Z' },
];

describe('the dev outbox page', () => {
  it('opens signed out and lists the fake’s mail newest first with links to tap', async () => {
    server.use(
      http.get('*/api/auth/me', () => HttpResponse.json({ error: 'Please sign in.' }, { status: 401 })),
      http.get('*/api/dev/outbox', () => HttpResponse.json(messages)),
    );
    renderRoute('/dev/outbox');
    const headings = await screen.findAllByRole('heading', { level: 2 });
    expect(headings.map((h) => h.textContent)).toEqual(['Choose a new Whorlbook password', 'Confirm your e-mail for Whorlbook']);
    expect(screen.getByRole('link', { name: 'http://127.0.0.1:3000/reset-password?token=def456' })).toHaveAttribute('href', 'http://127.0.0.1:3000/reset-password?token=def456');
    expect(screen.getByRole('link', { name: 'http://127.0.0.1:3000/verify-email?token=abc123' })).toBeInTheDocument();

    await userEvent.setup().click(screen.getByRole('button', { name: 'Show the HTML version' }));
    const frame = screen.getByTitle('HTML version of "Confirm your e-mail for Whorlbook"');
    expect(frame).toHaveAttribute('sandbox', '');
    expect(frame).toHaveAttribute('srcdoc', '<p>Hello Ada</p>');
  });

  it('explains that there is no outbox when real e-mail is sent', async () => {
    server.use(http.get('*/api/dev/outbox', () => HttpResponse.json({ error: 'There is no API route GET /api/dev/outbox.' }, { status: 404 })));
    renderRoute('/dev/outbox');
    expect(await screen.findByText(/sends real e-mail through its mail server/)).toBeInTheDocument();
  });

  it('says when nothing has been sent yet', async () => {
    server.use(http.get('*/api/dev/outbox', () => HttpResponse.json([])));
    renderRoute('/dev/outbox');
    expect(await screen.findByText('No e-mail yet')).toBeInTheDocument();
  });
});
