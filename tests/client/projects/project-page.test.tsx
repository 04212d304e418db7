import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import type { Project } from '@/types/api';
import { buildPiece, buildProject, earText } from './fixtures';

// The journal (issue 7) and sharing (issue 8) panels on the page ask for their own data: answer them empty.
const neighbours = [
  http.get('*/api/projects/5/entries', () => HttpResponse.json({ entries: [] })),
  http.get('*/api/projects/5/share', () =>
    HttpResponse.json({
      share: { visibility: 'private', sharePath: null, shareUrl: null, hiddenByAdmin: false, cheerCount: 0, commentCount: 0, hiddenCommentCount: 0, shownEntryCount: 0, photoCount: 0 },
    }),
  ),
  http.get('*/api/share-settings', () => HttpResponse.json({ settings: { notifyComments: true } })),
];

function serve(project: Project, extra: Parameters<typeof server.use> = []) {
  server.use(
    http.get('*/api/projects/5', () => HttpResponse.json({ project })),
    http.get('*/api/yarns', () => HttpResponse.json({ yarns: [] })),
    ...neighbours,
    ...extra,
  );
}

const withPieces = () =>
  buildProject({
    pieces: [
      buildPiece({
        id: 11,
        name: 'Head',
        copies: 2,
        progress: { copy: 1, round: 1, step: 2, done: 8, version: 9, updatedAt: '2026-11-21T10:00:00.000Z' },
        totals: { rounds: 3, stepsPerCopy: 14, copiesDone: 0, roundsDone: 1 },
        placements: [{ id: 1, pieceId: 11, copy: 1, round: 2, step: 4, label: 'left eye', note: 'a bit high', createdAt: '2026-11-21T09:00:00.000Z' }],
      }),
      buildPiece({ id: 12, name: 'Ear', copies: 2, instructions: earText, hookMm: 2.75, totals: { rounds: 2, stepsPerCopy: 6, copiesDone: 2, roundsDone: 2 } }),
      buildPiece({ id: 13, name: 'Tail', hookMm: null }),
    ],
  });

