import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app';
import { signedInAgent } from '../../factories/users';
import { buildProjectInput } from '../../factories/projects';
import { newOpId } from '../../factories/progress';
import { hubFor } from '../../../server/services/progress';

// Editing a started piece from the project page: the Tally count moves with the rounds, never silently past
// them, and a piece never ends up with fewer copies than the one being worked. Every tap goes through the real
// progress API, so the positions here are the ones the Tally itself wrote.

let t: TestContext;
beforeEach(async () => {
  t = await createTestContext();
});
afterEach(async () => {
  await t.close();
});

type Agent = Awaited<ReturnType<typeof signedInAgent>>['agent'];

// Common practice: a ball starts with 6 sc in a magic ring and grows by 6 a round. Step counts below are
// the engine's (one step per stitch instruction): Rnd 1 = 6, Rnd 2 = 6, Rnd 3 = 12, Rnd 4 = 18.
const rnd1 = 'Rnd 1: 6 sc in MR (6)';
const rnd2 = 'Rnd 2: inc x6 (12)';
const rnd3 = 'Rnd 3: (sc, inc) x6 (18)';
const rnd4 = 'Rnd 4: (2 sc, inc) x6 (24)';
const fourRounds = [rnd1, rnd2, rnd3, rnd4].join('\n');

async function startedPiece(agent: Agent, { copies = 1, instructions = fourRounds } = {}) {
  const { body } = await agent.post('/api/projects').send(
    buildProjectInput({ pieces: [{ name: 'Ball', instructions, copies }, { name: 'Tail', instructions: 'Rnd 1: 4 sc in MR (4)' }] }),
  );
  return { projectId: body.project.id as number, ball: body.project.pieces[0], tail: body.project.pieces[1] };
}

const tap = (agent: Agent, pieceId: number, op: Record<string, unknown>) => agent.post(`/api/pieces/${pieceId}/progress`).send({ opId: newOpId(), ...op });

