import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { checkPiece } from '@/engine';
import type { JournalEntry, Project } from '@/types/api';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import { ballText, buildPiece, buildProject, earText } from './fixtures';

// Editing a project's pieces on the project page. Only the network is mocked; the round table, the engine and
// the Tally-count rules are the real ones.

const entry = (id: number, pieceId: number | null): JournalEntry => ({
  id,
  projectId: 5,
  pieceId,
  pieceName: pieceId ? 'Ear' : null,
  body: 'Both ears done before lunch.',
  entryDate: '2026-11-21',
  minutes: 30,
  tags: ['progress'],
  onShowcase: false,
  photos: [],
  createdAt: '2026-11-21T10:00:00.000Z',
  updatedAt: '2026-11-21T10:00:00.000Z',
});

function serve(project: Project, { entries = [] as JournalEntry[], patch }: { entries?: JournalEntry[]; patch?: (body: any) => Response | Promise<Response> } = {}) {
  const sent: any[] = [];
  server.use(
    http.get('*/api/projects/5', () => HttpResponse.json({ project })),
    http.get('*/api/yarns', () => HttpResponse.json({ yarns: [] })),
    http.get('*/api/projects/5/entries', () => HttpResponse.json({ entries })),
    http.get('*/api/projects/5/share', () =>
      HttpResponse.json({
        share: { visibility: 'private', sharePath: null, shareUrl: null, hiddenByAdmin: false, cheerCount: 0, commentCount: 0, hiddenCommentCount: 0, shownEntryCount: 0, photoCount: 0 },
      }),
    ),
    http.get('*/api/share-settings', () => HttpResponse.json({ settings: { notifyComments: true } })),
    http.get('*/api/projects', () => HttpResponse.json({ projects: [] })),
    http.patch('*/api/projects/5', async ({ request }) => {
      const body = await request.json();
      sent.push(body);
      return patch ? patch(body) : HttpResponse.json({ project });
    }),
  );
  return sent;
}

const project = () =>
  buildProject({
    pieces: [
      buildPiece({
        id: 11,
        name: 'Head',
        copies: 2,
        // In Rnd 2 (index 1) of copy 1, two steps done.
        progress: { copy: 1, round: 1, step: 2, done: 8, version: 9, updatedAt: '2026-11-21T10:00:00.000Z' },
        totals: { rounds: 3, stepsPerCopy: 24, copiesDone: 0, roundsDone: 1 },
      }),
      buildPiece({
        id: 12,
        name: 'Ear',
        copies: 2,
        instructions: earText,
        hookMm: 2.75,
        progress: { copy: 2, round: 2, step: 0, done: 20, version: 30, updatedAt: '2026-11-21T10:00:00.000Z' },
        totals: { rounds: 2, stepsPerCopy: 10, copiesDone: 2, roundsDone: 2 },
        placements: [{ id: 1, pieceId: 12, copy: 1, round: 2, step: null, label: 'pin', note: null, createdAt: '2026-11-21T09:00:00.000Z' }],
      }),
      buildPiece({ id: 13, name: 'Tail', hookMm: null }),
    ],
  });

async function openEditor(name: string) {
  const user = userEvent.setup();
  await user.click(await screen.findByRole('button', { name: `Edit ${name}` }, { timeout: 5000 }));
  const form = screen.getByRole('form', { name: `Edit ${name}` });
  return { user, form };
}

async function replaceText(user: ReturnType<typeof userEvent.setup>, field: HTMLElement, text: string) {
  await user.clear(field);
  await user.click(field);
  await user.paste(text);
}

