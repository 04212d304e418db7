import { describe, expect, it } from 'vitest';
import { render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { QueryClientProvider } from '@tanstack/react-query';
import { MemoryRouter } from 'react-router-dom';
import { http, HttpResponse } from 'msw';
import QRCode from 'qrcode';
import { server } from '../mocks/server';
import { createQueryClient } from '@/lib/query-client';
import { SharePanel } from '@/features/showcase/components/share-panel';
import { QR_OPTIONS } from '@/features/showcase/components/qr-code';
import type { ShareStatus } from '@/types/showcase';

const PROJECT = 7;

function renderPanel(onChanged = () => {}) {
  const qc = createQueryClient();
  return render(
    <QueryClientProvider client={qc}>
      <MemoryRouter>
        <SharePanel projectId={PROJECT} title="Pip the pocket owl" onChanged={onChanged} />
      </MemoryRouter>
    </QueryClientProvider>,
  );
}

const base: ShareStatus = { visibility: 'private', sharePath: null, shareUrl: null, profilePath: null, hiddenByAdmin: false, cheerCount: 0, commentCount: 0, hiddenCommentCount: 0, shownEntryCount: 1, photoCount: 2 };

function shared(token: string): ShareStatus {
  return { ...base, visibility: 'link', sharePath: `/p/${token}`, shareUrl: `http://127.0.0.1:3000/p/${token}` };
}

describe('the share panel on the project page', () => {
  it('shares by link through PATCH /api/projects/:id, then shows the link and its QR code', async () => {
    let status = base;
    const patches: unknown[] = [];
    let changed = 0;
    server.use(
      http.get(`*/api/projects/${PROJECT}/share`, () => HttpResponse.json({ share: status })),
      http.get('*/api/share-settings', () => HttpResponse.json({ settings: { notifyComments: true } })),
      http.patch(`*/api/projects/${PROJECT}`, async ({ request }) => {
        const body = (await request.json()) as { visibility: 'link' };
        patches.push(body);
        status = shared('firstTokenAAAAAAAAAAAAAA');
        return HttpResponse.json({ project: { id: PROJECT, visibility: body.visibility, shareUrl: status.shareUrl } });
      }),
    );
    renderPanel(() => (changed += 1));
    const user = userEvent.setup();
    const privateRadio = await screen.findByRole('radio', { name: /Private/ });
    expect(privateRadio).toBeChecked();
    expect(screen.queryByRole('button', { name: 'Copy link' })).toBeNull();

    await user.click(screen.getByRole('radio', { name: /Anyone with the link/ }));
    expect(await screen.findByDisplayValue('http://127.0.0.1:3000/p/firstTokenAAAAAAAAAAAAAA')).toBeInTheDocument();
    expect(patches).toEqual([{ visibility: 'link' }]);
    expect(changed).toBe(1);
    expect(screen.getByRole('radio', { name: /Anyone with the link/ })).toBeChecked();
    expect(screen.getByText('· chosen')).toBeInTheDocument();

    // The QR code encodes exactly the link (the same drawing the qrcode package makes from it).
    const expected = await QRCode.toDataURL('http://127.0.0.1:3000/p/firstTokenAAAAAAAAAAAAAA', QR_OPTIONS);
    await waitFor(() => expect(screen.getByTestId('share-qr')).toHaveAttribute('src', expected));
    expect(screen.getByRole('link', { name: /Print table card/ })).toHaveAttribute('href', '/p/firstTokenAAAAAAAAAAAAAA?print=card');
  });

  it('makes a new link only after confirming, and shows the new one', async () => {
    let status = shared('oldTokenAAAAAAAAAAAAAAAA');
    let posts = 0;
    server.use(
      http.get(`*/api/projects/${PROJECT}/share`, () => HttpResponse.json({ share: status })),
      http.get('*/api/share-settings', () => HttpResponse.json({ settings: { notifyComments: true } })),
      http.post(`*/api/projects/${PROJECT}/share-link`, () => {
        posts += 1;
        status = shared('newTokenBBBBBBBBBBBBBBBB');
        return HttpResponse.json({ project: { id: PROJECT }, shareUrl: status.shareUrl, share: status });
      }),
    );
    renderPanel();
    const user = userEvent.setup();
    await screen.findByDisplayValue(/oldTokenA/);
    await user.click(screen.getByRole('button', { name: 'Make a new link' }));
    const dialog = screen.getByRole('dialog', { hidden: true });
    expect(within(dialog).getByText(/The old link stops working at once/)).toBeInTheDocument();
    await user.click(within(dialog).getByRole('button', { name: 'Keep it', hidden: true }));
    expect(posts).toBe(0);
    await user.click(screen.getByRole('button', { name: 'Make a new link' }));
    await user.click(within(screen.getByRole('dialog', { hidden: true })).getByRole('button', { name: 'Make a new link', hidden: true }));
    expect(await screen.findByDisplayValue(/newTokenB/)).toBeInTheDocument();
    expect(posts).toBe(1);
  });

  it('turns comment e-mails off', async () => {
    const sent: unknown[] = [];
    server.use(
      http.get(`*/api/projects/${PROJECT}/share`, () => HttpResponse.json({ share: shared('tokTokTokTokTokTokTokTok') })),
      http.get('*/api/share-settings', () => HttpResponse.json({ settings: { notifyComments: true } })),
      http.patch('*/api/share-settings', async ({ request }) => {
        const body = await request.json();
        sent.push(body);
        return HttpResponse.json({ settings: body });
      }),
    );
    renderPanel();
    const box = await screen.findByRole('checkbox', { name: /E-mail me when someone comments/ });
    expect(box).toBeChecked();
    await userEvent.setup().click(box);
    await waitFor(() => expect(box).not.toBeChecked());
    expect(sent).toEqual([{ notifyComments: false }]);
  });

  it('explains an admin takedown and offers no way to share again', async () => {
    server.use(
      http.get(`*/api/projects/${PROJECT}/share`, () => HttpResponse.json({ share: { ...base, visibility: 'link', hiddenByAdmin: true } })),
      http.get('*/api/share-settings', () => HttpResponse.json({ settings: { notifyComments: true } })),
    );
    renderPanel();
    expect(await screen.findByText('An admin took this page down')).toBeInTheDocument();
    expect(screen.getByRole('radio', { name: /Public on my profile/ })).toBeDisabled();
    expect(screen.queryByRole('button', { name: 'Make a new link' })).toBeNull();
  });
});