describe('the project page', () => {
  it('shows each piece with its progress, Count link, placements and silhouette, and the safety caution', async () => {
    serve(withPieces());
    renderRoute('/projects/5');
    // The first visit loads the route module lazily, as in the browser.
    expect(await screen.findByRole('heading', { name: 'Owl for Ada', level: 1 }, { timeout: 5000 })).toBeInTheDocument();
    const header = screen.getByRole('heading', { name: 'Owl for Ada', level: 1 }).closest('header')!;
    expect(within(header).getByText('On the hook')).toBeInTheDocument();
    expect(within(header).getByText('for Ada')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Moss the pocket owl' })).toHaveAttribute('href', '/patterns/3');

    const head = screen.getByRole('heading', { name: 'Head' }).closest('li')!;
    expect(within(head).getByText('Rnd 2 of 3 · copy 1 of 2')).toBeInTheDocument();
    expect(within(head).getByRole('progressbar', { name: 'Head progress' })).toHaveAttribute('aria-valuenow', '17');
    expect(within(head).getByRole('link', { name: 'Count Head' })).toHaveAttribute('href', '/projects/5/pieces/11/count');
    expect(within(head).getByText('left eye')).toBeInTheDocument();
    expect(within(head).getByText(/Rnd 2, st 4 · copy 1/)).toBeInTheDocument();
    expect(within(head).getByText('a bit high')).toBeInTheDocument();
    // Source: Craft Yarn Council hook chart — 3.5 mm is E-4.
    expect(within(head).getByText(/3\.5 mm \(US E-4\) hook/)).toBeInTheDocument();
    // The piece being worked shows its silhouette with the placement mark.
    const silhouette = within(head).getByRole('img', { name: /Head silhouette/ });
    expect(silhouette).toBeInTheDocument();
    expect(within(head).getByText('1 mark', { exact: false })).toBeInTheDocument();

    const ear = screen.getByRole('heading', { name: 'Ear' }).closest('li')!;
    expect(within(ear).getByText('All 2 copies done')).toBeInTheDocument();
    expect(within(ear).getByRole('progressbar')).toHaveAttribute('aria-valuenow', '100');
    expect(within(ear).getByText(/2\.75 mm \(US C-2\) hook/)).toBeInTheDocument();

    const tail = screen.getByRole('heading', { name: 'Tail' }).closest('li')!;
    expect(within(tail).getByText('Not started · 3 rounds')).toBeInTheDocument();

    const caution = screen.getByRole('alert');
    expect(caution).toHaveTextContent('Small parts can be a choking hazard');
    expect(caution).toHaveTextContent(/choking hazard for children under 3/);
    expect(caution).toHaveTextContent('Safety:');

    expect(screen.getByText('Moss cotton')).toBeInTheDocument();
    expect(screen.getByText(/40 m used/)).toBeInTheDocument();
    expect(screen.getByText('Safety eyes')).toBeInTheDocument();
    expect(screen.getByText('Eyes a little wider apart than the pattern.')).toBeInTheDocument();
  });

  it('shows both cautions for a toy for a child under 3 with safety eyes, and none without either', async () => {
    const young = buildProject({ forYoungChild: true });
    serve(young);
    const first = renderRoute('/projects/5');
    const alerts = await screen.findAllByRole('alert');
    expect(alerts.map((a) => a.textContent)).toEqual([expect.stringContaining('Small parts'), expect.stringContaining('Made for a child under 3')]);
    first.unmount();

    const plain = buildProject({ materials: { yarns: [], hooks: [], notions: [{ kind: 'stuffing' }] } });
    expect(plain.cautions).toEqual([]);
    serve(plain);
    renderRoute('/projects/5');
    expect(await screen.findByRole('heading', { name: 'Owl for Ada', level: 1 })).toBeInTheDocument();
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();
  });

  it('changes the status through the API and shows the answer', async () => {
    let sent: unknown = null;
    const project = withPieces();
    serve(project, [
      http.patch('*/api/projects/5', async ({ request }) => {
        sent = await request.json();
        return HttpResponse.json({ project: { ...project, status: 'finished', finishedOn: '2026-12-02' } });
      }),
      http.get('*/api/projects', () => HttpResponse.json({ projects: [] })),
    ]);
    renderRoute('/projects/5');
    const user = userEvent.setup();
    await user.selectOptions(await screen.findByLabelText('Status'), 'finished');
    await waitFor(() => expect(sent).toEqual({ status: 'finished' }));
    expect(await screen.findByText(/finished 2 Dec 2026|finished Dec 2, 2026/)).toBeInTheDocument();
  });

  it('asks before deleting, then deletes and goes back to the projects list', async () => {
    let deleted = false;
    serve(withPieces(), [
      http.delete('*/api/projects/5', () => {
        deleted = true;
        return new HttpResponse(null, { status: 204 });
      }),
      http.get('*/api/projects', () => HttpResponse.json({ projects: [] })),
    ]);
    const { router } = renderRoute('/projects/5');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Delete this project' }));
    expect(deleted).toBe(false);
    const dialog = screen.getByRole('dialog');
    expect(dialog).toHaveTextContent(/journal and photos/);
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    expect(deleted).toBe(false);

    await user.click(screen.getByRole('button', { name: 'Delete this project' }));
    await user.click(within(screen.getByRole('dialog')).getByRole('button', { name: 'Delete the project' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/projects'));
    expect(deleted).toBe(true);
  });

  it('says so when the project is not there (another member’s, or deleted)', async () => {
    server.use(
      http.get('*/api/projects/5', () => HttpResponse.json({ error: 'That project could not be found.' }, { status: 404 })),
      http.get('*/api/yarns', () => HttpResponse.json({ yarns: [] })),
      ...neighbours,
    );
    renderRoute('/projects/5');
    expect(await screen.findByText('That project could not be found')).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Back to your projects' })).toHaveAttribute('href', '/projects');
  });
});