describe('editing a piece on the project page', () => {
  it('checks the instructions live with the round table, saves the whole list and shows the new round total', async () => {
    const p = project();
    const longer = [...ballText.split('\n'), 'Rnd 4: (2 sc, inc) x6 (25)'].join('\n');
    const fixed = longer.replace('(25)', '(24)');
    const sent = serve(p, {
      patch: (body) => {
        const check = checkPiece(body.pieces[0].instructions, { terms: 'us' });
        const head = { ...p.pieces[0], instructions: body.pieces[0].instructions, totals: { ...p.pieces[0].totals, rounds: check.rounds.length } };
        return HttpResponse.json({ project: { ...p, pieces: [head, ...p.pieces.slice(1)] } });
      },
    });
    renderRoute('/projects/5');
    const { user, form } = await openEditor('Head');
    expect(within(form).getByLabelText('Piece name')).toHaveValue('Head');
    expect(within(form).getByLabelText('How many to make')).toHaveValue(2);
    // Source: Craft Yarn Council hook chart — 3.5 mm is E-4.
    expect(within(form).getByTestId('hook-label')).toHaveTextContent('3.5 mm (US E-4)');

    const text = within(form).getByLabelText(/^Instructions/);
    await replaceText(user, text, longer);
    // The round table from the pattern editor, checking as the maker types: 6 × (2 sc, inc) makes 24, not 25.
    const table = within(form).getByRole('region', { name: 'Round table' });
    await waitFor(() => expect(within(table).getByText(/1 to check/)).toBeInTheDocument());
    expect(within(table).getByText(/makes 24 stitches, not 25/)).toBeInTheDocument();
    expect(within(form).getByText('4 rounds to count, 2 times')).toBeInTheDocument();
    await replaceText(user, text, fixed);
    await waitFor(() => expect(within(table).getByText('Every count adds up')).toBeInTheDocument());
    // A round added after the one being worked leaves the count alone: nothing to warn about.
    expect(within(form).queryByText('What this does to your Tally count')).not.toBeInTheDocument();

    await user.click(within(form).getByRole('button', { name: 'Save the piece' }));
    await waitFor(() => expect(sent).toHaveLength(1));
    expect(sent[0]).toEqual({
      pieces: [{ id: 11, name: 'Head', copies: 2, hookMm: 3.5, yarns: [], instructions: fixed }, { id: 12, name: 'Ear' }, { id: 13, name: 'Tail' }],
    });
    const head = (await screen.findByRole('heading', { name: 'Head', level: 3 })).closest('li')!;
    expect(within(head).getByText('Rnd 2 of 4 · copy 1 of 2')).toBeInTheDocument();
    expect(screen.queryByRole('form', { name: 'Edit Head' })).not.toBeInTheDocument();
  });

  it('says what an edit does to the Tally count before saving, and names the button for it', async () => {
    serve(project());
    renderRoute('/projects/5');
    const { user, form } = await openEditor('Head');
    const text = within(form).getByLabelText(/^Instructions/);

    // A worked round rewritten: the count stays, and the maker is told to check what they made.
    await replaceText(user, text, ballText.replace('6 sc in MR (6)', '6 sc in magic ring (6)'));
    const banner = await within(form).findByText('What this does to your Tally count');
    const box = banner.closest('[role="alert"]')!;
    expect(box).toHaveTextContent('You have already worked Rnd 1, and this change alters it.');
    expect(box).toHaveTextContent('The Tally stays at Rnd 2, step 2 of 6, copy 1 of 2.');
    expect(within(form).getByRole('button', { name: 'Save the piece' })).toBeInTheDocument();

    // Only Rnd 1 left: the count is past the new end, so this copy counts as done.
    await replaceText(user, text, 'Rnd 1: 6 sc in MR (6)');
    await waitFor(() =>
      expect(within(form).getByText('What this does to your Tally count').closest('[role="alert"]')).toHaveTextContent(
        'The Tally is at Rnd 2, past the new last round (Rnd 1). Saving counts copy 1 as done and starts copy 2 at Rnd 1.',
      ),
    );
    expect(within(form).getByRole('button', { name: 'Save and move the count' })).toBeInTheDocument();
  });

  it('refuses fewer copies than the copy being worked, beside the field, and sends nothing', async () => {
    const sent = serve(project());
    renderRoute('/projects/5');
    const { user, form } = await openEditor('Ear');
    const copies = within(form).getByLabelText('How many to make');
    await user.clear(copies);
    await user.type(copies, '1');
    const sentence = 'Ear is counted up to copy 2 in the Tally, so it needs at least 2 copies. To make fewer, first go back to an earlier copy with “Jump to a round” in the Tally.';
    expect(await within(form).findByText(sentence)).toBeInTheDocument();
    expect(copies).toHaveAttribute('aria-invalid', 'true');
    await user.click(within(form).getByRole('button', { name: /^Save/ }));
    // Still one message beside the field after the refused save, and nothing went to the server.
    expect(await within(form).findAllByText(sentence)).toHaveLength(1);
    expect(sent).toEqual([]);
  });

  it("puts the server's sentence beside its field", async () => {
    const sent = serve(project(), {
      patch: () => HttpResponse.json({ error: 'A hook is at most 35 mm.', issues: [{ path: 'pieces.2.hookMm', message: 'Our hooks stop at 35 mm.' }] }, { status: 422 }),
    });
    renderRoute('/projects/5');
    const { user, form } = await openEditor('Tail');
    const hookField = within(form).getByLabelText('Hook (mm)');
    await user.type(hookField, '4');
    // Source: Craft Yarn Council hook chart — 4 mm is G-6.
    expect(within(form).getByTestId('hook-label')).toHaveTextContent('4 mm (US G-6)');
    await user.click(within(form).getByRole('button', { name: 'Save the piece' }));
    expect(await within(form).findByText('Our hooks stop at 35 mm.')).toBeInTheDocument();
    expect(hookField).toHaveAttribute('aria-invalid', 'true');
    expect(sent[0].pieces[2]).toMatchObject({ id: 13, hookMm: 4 });
    // The form stays open with what was typed.
    expect(hookField).toHaveValue('4');
  });

  it('checks the fields with the shared schema before sending, in plain words', async () => {
    const sent = serve(project());
    renderRoute('/projects/5');
    const { user, form } = await openEditor('Tail');
    await user.clear(within(form).getByLabelText('Piece name'));
    await user.type(within(form).getByLabelText('Hook (mm)'), 'big');
    await user.click(within(form).getByRole('button', { name: 'Save the piece' }));
    expect(await within(form).findByText('Give the piece a name, like "Body" or "Ear".')).toBeInTheDocument();
    expect(within(form).getByText('Give the hook in millimetres, like 3.5.')).toBeInTheDocument();
    expect(sent).toEqual([]);
  });

  it('adds a piece at the end', async () => {
    const p = project();
    const sent = serve(p);
    renderRoute('/projects/5');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Add a piece' }, { timeout: 5000 }));
    const form = screen.getByRole('form', { name: 'New piece' });
    await user.type(within(form).getByLabelText('Piece name'), 'Wing');
    await user.clear(within(form).getByLabelText('How many to make'));
    await user.type(within(form).getByLabelText('How many to make'), '2');
    await user.type(within(form).getByLabelText('Hook (mm)'), '3,5');
    await user.click(within(form).getByLabelText('Moss cotton'));
    await replaceText(user, within(form).getByLabelText(/^Instructions/), 'Rnd 1: 5 sc in MR (5)');
    await user.click(within(form).getByRole('button', { name: 'Add the piece' }));
    await waitFor(() => expect(sent).toHaveLength(1));
    expect(sent[0].pieces).toEqual([
      { id: 11, name: 'Head' },
      { id: 12, name: 'Ear' },
      { id: 13, name: 'Tail' },
      { name: 'Wing', copies: 2, hookMm: 3.5, yarns: ['Moss cotton'], instructions: 'Rnd 1: 5 sc in MR (5)' },
    ]);
  });

  it('asks before removing a piece, saying what goes with it, then sends the list without it', async () => {
    const p = project();
    const sent = serve(p, { entries: [entry(1, 12), entry(2, null)], patch: () => HttpResponse.json({ project: { ...p, pieces: [p.pieces[0], p.pieces[2]] } }) });
    renderRoute('/projects/5');
    const { user, form } = await openEditor('Ear');
    await user.click(within(form).getByRole('button', { name: 'Remove this piece' }));
    const dialog = await screen.findByRole('dialog', { name: 'Remove Ear?' });
    expect(dialog).toHaveTextContent('its Tally count (All 2 copies done)');
    expect(dialog).toHaveTextContent('1 placement (pin)');
    expect(dialog).toHaveTextContent('the link from 1 journal entry; the entries and their photos stay in the journal');
    await user.click(within(dialog).getByRole('button', { name: 'Keep it' }));
    expect(sent).toEqual([]);

    await user.click(within(form).getByRole('button', { name: 'Remove this piece' }));
    await user.click(within(screen.getByRole('dialog', { name: 'Remove Ear?' })).getByRole('button', { name: 'Remove the piece' }));
    await waitFor(() => expect(sent).toEqual([{ pieces: [{ id: 11, name: 'Head' }, { id: 13, name: 'Tail' }] }]));
    await waitFor(() => expect(screen.queryByRole('heading', { name: 'Ear', level: 3 })).not.toBeInTheDocument());
  });

  it('moves a piece earlier', async () => {
    const sent = serve(project());
    renderRoute('/projects/5');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Change order' }, { timeout: 5000 }));
    expect(screen.getByRole('button', { name: 'Move Head earlier' })).toBeDisabled();
    await user.click(screen.getByRole('button', { name: 'Move Ear earlier' }));
    await waitFor(() => expect(sent).toEqual([{ pieces: [{ id: 12, name: 'Ear' }, { id: 11, name: 'Head' }, { id: 13, name: 'Tail' }] }]));
  });

  it('asks before leaving or cancelling with unsaved changes', async () => {
    serve(project());
    const { router } = renderRoute('/projects/5');
    const { user, form } = await openEditor('Tail');
    await user.type(within(form).getByLabelText('Piece name'), ' tip');

    await user.click(screen.getAllByRole('link', { name: 'Projects' })[0]);
    const leave = await screen.findByRole('dialog', { name: 'Leave without saving?' });
    expect(leave).toHaveTextContent('Your changes to Tail are not saved yet.');
    await user.click(within(leave).getByRole('button', { name: 'Keep it' }));
    expect(router.state.location.pathname).toBe('/projects/5');

    await user.click(within(form).getByRole('button', { name: 'Cancel' }));
    const drop = await screen.findByRole('dialog', { name: 'Drop your changes?' });
    await user.click(within(drop).getByRole('button', { name: 'Drop the changes' }));
    expect(screen.queryByRole('form', { name: 'Edit Tail' })).not.toBeInTheDocument();
    expect(screen.getByRole('heading', { name: 'Tail', level: 3 })).toBeInTheDocument();
  });
});
