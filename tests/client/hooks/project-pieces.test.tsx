import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import { buildPiece, buildProject, earText } from '../projects/fixtures';

// The journal and sharing panels on the project page ask for their own data: answer them empty.
const neighbours = [
  http.get('*/api/yarns', () => HttpResponse.json({ yarns: [] })),
  http.get('*/api/projects/5/entries', () => HttpResponse.json({ entries: [] })),
  http.get('*/api/projects/5/share', () =>
    HttpResponse.json({
      share: { visibility: 'private', sharePath: null, shareUrl: null, hiddenByAdmin: false, cheerCount: 0, commentCount: 0, hiddenCommentCount: 0, shownEntryCount: 0, photoCount: 0 },
    }),
  ),
  http.get('*/api/share-settings', () => HttpResponse.json({ settings: { notifyComments: true } })),
];

const project = buildProject({
  pieces: [
    buildPiece({ id: 11, name: 'Head', hookMm: 3.5 }),
    buildPiece({ id: 12, name: 'Ear', position: 1, copies: 2, hookMm: 2.75, instructions: earText }),
    buildPiece({ id: 13, name: 'Tail', position: 2, hookMm: null }),
  ],
});

const checkFor = (piece: string) => {
  const item = screen.getByRole('heading', { name: piece, level: 3 }).closest('li')!;
  return within(item).queryByTestId('hook-roll-check');
};

describe('the hook roll on the project page', () => {
  it('tells for each piece whether its hook is in the roll, in words with an icon', async () => {
    server.use(
      http.get('*/api/projects/5', () => HttpResponse.json({ project })),
      // A 3.5 mm hook, stored as a float the way SQLite gives it back.
      http.get('*/api/hooks', () =>
        HttpResponse.json({ hooks: [{ id: 1, mm: 3.5, us: 'E-4', material: 'aluminium', brand: null, note: null, quantity: 1, createdAt: '2026-12-01T10:00:00.000Z', updatedAt: '2026-12-01T10:00:00.000Z' }] }),
      ),
      ...neighbours,
    );
    renderRoute('/projects/5');
    await screen.findByRole('heading', { name: 'Owl for Ada', level: 1 }, { timeout: 5000 });
    await screen.findAllByTestId('hook-roll-check');

    const head = checkFor('Head')!;
    expect(head).toHaveTextContent('In your hook roll · 3.5 mm (US E-4)');
    expect(head.querySelector('svg[aria-hidden]')).not.toBeNull();
    expect(within(head).queryByRole('link')).toBeNull();

    const ear = checkFor('Ear')!;
    // Source for the US size: Craft Yarn Council hook chart via S9, S10, S13 (standards.md §2): 2.75 mm = C-2.
    expect(ear).toHaveTextContent('Not in your hook roll — 2.75 mm (US C-2)');
    expect(ear.querySelector('svg[aria-hidden]')).not.toBeNull();
    expect(within(ear).getByRole('link', { name: 'Add a 2.75 mm (US C-2) hook to your hook roll' })).toHaveAttribute('href', '/hooks?size=2.75');

    // A piece that names no hook says nothing about the roll.
    expect(checkFor('Tail')).toBeNull();

    // While the pieces are being put in order the cards stay compact.
    await userEvent.setup().click(screen.getByRole('button', { name: 'Change order' }));
    expect(screen.queryAllByTestId('hook-roll-check')).toHaveLength(0);
  });

  it('says a hook is not in an empty roll', async () => {
    server.use(http.get('*/api/projects/5', () => HttpResponse.json({ project })), http.get('*/api/hooks', () => HttpResponse.json({ hooks: [] })), ...neighbours);
    renderRoute('/projects/5');
    await screen.findByRole('heading', { name: 'Owl for Ada', level: 1 }, { timeout: 5000 });
    await screen.findAllByTestId('hook-roll-check');
    expect(checkFor('Head')).toHaveTextContent('Not in your hook roll — 3.5 mm (US E-4)');
    expect(checkFor('Ear')).toHaveTextContent('Not in your hook roll — 2.75 mm (US C-2)');
  });
});
