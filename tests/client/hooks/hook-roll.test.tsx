import { describe, expect, it } from 'vitest';
import { screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { http, HttpResponse } from 'msw';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import type { RollHook } from '@/types/hooks';

const slow = { timeout: 5000 };
const at = '2026-12-01T10:00:00.000Z';
const rollHook = (h: Partial<RollHook> & { id: number; mm: number; us: string | null }): RollHook => ({
  material: null,
  brand: null,
  note: null,
  quantity: 1,
  createdAt: at,
  updatedAt: at,
  ...h,
});

// Sent out of order on purpose: the screen keeps the roll smallest first.
// US sizes as the Craft Yarn Council hook chart gives them (standards.md §2: S6, S9, S10, S13); 2.5 mm has none.
const roll = [
  rollHook({ id: 1, mm: 5, us: 'H-8', material: 'wood' }),
  rollHook({ id: 2, mm: 2.5, us: null, material: 'steel', brand: 'Fernside' }),
  rollHook({ id: 3, mm: 3.5, us: 'E-4', material: 'ergonomic', quantity: 2, note: 'blue pouch' }),
];

const rows = () => within(screen.getByRole('list', { name: 'Hooks' })).getAllByRole('listitem');

describe('the hook roll', () => {
  it('explains itself when empty, checks the form, shows the US size as it is typed, and adds the hook', async () => {
    let hooks: RollHook[] = [];
    let sent: any = null;
    server.use(
      http.get('*/api/hooks', () => HttpResponse.json({ hooks })),
      http.post('*/api/hooks', async ({ request }) => {
        sent = await request.json();
        const h = rollHook({ id: 9, us: 'E-4', ...sent });
        hooks = [h];
        return HttpResponse.json({ hook: h }, { status: 201 });
      }),
    );
    renderRoute('/hooks');
    expect(await screen.findByText('Your hook roll is empty', {}, slow)).toBeInTheDocument();
    expect(screen.getByText(/says whether you already have the hook it needs/)).toBeInTheDocument();
    const user = userEvent.setup();
    await user.click(screen.getByRole('button', { name: 'Add your first hook' }));

    const size = screen.getByLabelText('Size (mm)');
    await user.type(size, '0.2');
    await user.click(screen.getByRole('button', { name: 'Add to the roll' }));
    expect(await screen.findByText('A hook is at least 0.5 mm.')).toBeInTheDocument();
    expect(sent).toBeNull();

    await user.clear(size);
    await user.type(size, '2.5');
    expect(screen.getByText('No US size on the chart: shown as 2.5 mm only.')).toBeInTheDocument();
    await user.clear(size);
    // A comma is how many makers write the decimal point.
    await user.type(size, '3,5');
    expect(screen.getByText('Shown as 3.5 mm (US E-4).')).toBeInTheDocument();
    await user.selectOptions(screen.getByLabelText('Material'), 'Bamboo');
    await user.click(screen.getByRole('button', { name: 'Add to the roll' }));

    await waitFor(() => expect(sent).toEqual({ mm: 3.5, material: 'bamboo', brand: null, note: null, quantity: 1 }));
    await waitFor(() => expect(rows()).toHaveLength(1));
    expect(rows()[0]).toHaveTextContent('3.5 mm (US E-4)');
    expect(rows()[0]).toHaveTextContent('Bamboo');
  });

  it('lists the hooks smallest first with their US size, or says there is none', async () => {
    server.use(http.get('*/api/hooks', () => HttpResponse.json({ hooks: roll })));
    renderRoute('/hooks');
    await screen.findByRole('list', { name: 'Hooks' }, slow);
    expect(rows().map((r) => r.querySelector('p')?.firstChild?.textContent)).toEqual(['2.5 mm', '3.5 mm (US E-4)', '5 mm (US H-8)']);
    expect(rows()[0]).toHaveTextContent('No US size · Steel · Fernside');
    expect(rows()[1]).toHaveTextContent('2 of these');
    expect(rows()[1]).toHaveTextContent('Ergonomic handle');
    expect(screen.getByText('4 hooks in the roll, 2.5–5 mm')).toBeInTheDocument();
  });

  it('changes a hook and sends only the form', async () => {
    let sent: any = null;
    server.use(
      http.get('*/api/hooks', () => HttpResponse.json({ hooks: roll })),
      http.patch('*/api/hooks/:id', async ({ params, request }) => {
        sent = { id: params.id, body: await request.json() };
        return HttpResponse.json({ hook: { ...roll[0], ...(sent.body as object) } });
      }),
    );
    renderRoute('/hooks');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Edit 5 mm (US H-8)' }, slow));
    expect(screen.getByRole('heading', { name: 'Change the 5 mm (US H-8) hook' })).toBeInTheDocument();
    expect(screen.getByLabelText('Size (mm)')).toHaveValue('5');
    expect(screen.getByLabelText('Material')).toHaveValue('wood');
    await user.clear(screen.getByLabelText('How many'));
    await user.type(screen.getByLabelText('How many'), '0');
    await user.click(screen.getByRole('button', { name: 'Save the hook' }));
    expect(await screen.findByText('At least 1 — delete the hook if you no longer have it.')).toBeInTheDocument();
    expect(sent).toBeNull();
    await user.clear(screen.getByLabelText('How many'));
    await user.type(screen.getByLabelText('How many'), '3');
    await user.click(screen.getByRole('button', { name: 'Save the hook' }));
    await waitFor(() => expect(sent).toEqual({ id: '1', body: { mm: 5, material: 'wood', brand: null, note: null, quantity: 3 } }));
    await waitFor(() => expect(screen.queryByRole('button', { name: 'Save the hook' })).not.toBeInTheDocument());
  });

  it('shows the server’s sentence when a hook is not saved', async () => {
    server.use(
      http.get('*/api/hooks', () => HttpResponse.json({ hooks: [] })),
      http.post('*/api/hooks', () => HttpResponse.json({ error: 'Please check the form: mm: A hook is at most 35 mm.', issues: [{ path: 'mm', message: 'A hook is at most 35 mm.' }] }, { status: 422 })),
    );
    renderRoute('/hooks');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Add your first hook' }, slow));
    await user.type(screen.getByLabelText('Size (mm)'), '4');
    await user.click(screen.getByRole('button', { name: 'Add to the roll' }));
    expect(await screen.findByRole('alert')).toHaveTextContent('Please check the form: mm: A hook is at most 35 mm.');
  });

  it('asks before deleting a hook', async () => {
    let deleted: string | null = null;
    server.use(
      http.get('*/api/hooks', () => HttpResponse.json({ hooks: deleted ? roll.filter((h) => String(h.id) !== deleted) : roll })),
      http.delete('*/api/hooks/:id', ({ params }) => {
        deleted = String(params.id);
        return new HttpResponse(null, { status: 204 });
      }),
    );
    renderRoute('/hooks');
    const user = userEvent.setup();
    await user.click(await screen.findByRole('button', { name: 'Delete 3.5 mm (US E-4)' }, slow));
    const dialog = screen.getByRole('dialog');
    expect(dialog).toHaveTextContent('Take the 3.5 mm (US E-4) hook out of the roll?');
    expect(dialog).toHaveTextContent('All 2 of them go.');
    expect(deleted).toBeNull();
    await user.click(within(dialog).getByRole('button', { name: 'Delete the hook' }));
    await waitFor(() => expect(deleted).toBe('3'));
    await waitFor(() => expect(rows()).toHaveLength(2));
  });

  it('opens the form at the size a project piece asked for', async () => {
    server.use(http.get('*/api/hooks', () => HttpResponse.json({ hooks: [] })));
    renderRoute('/hooks?size=2.75');
    expect(await screen.findByRole('heading', { name: 'Add a hook' }, slow)).toBeInTheDocument();
    expect(screen.getByLabelText('Size (mm)')).toHaveValue('2.75');
    expect(screen.getByText('Shown as 2.75 mm (US C-2).')).toBeInTheDocument();
  });
});
