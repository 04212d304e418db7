import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import { buildPattern, buildProject } from './fixtures';

const slow = { timeout: 5000 };

// The project page the form goes on to, with its neighbours' panels answered empty.
const projectPage = (project = buildProject()) => [
  http.get(`*/api/projects/${project.id}`, () => HttpResponse.json({ project })),
  http.get('*/api/yarns', () => HttpResponse.json({ yarns: [] })),
  http.get(`*/api/projects/${project.id}/entries`, () => HttpResponse.json({ entries: [] })),
  http.get(`*/api/projects/${project.id}/share`, () =>
    HttpResponse.json({
      share: { visibility: 'private', sharePath: null, shareUrl: null, hiddenByAdmin: false, cheerCount: 0, commentCount: 0, hiddenCommentCount: 0, shownEntryCount: 0, photoCount: 0 },
    }),
  ),
  http.get('*/api/share-settings', () => HttpResponse.json({ settings: { notifyComments: true } })),
  http.get('*/api/projects', () => HttpResponse.json({ projects: [] })),
];

describe('the new-project form from scratch', () => {
  it('checks the fields with the shared schema before sending anything', async () => {
    let posts = 0;
    server.use(
      http.get('*/api/patterns', () => HttpResponse.json({ patterns: [] })),
      http.post('*/api/projects', () => {
        posts += 1;
        return HttpResponse.json({ error: 'unexpected' }, { status: 500 });
      }),
    );
    renderRoute('/projects/new');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Start the project' }, slow));
    expect(await screen.findByText('Give the project a title.')).toBeInTheDocument();
    expect(screen.getByText(/Give the piece a name/)).toBeInTheDocument();

    await user.clear(screen.getByLabelText('How many'));
    await user.type(screen.getByLabelText('How many'), '0');
    await user.type(screen.getByLabelText('Hook (mm)'), '90');
    await user.click(screen.getByRole('button', { name: 'Start the project' }));
    expect(await screen.findByText('Make at least 1.')).toBeInTheDocument();
    expect(screen.getByText('A hook is at most 35 mm.')).toBeInTheDocument();
    expect(screen.getByLabelText('Title')).toHaveAttribute('aria-invalid', 'true');
    expect(posts).toBe(0);
  });

  it('shows the cautions as soon as safety eyes or a young child are chosen, and sends the project', async () => {
    let body: any = null;
    const created = buildProject({ id: 9, title: 'Pocket ball', pieces: [] });
    server.use(
      http.get('*/api/patterns', () => HttpResponse.json({ patterns: [] })),
      http.post('*/api/projects', async ({ request }) => {
        body = await request.json();
        return HttpResponse.json({ project: created }, { status: 201 });
      }),
      ...projectPage(created),
    );
    const { router } = renderRoute('/projects/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Title', {}, slow), 'Pocket ball');
    await user.type(screen.getByLabelText('Piece name'), 'Ball');
    await user.type(screen.getByLabelText('Hook (mm)'), '3.5');
    await user.type(screen.getByLabelText('Instructions'), 'Rnd 1: 6 sc in MR (6)');
    expect(screen.queryByRole('alert')).not.toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Add a notion' }));
    // A new notion starts as safety eyes, so the small-parts caution shows at once.
    expect(await screen.findByText('Small parts can be a choking hazard')).toBeInTheDocument();
    await user.type(screen.getByLabelText('Notion 1 size in mm'), '8');
    await user.type(screen.getByLabelText('Notion 1 how many'), '2');
    await user.click(screen.getByLabelText('For a child under 3'));
    expect(screen.getByText('Made for a child under 3')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Start the project' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/projects/9'));
    expect(body).toEqual({
      title: 'Pocket ball',
      pieces: [{ name: 'Ball', instructions: 'Rnd 1: 6 sc in MR (6)', copies: 1, hookMm: 3.5 }],
      forYoungChild: true,
      notions: [{ kind: 'safety_eyes', sizeMm: 8, quantity: 2 }],
      status: 'on_the_hook',
      recipient: null,
      notes: null,
    });
  });

  it("puts the server's field issues beside the fields", async () => {
    server.use(
      http.get('*/api/patterns', () => HttpResponse.json({ patterns: [] })),
      http.post('*/api/projects', () =>
        HttpResponse.json({ error: 'Please check the form: title: That title is taken here.', issues: [{ path: 'title', message: 'That title is taken here.' }] }, { status: 422 }),
      ),
    );
    renderRoute('/projects/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Title', {}, slow), 'Twin');
    await user.click(screen.getByRole('button', { name: 'Remove this piece' }));
    await user.click(screen.getByRole('button', { name: 'Start the project' }));
    expect(await screen.findByText('That title is taken here.')).toBeInTheDocument();
    expect(screen.getByText('The project was not started')).toBeInTheDocument();
  });
});

describe('the new-project form from a pattern', () => {
  it('prefills the title, previews the pieces and notions, and sends the pattern id instead of pieces', async () => {
    let body: any = null;
    const created = buildProject({ id: 10 });
    server.use(
      http.get('*/api/patterns/3', () => HttpResponse.json({ pattern: buildPattern() })),
      http.post('*/api/projects', async ({ request }) => {
        body = await request.json();
        return HttpResponse.json({ project: created }, { status: 201 });
      }),
      ...projectPage(created),
    );
    const { router } = renderRoute('/projects/new?patternId=3');
    expect(await screen.findByLabelText('Title', {}, slow)).toHaveValue('Moss the pocket owl');
    const preview = screen.getByRole('heading', { name: /Pieces from “Moss the pocket owl”/ }).closest('section')!;
    const items = within(preview).getAllByRole('listitem');
    expect(items.map((li) => li.textContent)).toEqual([expect.stringMatching(/^Head.*3 rounds · 3\.5 mm \(US E-4\)$/), expect.stringMatching(/^Ear · make 2.*2 rounds · 2\.75 mm \(US C-2\)$/)]);
    // The pattern's notions come along, and so does their caution.
    expect(screen.getByLabelText('Notion 1')).toHaveValue('safety_eyes');
    expect(screen.getByText('Small parts can be a choking hazard')).toBeInTheDocument();

    const user = userEvent.setup();
    await user.type(screen.getByLabelText(/Who is it for/), 'Ada');
    await user.click(screen.getByRole('button', { name: 'Start the project' }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/projects/10'));
    expect(body).toMatchObject({ title: 'Moss the pocket owl', patternId: 3, recipient: 'Ada', notions: [{ kind: 'safety_eyes', sizeMm: 6, quantity: 2 }] });
    expect(body).not.toHaveProperty('pieces');
  });

  it('offers to start from scratch when the pattern cannot be opened', async () => {
    server.use(http.get('*/api/patterns/77', () => HttpResponse.json({ error: 'That pattern could not be found.' }, { status: 404 })));
    renderRoute('/projects/new?patternId=77');
    expect(await screen.findByText('That pattern could not be opened', {}, slow)).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Start from scratch' })).toHaveAttribute('href', '/projects/new');
  });
});
