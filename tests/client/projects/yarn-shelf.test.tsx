import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import type { ShelfYarn } from '@/types/api';

const slow = { timeout: 5000 };

const shelf: ShelfYarn[] = [
  { id: 1, name: 'Plum cotton', colour: 'plum', fibre: 'cotton', weight: 3, metersPerSkein: 125, skeinsOwned: 3, metersUsed: 80, metersLeft: 295, yardsLeft: 322.6, notes: null },
  { id: 2, name: 'Oat merino', colour: 'undyed', fibre: 'merino wool', weight: 4, yardsPerSkein: 220, skeinsOwned: 2, metersUsed: 0, metersLeft: 402.3, yardsLeft: 440, notes: null },
  { id: 3, name: 'Mystery acrylic', skeinsOwned: 0.5, metersUsed: 0, metersLeft: null, yardsLeft: null, notes: null },
];

/** The yarn names down the table, top to bottom. */
const names = (table: HTMLElement) =>
  within(table)
    .getAllByRole('row')
    .slice(1)
    .map((r) => within(r).getAllByRole('cell')[0].querySelector('.font-semibold')?.textContent);

describe('the yarn shelf', () => {
  it('lists the yarns with what is left, sorts by a header and filters by words', async () => {
    server.use(http.get('*/api/yarns', () => HttpResponse.json({ yarns: shelf })));
    renderRoute('/yarns');
    const table = await screen.findByRole('table', {}, slow);
    // Sorted by name to start with.
    expect(names(table)).toEqual(['Mystery acrylic', 'Oat merino', 'Plum cotton']);
    const plum = within(table).getByText('Plum cotton').closest('tr')!;
    expect(plum).toHaveTextContent('295 m · 323 yd');
    // Source: Craft Yarn Council Standard Yarn Weight System — category 3 is Light (DK).
    expect(plum).toHaveTextContent('DK, Light (3)');
    expect(within(table).getByText('Mystery acrylic').closest('tr')).toHaveTextContent('Add a length per skein');

    const user = userEvent.setup();
    const leftHeader = within(table).getByRole('columnheader', { name: /Left/ });
    await user.click(within(leftHeader).getByRole('button'));
    // A number column sorts the most first; unknown lengths go last either way.
    expect(leftHeader).toHaveAttribute('aria-sort', 'descending');
    expect(names(table)).toEqual(['Oat merino', 'Plum cotton', 'Mystery acrylic']);
    await user.click(within(leftHeader).getByRole('button'));
    expect(leftHeader).toHaveAttribute('aria-sort', 'ascending');
    expect(names(table)).toEqual(['Plum cotton', 'Oat merino', 'Mystery acrylic']);

    await user.type(screen.getByLabelText('Find a yarn'), 'merino');
    expect(names(table)).toEqual(['Oat merino']);
    expect(screen.getByText('1 of 3 yarns match')).toBeInTheDocument();
    await user.clear(screen.getByLabelText('Find a yarn'));
    await user.type(screen.getByLabelText('Find a yarn'), 'cotton plum');
    expect(names(table)).toEqual(['Plum cotton']);
  });

  it('adds a yarn after checking the form, and suggests the weight for a ply name', async () => {
    let sent: any = null;
    let yarns: ShelfYarn[] = [];
    server.use(
      http.get('*/api/yarns', () => HttpResponse.json({ yarns })),
      http.post('*/api/yarns', async ({ request }) => {
        sent = await request.json();
        const y = { id: 9, ...sent, metersUsed: 0, metersLeft: 250, yardsLeft: 273.4 };
        yarns = [y];
        return HttpResponse.json({ yarn: y }, { status: 201 });
      }),
    );
    renderRoute('/yarns');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Add your first yarn' }, slow));
    await user.click(screen.getByRole('button', { name: 'Add to the shelf' }));
    expect(await screen.findByText('Give the yarn a name.')).toBeInTheDocument();
    expect(sent).toBeNull();

    await user.type(screen.getByLabelText('Name'), 'Sea cotton');
    await user.type(screen.getByLabelText('Ply'), '8 ply');
    // Ply names are a convention, not a standard: 8 ply ≈ DK (standards.md §3, S17).
    await user.click(screen.getByRole('button', { name: 'Use DK, Light (3) for the weight' }));
    await user.type(screen.getByLabelText('Meters per skein'), '125');
    await user.clear(screen.getByLabelText('Skeins owned'));
    await user.type(screen.getByLabelText('Skeins owned'), '-2');
    await user.click(screen.getByRole('button', { name: 'Add to the shelf' }));
    expect(await screen.findByText('Skeins owned cannot be negative.')).toBeInTheDocument();
    await user.clear(screen.getByLabelText('Skeins owned'));
    await user.type(screen.getByLabelText('Skeins owned'), '2');
    await user.click(screen.getByRole('button', { name: 'Add to the shelf' }));
    await waitFor(() => expect(sent).toMatchObject({ name: 'Sea cotton', ply: '8 ply', weight: 3, metersPerSkein: 125, skeinsOwned: 2 }));
    const table = await screen.findByRole('table');
    expect(within(table).getByText('Sea cotton')).toBeInTheDocument();
  });

  it('asks before taking a yarn off the shelf', async () => {
    let deleted: string | null = null;
    server.use(
      http.get('*/api/yarns', () => HttpResponse.json({ yarns: deleted ? shelf.slice(1) : shelf })),
      http.delete('*/api/yarns/:id', ({ params }) => {
        deleted = String(params.id);
        return new HttpResponse(null, { status: 204 });
      }),
    );
    renderRoute('/yarns');
    const table = await screen.findByRole('table', {}, slow);
    const user = userEvent.setup();
    await user.click(within(table).getByRole('button', { name: 'Delete Plum cotton' }));
    const dialog = screen.getByRole('dialog');
    expect(dialog).toHaveTextContent('Take Plum cotton off the shelf?');
    expect(deleted).toBeNull();
    await user.click(within(dialog).getByRole('button', { name: 'Delete the yarn' }));
    await waitFor(() => expect(deleted).toBe('1'));
    await waitFor(() => expect(within(table).queryByText('Plum cotton')).not.toBeInTheDocument());
  });
});