describe('PATCH /api/projects/:id pieces, for a piece the Tally has counted', () => {
  it('keeps the count on the same written round when a round is added before it, and undo follows', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball, tail } = await startedPiece(agent);
    // Into Rnd 3 (index 2), two steps done.
    await tap(agent, ball.id, { action: 'set', to: { copy: 1, round: 2, step: 1 } });
    const last = await tap(agent, ball.id, { action: 'step' });
    expect(last.body.progress).toMatchObject({ copy: 1, round: 2, step: 2 });

    // A plain round between Rnd 2 and Rnd 3: the old Rnd 3 is now Rnd 4, at index 3.
    const edited = [rnd1, rnd2, 'Rnd 3: sc around (12)', rnd3.replace('Rnd 3', 'Rnd 4'), rnd4.replace('Rnd 4', 'Rnd 5')].join('\n');
    const res = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Ball', instructions: edited }, { id: tail.id, name: 'Tail' }] });
    expect(res.status).toBe(200);
    const piece = res.body.project.pieces[0];
    // 6 + 6 + 12 steps before it, 2 into it.
    expect(piece.progress).toMatchObject({ copy: 1, round: 3, step: 2, done: 26, version: last.body.progress.version + 1 });
    expect(piece.totals).toMatchObject({ rounds: 5, roundsDone: 3 });
    expect((await agent.get(`/api/pieces/${ball.id}/progress`)).body.progress).toMatchObject({ round: 3, step: 2 });

    // The undo history moved with the rounds: one undo goes back one step on the same written round.
    const undo = await tap(agent, ball.id, { action: 'undo' });
    expect(undo.body.progress).toMatchObject({ copy: 1, round: 3, step: 1 });
  });

  it('counts the copy as done when the count is past the new last round, and starts the next copy', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball } = await startedPiece(agent, { copies: 2 });
    await tap(agent, ball.id, { action: 'set', to: { copy: 1, round: 3, step: 4 } });
    const res = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Ball', instructions: [rnd1, rnd2].join('\n') }] });
    expect(res.status).toBe(200);
    const piece = res.body.project.pieces[0];
    // Copy 1 done (6 + 6 steps), copy 2 at its start; the Tail left out of the list is removed.
    expect(res.body.project.pieces).toHaveLength(1);
    expect(piece.progress).toMatchObject({ copy: 2, round: 0, step: 0, done: 12 });
    expect(piece.totals).toMatchObject({ rounds: 2, copiesDone: 1, roundsDone: 0 });
  });

  it('marks the last copy done when the count is past the new end, and reopens a done piece when rounds are added after it', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball, tail } = await startedPiece(agent);
    await tap(agent, ball.id, { action: 'set', to: { copy: 1, round: 3, step: 0 } });
    const shorter = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Ball', instructions: [rnd1, rnd2, rnd3].join('\n') }, { id: tail.id, name: 'Tail' }] });
    expect(shorter.body.project.pieces[0].progress).toMatchObject({ copy: 1, round: 3, step: 0, done: 24 });
    expect(shorter.body.project.pieces[0].totals).toMatchObject({ rounds: 3, copiesDone: 1, roundsDone: 3 });

    const longer = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Ball', instructions: fourRounds }, { id: tail.id, name: 'Tail' }] });
    // Rnd 4 is new after the old end: the Tally goes back to it rather than calling it worked.
    expect(longer.body.project.pieces[0].progress).toMatchObject({ copy: 1, round: 3, step: 0, done: 24 });
    expect(longer.body.project.pieces[0].totals).toMatchObject({ rounds: 4, copiesDone: 0, roundsDone: 3 });
  });

  it('leaves the count alone when only the name, hook or yarn change, or a round after it', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball, tail } = await startedPiece(agent);
    const at = (await tap(agent, ball.id, { action: 'set', to: { copy: 1, round: 1, step: 3 } })).body.progress;
    const rename = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Big ball', hookMm: 4, yarns: ['Oat wool'] }, { id: tail.id, name: 'Tail' }] });
    expect(rename.body.project.pieces[0]).toMatchObject({ name: 'Big ball', hookMm: 4, hook: { mm: 4, us: 'G-6' }, yarns: ['Oat wool'] });
    expect(rename.body.project.pieces[0].progress).toEqual(at);
    const later = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Big ball', instructions: fourRounds.replace('(2 sc, inc) x6 (24)', '(3 sc, inc) x6 (30)').replace('Rnd 4', 'Rnd 4') }, { id: tail.id, name: 'Tail' }] });
    // Rnd 4 now has 24 steps instead of 18, but the count sits in Rnd 2: only the stored total could change, and it does not.
    expect(later.body.project.pieces[0].progress).toEqual(at);
  });

  it('reorders pieces by the order sent, keeping each piece its count', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball, tail } = await startedPiece(agent);
    const at = (await tap(agent, ball.id, { action: 'step' })).body.progress;
    const res = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: tail.id, name: 'Tail' }, { id: ball.id, name: 'Ball' }] });
    expect(res.body.project.pieces.map((p: { id: number; position: number }) => [p.id, p.position])).toEqual([
      [tail.id, 0],
      [ball.id, 1],
    ]);
    expect(res.body.project.pieces[1].progress).toEqual(at);
  });

  it('tells an open Tally on another device about the moved count, once the change is saved', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball, tail } = await startedPiece(agent);
    await tap(agent, ball.id, { action: 'set', to: { copy: 1, round: 2, step: 0 } });
    const heard: unknown[] = [];
    const listen = (m: unknown) => heard.push(m);
    hubFor(t.db).on(`piece:${ball.id}`, listen);
    try {
      await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Ball', instructions: [rnd1, 'Rnd 2: sc around (6)', rnd2.replace('Rnd 2', 'Rnd 3'), rnd3.replace('Rnd 3', 'Rnd 4')].join('\n') }, { id: tail.id, name: 'Tail' }] });
    } finally {
      hubFor(t.db).off(`piece:${ball.id}`, listen);
    }
    expect(heard).toEqual([{ type: 'progress', opId: null, progress: expect.objectContaining({ copy: 1, round: 3, step: 0 }) }]);
  });

  it('refuses fewer copies than the copy being worked with a sentence to act on, and writes nothing', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball, tail } = await startedPiece(agent, { copies: 2 });
    const at = (await tap(agent, ball.id, { action: 'set', to: { copy: 2, round: 1, step: 0 } })).body.progress;
    const res = await agent.patch(`/api/projects/${projectId}`).send({
      title: 'Renamed too',
      pieces: [{ id: ball.id, name: 'Ball', copies: 1, instructions: rnd1 }, { id: tail.id, name: 'Tail' }],
    });
    expect(res.status).toBe(422);
    expect(res.body.error).toBe('Ball is counted up to copy 2 in the Tally, so it needs at least 2 copies. To make fewer, first go back to an earlier copy with “Jump to a round” in the Tally.');
    expect(res.body.issues).toEqual([{ path: 'pieces.0.copies', message: res.body.error }]);
    const after = (await agent.get(`/api/projects/${projectId}`)).body.project;
    expect(after.title).toBe('A ball for the cat');
    expect(after.pieces[0]).toMatchObject({ copies: 2, instructions: fourRounds, progress: at });

    // Back on copy 1, one copy is fine.
    await tap(agent, ball.id, { action: 'set', to: { copy: 1, round: 1, step: 0 } });
    const ok = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Ball', copies: 1 }, { id: tail.id, name: 'Tail' }] });
    expect(ok.status).toBe(200);
    expect(ok.body.project.pieces[0]).toMatchObject({ copies: 1, progress: { copy: 1, round: 1, step: 0 } });
  });

  it('refuses fewer copies than a placement was recorded on', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball, tail } = await startedPiece(agent, { copies: 3 });
    expect((await agent.post(`/api/pieces/${ball.id}/placements`).send({ copy: 3, round: 2, label: 'left eye' })).status).toBe(201);
    const res = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Ball', copies: 2 }, { id: tail.id, name: 'Tail' }] });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/^Ball has a placement recorded on copy 3, so it needs at least 3 copies\. To make fewer, remove that placement in the Tally first\.$/);
    expect(res.body.issues[0].path).toBe('pieces.0.copies');
  });

  it('reads the count again when the project switches terms, and leaves it where the rounds are the same', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(
      buildProjectInput({ terms: 'uk', pieces: [{ name: 'Ball', instructions: ['Rnd 1: 6 dc in MR (6)', 'Rnd 2: 2 dc in each st (12)'].join('\n') }] }),
    );
    const piece = body.project.pieces[0];
    const at = (await tap(agent, piece.id, { action: 'set', to: { copy: 1, round: 1, step: 2 } })).body.progress;
    const res = await agent.patch(`/api/projects/${body.project.id}`).send({ terms: 'us' });
    expect(res.status).toBe(200);
    expect(res.body.project.terms).toBe('us');
    expect((await agent.get(`/api/pieces/${piece.id}/progress`)).body.progress).toEqual(at);
  });
});

