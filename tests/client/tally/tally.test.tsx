import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { fireEvent, render, screen, waitFor, within } from '@testing-library/react';
import userEvent from '@testing-library/user-event';
import { createMemoryRouter, RouterProvider } from 'react-router-dom';
import { http, HttpResponse } from 'msw';
import { AppProvider } from '@/app/provider';
import { routes } from '@/app/router';
import { outbox } from '@/features/tally/lib/outbox';
import type { PieceProgress, Project } from '@/types/api';
import { server } from '../mocks/server';

// The Tally screen through the real routes and the real app provider (its outbox sync included); only the
// network is mocked. The mock server answers each tap by counting it, like the real one.

const instructions = [
  'Rnd 1: 6 sc in MR (6)',
  'Change to pink yarn.',
  'Rnd 2: inc x6 (12)',
  'Rnd 3: (sc, inc) x6 (18)',
].join('\n');

function project(): Project {
  return {
    id: 7,
    title: 'Pink ball',
    status: 'on_the_hook',
    patternId: null,
    patternCredit: null,
    terms: 'us',
    startedOn: null,
    finishedOn: null,
    recipient: null,
    forYoungChild: false,
    materials: { yarns: [], hooks: [], notions: [] },
    notes: null,
    visibility: 'private',
    shareUrl: null,
    coverPhoto: null,
    cautions: [],
    createdAt: '2026-12-01T10:00:00.000Z',
    updatedAt: '2026-12-01T10:00:00.000Z',
    pieces: [
      {
        id: 11,
        position: 0,
        name: 'Ball',
        copies: 1,
        hookMm: 3.5,
        hook: null,
        yarns: [],
        instructions,
        progress: { copy: 1, round: 0, step: 0, done: 0, version: 0, updatedAt: null },
        totals: { rounds: 3, stepsPerCopy: 24, copiesDone: 0, roundsDone: 0 },
        placements: [],
      },
    ],
  };
}

// Steps per round as the stitch engine gives them for these lines: 6 sc in the ring, 6 inc, 6 × (sc, inc).
const steps = [6, 6, 12];

interface Sent {
  opId: string;
  action: string;
}

function fakeServer() {
  const sent: Sent[] = [];
  const seen = new Set<string>();
  let pos = { copy: 1, round: 0, step: 0 };
  const stack: Array<typeof pos> = [];
  let version = 0;
  const progress = (): PieceProgress => ({
    ...pos,
    done: steps.slice(0, pos.round).reduce((a, b) => a + b, 0) + pos.step,
    version,
    updatedAt: '2026-12-01T10:00:00.000Z',
  });
  server.use(
    http.get('*/api/projects/7', () => HttpResponse.json({ project: project() })),
    http.get('*/api/pieces/11/progress', () => HttpResponse.json({ progress: progress() })),
    http.get('*/api/pieces/11/progress/history', () => HttpResponse.json({ version, undo: stack })),
    http.get('*/api/pieces/11/placements', () => HttpResponse.json({ placements: [] })),
    http.post('*/api/pieces/11/progress', async ({ request }) => {
      const op = (await request.json()) as Sent;
      sent.push(op);
      if (!seen.has(op.opId)) {
        seen.add(op.opId);
        version += 1;
        if (op.action === 'undo') pos = stack.pop() ?? pos;
        else {
          stack.push(pos);
          let { round, step } = pos;
          step = op.action === 'round' ? steps[round] : step + 1;
          if (step >= steps[round] && round < steps.length - 1) {
            round += 1;
            step = 0;
          }
          pos = { copy: 1, round, step };
        }
      }
      return HttpResponse.json({ progress: progress() });
    }),
  );
  return { sent, position: () => pos };
}

function renderTally() {
  const router = createMemoryRouter(routes, { initialEntries: ['/projects/7/pieces/11/count'] });
  return render(
    <AppProvider>
      <RouterProvider router={router} />
    </AppProvider>,
  );
}

const zone = () => screen.getByTestId('tally-zone');
const tap = async () => {
  fireEvent.pointerDown(zone(), { button: 0, isPrimary: true, pointerId: 1 });
};

beforeEach(async () => {
  await outbox.reset();
  localStorage.clear();
});
afterEach(async () => {
  await outbox.reset();
});

