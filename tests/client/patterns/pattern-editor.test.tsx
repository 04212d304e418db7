import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import type { Pattern } from '@/types/api';

function makePattern(overrides: Partial<Pattern> = {}): Pattern {
  return {
    id: 41,
    title: 'Moss pebble',
    designerCredit: 'Test studio',
    sourceUrl: null,
    terms: 'us',
    gauge: null,
    skillNotes: null,
    materials: { yarns: [], hooks: [], notions: [] },
    visibility: 'private',
    mine: true,
    pieces: [
      {
        id: 7,
        position: 0,
        name: 'Pebble',
        copies: 1,
        hookMm: 3.5,
        hook: { mm: 3.5, us: 'E-4' },
        yarns: [],
        instructions: 'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)',
        check: { rounds: [], problemCount: 0 },
      },
    ],
    cautions: [],
    createdAt: '2026-12-01T10:00:00.000Z',
    updatedAt: '2026-12-01T10:00:00.000Z',
    ...overrides,
  };
}

const instructions = () => screen.getByLabelText(/^Instructions \(/) as HTMLTextAreaElement;
/** The ConfirmDialog whose text matches (closed <dialog>s are in the page too). */
const dialogWith = (text: RegExp) => {
  const d = screen.getAllByRole('dialog', { hidden: true }).find((el) => text.test(el.textContent ?? ''));
  if (!d) throw new Error(`no dialog with ${text}`);
  return d;
};
const roundTable = () => screen.getByRole('region', { name: 'Round table' });
const rowFor = (label: string) =>
  within(roundTable()).getByRole('row', { name: new RegExp(`^${label}(,|$)`) });

async function openNew() {
  renderRoute('/patterns/new');
  expect(await screen.findByRole('heading', { name: 'New pattern' }, { timeout: 5000 })).toBeInTheDocument();
  return userEvent.setup();
}

describe('the round table', () => {
  it('updates as you type and shows a problem at its line, then clears when it is fixed', async () => {
    const user = await openNew();
    await user.type(
      instructions(),
      'Rnd 1: 6 sc in MR (6){Enter}Rnd 2: inc x6 (12){Enter}Rnd 3: (sc, inc) x6 (20)',
    );

    await waitFor(() => expect(within(roundTable()).getAllByRole('row')).toHaveLength(1 + 3 + 1));
    const r1 = rowFor('Rnd 1');
    expect(within(r1).getAllByRole('cell')[1]).toHaveTextContent('6');
    const r3 = rowFor('Rnd 3, check');
    const cells = within(r3).getAllByRole('cell');
    expect(cells[1]).toHaveTextContent('18'); // what it makes
    expect(cells[2]).toHaveTextContent('12 of 12'); // what it works, of the round before
    expect(cells[3]).toHaveTextContent('20'); // what the pattern states
    expect(cells[4]).toHaveTextContent('check');
    // The problem is shown in words beside its line (line 3), right under its round.
    const problem = within(roundTable()).getByRole('button', { name: /line 3/ });
    expect(problem).toHaveTextContent(/18/);
    expect(within(roundTable()).getByText(/1 to check|\d+ to check/)).toBeInTheDocument();

    // Clicking the problem puts the caret on that line of the textarea.
    await user.click(problem);
    const ta = instructions();
    const lineStart = ta.value.indexOf('Rnd 3');
    expect(ta.selectionStart).toBeGreaterThanOrEqual(lineStart);
    expect(ta.selectionStart).toBeLessThanOrEqual(ta.value.length);
    expect(ta.value.slice(0, ta.selectionStart).split('\n')).toHaveLength(3);

    // Fix the stated count: the row loses its mark.
    await user.clear(ta);
    await user.type(ta, 'Rnd 1: 6 sc in MR (6){Enter}Rnd 2: inc x6 (12){Enter}Rnd 3: (sc, inc) x6 (18)');
    await waitFor(() => expect(within(roundTable()).getByText('Every count adds up')).toBeInTheDocument());
    expect(rowFor('Rnd 3')).not.toHaveTextContent('check');
  });

  it('shows notes between rounds with a word, not only an icon', async () => {
    const user = await openNew();
    await user.type(
      instructions(),
      'Rnd 1: 6 sc in MR (6){Enter}Rnd 2: inc x6 (12){Enter}Place safety eyes between Rnds 1 and 2, 3 sts apart.{Enter}Rnd 3: (sc, inc) x6 (18)',
    );
    const table = await waitFor(() => {
      const t = roundTable();
      expect(within(t).getByText(/Placement:/)).toBeInTheDocument();
      return t;
    });
    // in text order: after Rnd 2, before Rnd 3
    const rows = within(table)
      .getAllByRole('row')
      .map((r) => r.textContent ?? '');
    const at = rows.findIndex((t) => /Placement:/.test(t));
    expect(rows[at - 1]).toMatch(/Rnd 2/);
    expect(rows[at + 1]).toMatch(/Rnd 3/);
  });
});

describe('the round planner', () => {
  it('starts from the round above the caret and inserts the planned round after its line', async () => {
    const user = await openNew();
    await user.type(
      instructions(),
      'Rnd 1: 6 sc in MR (6){Enter}Rnd 2: inc x6 (12){Enter}Rnd 3: (sc, inc) x6 (18)',
    );
    await user.click(screen.getByRole('button', { name: 'Round planner' }));
    const planner = screen.getByRole('group', { name: 'Round planner' });
    const before = within(planner).getByLabelText('Stitches before');
    await waitFor(() => expect(before).toHaveValue(18));
    await user.type(within(planner).getByLabelText('Stitches wanted'), '24');
    await user.click(within(planner).getByLabelText('Stagger the increases or decreases'));
    const planned = within(planner).getByRole('status', { name: 'Planned round' });
    expect(planned).toHaveTextContent('Rnd 4: (2 sc, inc) x6 (24)');
    expect(within(planner).getByText(/Makes/)).toHaveTextContent('Makes 24 stitches from 18');

    await user.click(within(planner).getByRole('button', { name: 'Insert as Rnd 4' }));
    expect(instructions().value).toBe(
      'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)\nRnd 3: (sc, inc) x6 (18)\nRnd 4: (2 sc, inc) x6 (24)',
    );
    await waitFor(() => expect(within(rowFor('Rnd 4')).getAllByRole('cell')[1]).toHaveTextContent('24'));

    // With the caret back on Rnd 2, it starts from 12 and the new round goes right after Rnd 2.
    const ta = instructions();
    ta.setSelectionRange(ta.value.indexOf('(12)'), ta.value.indexOf('(12)'));
    await user.click(ta); // a click leaves the caret where the test put it in happy-dom
    ta.setSelectionRange(ta.value.indexOf('(12)'), ta.value.indexOf('(12)'));
    await user.keyboard('{ArrowRight}');
    await waitFor(() => expect(within(planner).getByLabelText('Stitches before')).toHaveValue(12));
    expect(within(planner).getByRole('button', { name: 'Insert as Rnd 3' })).toBeInTheDocument();
  });

  it('writes the round in UK terms for a pattern written in UK terms', async () => {
    const user = await openNew();
    await user.selectOptions(screen.getByLabelText('Written in'), 'uk');
    await user.type(instructions(), 'Rnd 1: 6 dc in MR (6){Enter}Rnd 2: inc x6 (12)');
    await user.click(screen.getByRole('button', { name: 'Round planner' }));
    const planner = screen.getByRole('group', { name: 'Round planner' });
    await waitFor(() => expect(within(planner).getByLabelText('Stitches before')).toHaveValue(12));
    await user.type(within(planner).getByLabelText('Stitches wanted'), '18');
    await user.click(within(planner).getByLabelText('Stagger the increases or decreases'));
    // Source: US sc is UK dc (standards.md §4, US/UK terms).
    expect(within(planner).getByRole('status', { name: 'Planned round' })).toHaveTextContent(
      'Rnd 3: (dc, inc) x6 (18)',
    );
    expect(within(planner).getByText(/Makes/)).toHaveTextContent('Makes 18 stitches from 12');
  });

  it('explains a count one round cannot reach instead of writing it', async () => {
    const user = await openNew();
    await user.type(instructions(), 'Rnd 1: 6 sc in MR (6)');
    await user.click(screen.getByRole('button', { name: 'Round planner' }));
    const planner = screen.getByRole('group', { name: 'Round planner' });
    await user.type(within(planner).getByLabelText('Stitches wanted'), '20');
    expect(within(planner).getByRole('alert')).toHaveTextContent(/at most 12/);
    expect(within(planner).queryByRole('button', { name: /Insert/ })).not.toBeInTheDocument();
  });
});

describe('the US/UK toggle', () => {
  it('shows the instructions in UK terms, read-only, and leaves what was typed alone', async () => {
    const user = await openNew();
    const typed = 'Rnd 1: 6 sc in MR (6){Enter}Rnd 2: inc x6 (12){Enter}Rnd 3: (sc, inc) x6 (18)';
    await user.type(instructions(), typed);
    const before = instructions().value;
    await user.click(screen.getByRole('radio', { name: 'UK terms' }));
    const view = screen.getByLabelText('Instructions in UK terms (read-only)');
    // Source: US sc is UK dc (Craft Yarn Council US/UK terms chart; standards.md §4).
    expect(view).toHaveTextContent('Rnd 1: 6 dc in MR (6)');
    expect(view.textContent).not.toMatch(/\bsc\b/);
    expect(instructions().value).toBe(before);
    expect(instructions()).not.toBeVisible();
    // The round table still checks what was typed.
    expect(rowFor('Rnd 3')).toBeInTheDocument();

    await user.click(screen.getByRole('radio', { name: /US terms/ }));
    expect(screen.queryByLabelText('Instructions in UK terms (read-only)')).not.toBeInTheDocument();
    expect(instructions()).toBeVisible();
    expect(instructions().value).toBe(before);
  });
});

describe('hooks, yarn weights and the safety caution', () => {
  it('shows a hook size as mm with the US size beside it', async () => {
    const user = await openNew();
    await user.type(screen.getByLabelText('Hook (mm)'), '3.5');
    // Source: Craft Yarn Council hook chart — 3.5 mm is US E-4, 5 mm is H-8; 2.5 mm has no US size.
    expect(screen.getByTestId('hook-label')).toHaveTextContent('3.5 mm (US E-4)');
    await user.clear(screen.getByLabelText('Hook (mm)'));
    await user.type(screen.getByLabelText('Hook (mm)'), '5');
    expect(screen.getByTestId('hook-label')).toHaveTextContent('5 mm (US H-8)');
    await user.clear(screen.getByLabelText('Hook (mm)'));
    await user.type(screen.getByLabelText('Hook (mm)'), '2.5');
    expect(screen.getByTestId('hook-label')).toHaveTextContent(/^2\.5 mm$/);
  });

  it('labels yarn weights with the CYC categories and maps ply names with ≈', async () => {
    const user = await openNew();
    await user.click(screen.getByRole('button', { name: 'Add a yarn' }));
    const weight = screen.getByLabelText(/^Weight/) as HTMLSelectElement;
    const labels = [...weight.options].map((o) => o.textContent);
    // Source: Craft Yarn Council Standard Yarn Weight System (categories 0–7).
    expect(labels).toEqual(
      expect.arrayContaining([
        'Fingering, Lace (0)',
        'DK, Light (3)',
        'Worsted, Medium (4)',
        'Jumbo, Jumbo (7)',
      ]),
    );
    await user.type(screen.getByLabelText('Ply (as on the ball band)'), '8 ply');
    // Common practice (AU/NZ/UK ply names; a convention, shown with ≈): 8 ply ≈ DK, Light (3).
    expect(screen.getByText('≈ DK, Light (3)')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Use this weight' }));
    expect(weight).toHaveValue('3');
  });

  it('shows the toy-safety caution once safety eyes are among the notions', async () => {
    const user = await openNew();
    expect(screen.queryByText('Small parts can be a choking hazard')).not.toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Add a notion' }));
    await user.selectOptions(screen.getByLabelText('Notion'), 'safety_eyes');
    expect(screen.getByLabelText('Size (mm)')).toBeInTheDocument();
    expect(screen.getByText('Small parts can be a choking hazard')).toBeInTheDocument();
    expect(screen.getByText(/16 CFR 1501/)).toBeInTheDocument();
  });
});

describe('saving', () => {
  it('checks the form with the shared schema before sending anything', async () => {
    let posted = false;
    server.use(http.post('*/api/patterns', () => ((posted = true), HttpResponse.json({}, { status: 500 }))));
    const user = await openNew();
    await user.type(screen.getByLabelText('Source link'), 'javascript:alert(1)');
    await user.click(screen.getByRole('button', { name: 'Save pattern' }));
    expect(await screen.findByText('Give the pattern a title.')).toBeInTheDocument();
    expect(screen.getByText(/starts with http:\/\/ or https:\/\//)).toBeInTheDocument();
    expect(posted).toBe(false);
  });

  it('creates the pattern and goes to its page', async () => {
    let body: any = null;
    const saved = makePattern({ id: 52, title: 'Sprout' });
    server.use(
      http.post('*/api/patterns', async ({ request }) => {
        body = await request.json();
        return HttpResponse.json({ pattern: saved }, { status: 201 });
      }),
      http.get('*/api/patterns/52', () => HttpResponse.json({ pattern: saved })),
    );
    const user = await openNew();
    await user.type(screen.getByLabelText('Title'), 'Sprout');
    await user.clear(screen.getByLabelText('Piece name'));
    await user.type(screen.getByLabelText('Piece name'), 'Head');
    await user.clear(screen.getByLabelText('How many to make'));
    await user.type(screen.getByLabelText('How many to make'), '2');
    await user.type(screen.getByLabelText('Hook (mm)'), '3.5');
    await user.type(instructions(), 'Rnd 1: 6 sc in MR (6)');
    await user.click(screen.getByRole('button', { name: 'Save pattern' }));
    expect(await screen.findByRole('heading', { name: 'Sprout' }, { timeout: 5000 })).toBeInTheDocument();
    expect(body).toMatchObject({
      title: 'Sprout',
      terms: 'us',
      visibility: 'private',
      pieces: [{ name: 'Head', copies: 2, hookMm: 3.5, instructions: 'Rnd 1: 6 sc in MR (6)' }],
    });
    expect(screen.getByRole('link', { name: 'Start a project from this pattern' })).toHaveAttribute(
      'href',
      '/projects/new?patternId=52',
    );
  });

  it('sends piece ids back on save so they stay the same, and asks before deleting', async () => {
    let patch: any = null;
    let deleted = false;
    const p = makePattern();
    server.use(
      http.get('*/api/patterns/41', () => HttpResponse.json({ pattern: p })),
      http.patch('*/api/patterns/41', async ({ request }) => {
        patch = await request.json();
        return HttpResponse.json({ pattern: { ...p, title: patch.title } });
      }),
      http.delete('*/api/patterns/41', () => ((deleted = true), new HttpResponse(null, { status: 204 }))),
      http.get('*/api/patterns', () => HttpResponse.json({ patterns: [] })),
    );
    const { router } = renderRoute('/patterns/41');
    const user = userEvent.setup();
    const title = await screen.findByLabelText('Title', {}, { timeout: 5000 });
    await user.clear(title);
    await user.type(title, 'Moss pebble, larger');
    expect(screen.getByText('Unsaved changes')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Save changes' }));
    await waitFor(() => expect(patch).not.toBeNull());
    expect(patch.pieces).toEqual([
      { id: 7, name: 'Pebble', copies: 1, hookMm: 3.5, yarns: [], instructions: p.pieces[0].instructions },
    ]);
    expect(await screen.findByText('Saved')).toBeInTheDocument();

    await user.click(screen.getByRole('button', { name: 'Delete pattern' }));
    const dialog = dialogWith(/Delete “Moss pebble, larger”\?/);
    expect(dialog).toHaveAttribute('open');
    expect(within(dialog).getByText(/keep their own pieces and instructions/)).toBeInTheDocument();
    expect(deleted).toBe(false);
    await user.click(within(dialog).getByRole('button', { name: 'Delete pattern', hidden: true }));
    await waitFor(() => expect(router.state.location.pathname).toBe('/patterns'));
    expect(deleted).toBe(true);
  });

  it('asks before leaving with unsaved changes', async () => {
    server.use(
      http.get('*/api/patterns', () => HttpResponse.json({ patterns: [] })),
      http.get('*/api/projects', () => HttpResponse.json({ projects: [] })),
    );
    const { router } = renderRoute('/patterns/new');
    const user = userEvent.setup();
    await user.type(await screen.findByLabelText('Title', {}, { timeout: 5000 }), 'Half-typed');
    await user.click(screen.getAllByRole('link', { name: /Patterns/ })[0]);
    await waitFor(() => expect(dialogWith(/Leave without saving\?/)).toHaveAttribute('open'));
    const dialog = dialogWith(/Leave without saving\?/);
    expect(router.state.location.pathname).toBe('/patterns/new');
    await user.click(within(dialog).getByRole('button', { name: 'Keep it', hidden: true }));
    expect(router.state.location.pathname).toBe('/patterns/new');
    expect(screen.getByLabelText('Title')).toHaveValue('Half-typed');
  });
});

describe('someone else’s public pattern', () => {
  it('is shown read-only, with its round table, and can start a project', async () => {
    server.use(
      http.get('*/api/patterns/41', () =>
        HttpResponse.json({ pattern: makePattern({ mine: false, visibility: 'public' }) }),
      ),
    );
    renderRoute('/patterns/41');
    expect(await screen.findByText('Read-only', {}, { timeout: 5000 })).toBeInTheDocument();
    expect(screen.queryByRole('button', { name: /Save/ })).not.toBeInTheDocument();
    expect(screen.queryByLabelText('Title')).not.toBeInTheDocument();
    expect(
      within(screen.getByRole('region', { name: 'Round table' })).getByText('Rnd 2'),
    ).toBeInTheDocument();
    expect(screen.getByRole('link', { name: 'Start a project from this pattern' })).toHaveAttribute(
      'href',
      '/projects/new?patternId=41',
    );
  });

  it('answers a missing pattern with a page, not a crash', async () => {
    server.use(
      http.get('*/api/patterns/404', () =>
        HttpResponse.json({ error: 'That pattern could not be found.' }, { status: 404 }),
      ),
    );
    renderRoute('/patterns/404');
    expect(
      await screen.findByText('That pattern could not be found', {}, { timeout: 5000 }),
    ).toBeInTheDocument();
  });
});

describe('the pattern list', () => {
  it('lists patterns with their piece and problem counts in words', async () => {
    server.use(
      http.get('*/api/patterns', () =>
        HttpResponse.json({
          patterns: [
            {
              id: 1,
              title: 'Sprout',
              designerCredit: null,
              pieceCount: 3,
              problemCount: 2,
              updatedAt: '2026-12-01T10:00:00.000Z',
              visibility: 'public',
            },
            {
              id: 2,
              title: 'Pebble',
              designerCredit: 'Test studio',
              pieceCount: 1,
              problemCount: 0,
              updatedAt: '2026-11-30T10:00:00.000Z',
              visibility: 'private',
            },
          ],
        }),
      ),
    );
    renderRoute('/patterns');
    const sprout = (await screen.findByText('Sprout', {}, { timeout: 5000 })).closest('a')!;
    expect(sprout).toHaveAttribute('href', '/patterns/1');
    expect(sprout).toHaveTextContent('3 pieces');
    expect(sprout).toHaveTextContent('2 to check');
    expect(sprout).toHaveTextContent('Public');
    const pebble = screen.getByText('Pebble').closest('a')!;
    expect(pebble).toHaveTextContent('counts add up');
    expect(pebble).toHaveTextContent('Private');
  });
});