describe('PATCH /api/projects/:id pieces with bad input', () => {
  it('answers 422 with a plain sentence at each bad field', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball } = await startedPiece(agent);
    for (const [piece, path, message] of [
      [{ id: ball.id, name: '' }, 'pieces.0.name', 'Give the piece a name, like "Body" or "Ear".'],
      [{ id: ball.id, name: 'Ball', copies: 0 }, 'pieces.0.copies', 'Make at least 1.'],
      [{ id: ball.id, name: 'Ball', copies: 2.5 }, 'pieces.0.copies', 'How many to make is a whole number.'],
      [{ id: ball.id, name: 'Ball', hookMm: 'big' }, 'pieces.0.hookMm', 'Give the hook in millimetres, like 3.5.'],
      [{ id: ball.id, name: 'Ball', hookMm: 40 }, 'pieces.0.hookMm', 'A hook is at most 35 mm.'],
      [{ id: ball.id, name: 'Ball', yarns: [' '] }, 'pieces.0.yarns.0', 'A yarn needs a name.'],
      [{ id: ball.id, name: 'Ball', instructions: 'x'.repeat(20_001) }, 'pieces.0.instructions', 'Instructions are limited to 20,000 characters per piece.'],
      [{ id: -3, name: 'Ball' }, 'pieces.0.id', null],
    ] as const) {
      const res = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [piece] });
      expect(res.status, JSON.stringify(piece).slice(0, 80)).toBe(422);
      const issue = res.body.issues.find((i: { path: string }) => i.path === path);
      expect(issue, path).toBeTruthy();
      if (message) expect(issue.message).toBe(message);
    }
    // Nothing was written by any of them.
    expect((await agent.get(`/api/projects/${projectId}`)).body.project.pieces.map((p: { name: string }) => p.name)).toEqual(['Ball', 'Tail']);
  });

  it('refuses the same piece twice in one list', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { projectId, ball } = await startedPiece(agent);
    const res = await agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Ball' }, { id: ball.id, name: 'Ball again' }] });
    expect(res.status).toBe(422);
    expect(res.body.issues[0].path).toBe('pieces.1.id');
  });

  it("is a 404 for another member's project, and their piece's count stays", async () => {
    const owner = await signedInAgent(t.app, t.db);
    const { projectId, ball } = await startedPiece(owner.agent);
    const at = (await tap(owner.agent, ball.id, { action: 'step' })).body.progress;
    const other = await signedInAgent(t.app, t.db);
    const res = await other.agent.patch(`/api/projects/${projectId}`).send({ pieces: [{ id: ball.id, name: 'Mine now', instructions: '' }] });
    expect(res.status).toBe(404);
    expect((await owner.agent.get(`/api/pieces/${ball.id}/progress`)).body.progress).toEqual(at);
    expect((await request(t.app).patch(`/api/projects/${projectId}`).send({ pieces: [] })).status).toBe(401);
  });
});