describe('the Tally', () => {
  it('shows the piece, the round, its line with the step being worked, and the next stitch in words', async () => {
    fakeServer();
    renderTally();
    expect(await screen.findByRole('heading', { name: 'Ball' }, { timeout: 10_000 })).toBeInTheDocument();
    expect(within(zone()).getByText('Rnd 1')).toBeInTheDocument();
    expect(within(zone()).getByText(/of 3/)).toBeInTheDocument();
    expect(within(zone()).getByText('ends with 6 sts')).toBeInTheDocument();
    const current = zone().querySelector('mark[data-current-step]');
    expect(current?.textContent).toMatch(/6 sc in MR/);
    expect(within(zone()).getByText(/sc in the magic ring \(1 of 6\)/)).toBeInTheDocument();
    expect(screen.getByRole('button', { name: 'Count one stitch' })).toBeInTheDocument();
  });

  it('counts a stitch on each tap, sends each tap once with its own opId, and rolls into the next round', async () => {
    const fake = fakeServer();
    renderTally();
    await screen.findByRole('button', { name: 'Count one stitch' }, { timeout: 10_000 });
    await tap();
    expect(within(zone()).getByText(/sc in the magic ring \(2 of 6\)/)).toBeInTheDocument();
    expect(within(zone()).getByText('of 6 made')).toBeInTheDocument();
    for (let i = 0; i < 5; i += 1) await tap();
    // Rnd 1 done: the colour change before Rnd 2 is shown and must be confirmed.
    expect(await within(zone()).findByText('Change to pink yarn.')).toBeInTheDocument();
    expect(within(zone()).getByText('Before Rnd 2')).toBeInTheDocument();
    await waitFor(() => expect(fake.sent).toHaveLength(6));
    expect(new Set(fake.sent.map((s) => s.opId)).size).toBe(6);
    expect(fake.sent.every((s) => s.action === 'step')).toBe(true);
    // The confirming tap counts nothing…
    await tap();
    expect(within(zone()).getByText('Rnd 2')).toBeInTheDocument();
    expect(within(zone()).getByText(/inc: 2 sc in the next stitch/)).toBeInTheDocument();
    await new Promise((r) => setTimeout(r, 50));
    expect(fake.sent).toHaveLength(6);
    // …the next one does.
    await tap();
    await waitFor(() => expect(fake.sent).toHaveLength(7));
    await waitFor(() => expect(fake.position()).toEqual({ copy: 1, round: 1, step: 1 }));
  });

  it('counts on Space, Enter, arrows and Page Down, and undoes on Backspace, across a round boundary', async () => {
    const fake = fakeServer();
    renderTally();
    await screen.findByRole('button', { name: 'Count one stitch' }, { timeout: 10_000 });
    const user = userEvent.setup();
    await user.keyboard(' ');
    await user.keyboard('{Enter}');
    await user.keyboard('{ArrowRight}');
    await user.keyboard('{ArrowDown}');
    await user.keyboard('{PageDown}');
    expect(within(zone()).getByText(/sc in the magic ring \(6 of 6\)/)).toBeInTheDocument();
    await user.keyboard(' ');
    expect(await within(zone()).findByText('Change to pink yarn.')).toBeInTheDocument();
    // Undo goes back over the round boundary to the last stitch of Rnd 1.
    await user.keyboard('{Backspace}');
    expect(within(zone()).getByText('Rnd 1')).toBeInTheDocument();
    expect(within(zone()).getByText(/sc in the magic ring \(6 of 6\)/)).toBeInTheDocument();
    await user.keyboard('{ArrowLeft}');
    expect(within(zone()).getByText(/sc in the magic ring \(5 of 6\)/)).toBeInTheDocument();
    await waitFor(() =>
      expect(fake.sent.map((s) => s.action)).toEqual([
        'step',
        'step',
        'step',
        'step',
        'step',
        'step',
        'undo',
        'undo',
      ]),
    );
    await waitFor(() => expect(fake.position()).toEqual({ copy: 1, round: 0, step: 4 }));
  });

  it('has undo one tap away and a round-done button', async () => {
    const fake = fakeServer();
    renderTally();
    await screen.findByRole('button', { name: 'Count one stitch' }, { timeout: 10_000 });
    const user = userEvent.setup();
    expect(screen.getByRole('button', { name: 'Undo' })).toBeDisabled();
    await tap();
    await user.click(screen.getByRole('button', { name: 'Round done' }));
    expect(await within(zone()).findByText('Change to pink yarn.')).toBeInTheDocument();
    await user.click(screen.getByRole('button', { name: 'Undo' }));
    expect(within(zone()).getByText(/sc in the magic ring \(2 of 6\)/)).toBeInTheDocument();
    await waitFor(() => expect(fake.sent.map((s) => s.action)).toEqual(['step', 'round', 'undo']));
  });

  it('keeps taps made without a connection and says how many wait', async () => {
    fakeServer();
    server.use(http.post('*/api/pieces/11/progress', () => HttpResponse.error()));
    renderTally();
    await screen.findByRole('button', { name: 'Count one stitch' }, { timeout: 10_000 });
    await tap();
    await tap();
    await tap();
    expect(within(zone()).getByText(/sc in the magic ring \(4 of 6\)/)).toBeInTheDocument();
    expect(await screen.findByText('3 taps waiting to sync.')).toBeInTheDocument();
    expect(outbox.getSnapshot().items.map((i) => i.kind)).toEqual(['progress', 'progress', 'progress']);
  });
});
