import { describe, expect, it } from 'vitest';
import { screen, within } from '@testing-library/react';
import { http, HttpResponse } from 'msw';
import type { ProjectListItem } from '@/types/api';
import { pieceToResume } from '@/features/home/components/resume-line';
import { server } from '../mocks/server';
import { renderRoute } from '../render';
import { buildPiece, buildProject, earText } from '../projects/fixtures';

const slow = { timeout: 5000 };

const listItem = (overrides: Partial<ProjectListItem> = {}): ProjectListItem => ({
  id: 5,
  title: 'Owl for Ada',
  status: 'on_the_hook',
  startedOn: '2026-11-20',
  finishedOn: null,
  updatedAt: '2026-11-21T10:00:00.000Z',
  pieceCount: 2,
  recipient: null,
  patternTitle: null,
  forYoungChild: false,
  visibility: 'private',
  cautionCount: 0,
  ...overrides,
});

// Head counted yesterday, first ear counted an hour ago and half done: the ear is where the maker left off.
const head = buildPiece({ id: 11, name: 'Head', progress: { copy: 1, round: 1, step: 2, done: 8, version: 3, updatedAt: '2026-11-21T09:00:00.000Z' } });
const ear = buildPiece({
  id: 12,
  name: 'Ear',
  copies: 2,
  instructions: earText,
  progress: { copy: 2, round: 0, step: 1, done: 7, version: 8, updatedAt: '2026-11-21T10:00:00.000Z' },
  totals: { rounds: 2, stepsPerCopy: 6, copiesDone: 1, roundsDone: 2 },
});

function answer(items: ProjectListItem[], projects: ReturnType<typeof buildProject>[]) {
  server.use(
    http.get('*/api/projects', ({ request }) => {
      const status = new URL(request.url).searchParams.get('status');
      return HttpResponse.json({ projects: status ? items.filter((p) => p.status === status) : items });
    }),
    ...projects.map((p) => http.get(`*/api/projects/${p.id}`, () => HttpResponse.json({ project: p }))),
  );
}

describe('the home screen', () => {
  it('offers to go on counting the piece counted last, in words, one tap from the Tally', async () => {
    answer([listItem()], [buildProject({ pieces: [head, ear] })]);
    const { router } = renderRoute('/');
    const go = await screen.findByRole('link', { name: 'Go on counting Ear · copy 2 of 2 · round 1 of 2' }, slow);
    expect(go).toHaveAttribute('href', '/projects/5/pieces/12/count');
    const card = screen.getByText('Owl for Ada').closest('li')!;
    expect(within(card).getByRole('link', { name: /Owl for Ada/ })).toHaveAttribute('href', '/projects/5');
    expect(router.state.location.pathname).toBe('/');
  });

  it('says "start counting" for a project nothing has been counted on, and says when every piece is done', async () => {
    const fresh = buildPiece({ id: 21, name: 'Ball' });
    const done = buildPiece({ id: 31, name: 'Bean', totals: { rounds: 3, stepsPerCopy: 14, copiesDone: 1, roundsDone: 3 } });
    answer(
      [listItem({ id: 20, title: 'Pocket ball', pieceCount: 1 }), listItem({ id: 30, title: 'Bean bag', pieceCount: 1 })],
      [buildProject({ id: 20, title: 'Pocket ball', pieces: [fresh] }), buildProject({ id: 30, title: 'Bean bag', pieces: [done] })],
    );
    renderRoute('/');
    expect(await screen.findByRole('link', { name: 'Start counting Ball · round 1 of 3' }, slow)).toHaveAttribute('href', '/projects/20/pieces/21/count');
    expect(await screen.findByText('Every piece is counted. Time to stuff and sew.')).toBeInTheDocument();
  });
});

describe('pieceToResume', () => {
  it('skips finished pieces and pieces with no countable rounds', () => {
    const noRounds = buildPiece({ id: 1, name: 'Notes only', instructions: 'Sew the ears on.', totals: { rounds: 0, stepsPerCopy: 0, copiesDone: 0, roundsDone: 0 } });
    const finished = buildPiece({ id: 2, name: 'Done', totals: { rounds: 3, stepsPerCopy: 14, copiesDone: 1, roundsDone: 3 }, progress: { copy: 1, round: 2, step: 14, done: 14, version: 9, updatedAt: '2026-11-22T00:00:00.000Z' } });
    const next = buildPiece({ id: 3, name: 'Next' });
    expect(pieceToResume({ pieces: [noRounds, finished, next] })).toEqual({ piece: next, started: false });
    expect(pieceToResume({ pieces: [noRounds, finished] })).toBeNull();
  });
});
