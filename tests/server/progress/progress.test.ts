import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { ballTop, createTallyProject, newOpId } from '../../factories/progress.js';
import { checkPiece } from '../../../src/engine/index.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

// What the server must walk: the engine's own steps for the piece (a round it cannot split counts as one step).
const stepsOf = (text: string) => checkPiece(text).rounds.map((r) => Math.max(1, r.steps.length));
const ball = stepsOf(ballTop);
const perCopy = ball.reduce((a, b) => a + b, 0);

/** Where n taps from the start of the ball land, counted out by hand for the test. */
function positionAfter(n: number) {
  let round = 0;
  while (round < ball.length - 1 && n >= ball[round]) {
    n -= ball[round];
    round += 1;
  }
  return { copy: 1, round, step: n };
}

async function maker(pieces?: Parameters<typeof createTallyProject>[2]) {
  const { agent, user } = await signedInAgent(t.app, t.db);
  const { projectId, pieceIds } = await createTallyProject(t.db, user.id, pieces);
  const url = `/api/pieces/${pieceIds[0]}/progress`;
  const post = (body: Record<string, unknown>) => agent.post(url).send({ opId: newOpId(), ...body });
  return { agent, user, projectId, pieceId: pieceIds[0], url, post };
}

describe('the engine gives the ball enough steps to test with', () => {
  it('has three rounds and more than one step in the later ones', () => {
    expect(ball).toHaveLength(3);
    // Source: common practice — "inc x6" is six increases, each worked into one stitch.
    expect(ball[1]).toBeGreaterThanOrEqual(6);
  });
});

describe('GET /api/pieces/:pieceId/progress', () => {
  it('starts a new piece at copy 1, round index 0, step 0 with nothing done', async () => {
    const m = await maker();
    const res = await m.agent.get(m.url);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      progress: { copy: 1, round: 0, step: 0, done: 0, version: 0, updatedAt: null },
    });
  });
});

describe('POST /api/pieces/:pieceId/progress: step', () => {
  it('walks every step of every round in order, rolling over to the next round', async () => {
    const m = await maker();
    let done = 0;
    for (let r = 0; r < ball.length; r += 1) {
      for (let s = 0; s < ball[r]; s += 1) {
        const res = await m.post({ action: 'step', at: new Date().toISOString() });
        expect(res.status).toBe(200);
        done += 1;
        // The last step of the last round moves the Tally past the end: round index = number of rounds.
        const expected = s === ball[r] - 1 ? { round: r + 1, step: 0 } : { round: r, step: s + 1 };
        expect(res.body.progress).toMatchObject({ copy: 1, ...expected, done, version: done });
        expect(typeof res.body.progress.updatedAt).toBe('string');
      }
    }
    expect(done).toBe(perCopy);
    const again = await m.agent.get(m.url);
    expect(again.body.progress).toMatchObject({ copy: 1, round: ball.length, step: 0, done: perCopy });
  });

  it('keeps the event log: one row per applied tap with the position before and after', async () => {
    const m = await maker();
    await m.post({ action: 'step' });
    await m.post({ action: 'step' });
    const events = await t.db('progress_events').where({ piece_id: m.pieceId }).orderBy('id');
    expect(events.map((e) => e.action)).toEqual(['step', 'step']);
    expect(JSON.parse(events[0].before)).toEqual(positionAfter(0));
    expect(JSON.parse(events[1].before)).toEqual(positionAfter(1));
    expect(JSON.parse(events[1].after)).toEqual(positionAfter(2));
  });
});

describe('exactly once', () => {
  it('applies a retried opId once and answers the retry with the current position', async () => {
    const m = await maker();
    const opId = newOpId();
    const first = await m.agent.post(m.url).send({ opId, action: 'step' });
    const second = await m.agent.post(m.url).send({ opId, action: 'step' });
    const third = await m.agent.post(m.url).send({ opId, action: 'step' });
    expect(first.status).toBe(200);
    expect(second.status).toBe(200);
    expect(third.status).toBe(200);
    expect(second.body.progress).toEqual(first.body.progress);
    expect(third.body.progress).toMatchObject({ done: 1, version: 1 });
    expect(await t.db('progress_events').where({ piece_id: m.pieceId }).count({ n: '*' }).first()).toEqual({
      n: 1,
    });
  });

  it('answers a retry with the current position even after later taps', async () => {
    const m = await maker();
    const opId = newOpId();
    await m.agent.post(m.url).send({ opId, action: 'step' });
    await m.post({ action: 'step' });
    const retry = await m.agent.post(m.url).send({ opId, action: 'step' });
    expect(retry.body.progress).toMatchObject({ done: 2, version: 2 });
  });

  it('applies twenty concurrent copies of one opId once', async () => {
    const m = await maker();
    const opId = newOpId();
    const answers = await Promise.all(
      Array.from({ length: 20 }, () => m.agent.post(m.url).send({ opId, action: 'step' })),
    );
    expect(answers.map((a) => a.status)).toEqual(Array(20).fill(200));
    for (const a of answers) expect(a.body.progress.done).toBe(1);
    const now = await m.agent.get(m.url);
    expect(now.body.progress).toMatchObject({ done: 1, version: 1 });
  });

  it('applies concurrent distinct taps each once, in the order the server takes them', async () => {
    const m = await maker();
    const n = perCopy - 1;
    const answers = await Promise.all(Array.from({ length: n }, () => m.post({ action: 'step' })));
    expect(answers.every((a) => a.status === 200)).toBe(true);
    const versions = answers.map((a) => a.body.progress.version).sort((a, b) => a - b);
    expect(versions).toEqual(Array.from({ length: n }, (_, i) => i + 1));
    expect((await m.agent.get(m.url)).body.progress.done).toBe(n);
  });
});

describe('undo', () => {
  it('goes back across a round boundary', async () => {
    const m = await maker();
    for (let i = 0; i < ball[0]; i += 1) await m.post({ action: 'step' });
    expect((await m.agent.get(m.url)).body.progress).toMatchObject({ round: 1, step: 0, done: ball[0] });
    const undo = await m.post({ action: 'undo' });
    expect(undo.status).toBe(200);
    expect(undo.body.progress).toMatchObject({
      copy: 1,
      round: 0,
      step: ball[0] - 1,
      done: ball[0] - 1,
      version: ball[0] + 1,
    });
  });

  it('goes back across a copy boundary', async () => {
    const m = await maker([{ name: 'Ear', instructions: ballTop, copies: 2 }]);
    const r = await m.post({
      action: 'set',
      to: { copy: 1, round: ball.length - 1, step: ball.at(-1)! - 1 },
    });
    expect(r.body.progress).toMatchObject({ copy: 1, round: ball.length - 1 });
    const last = await m.post({ action: 'step' });
    expect(last.body.progress).toMatchObject({ copy: 2, round: 0, step: 0, done: perCopy });
    const undo = await m.post({ action: 'undo' });
    expect(undo.body.progress).toMatchObject({
      copy: 1,
      round: ball.length - 1,
      step: ball.at(-1)! - 1,
      done: perCopy - 1,
    });
  });

  it('reverts the most recent event still counting, one after another, and never an undo itself', async () => {
    const m = await maker();
    await m.post({ action: 'step' }); // → step 1
    await m.post({ action: 'round' }); // → round 1
    await m.post({ action: 'step' }); // → round 1 step 1
    expect((await m.post({ action: 'undo' })).body.progress).toMatchObject({ round: 1, step: 0 });
    expect((await m.post({ action: 'undo' })).body.progress).toMatchObject({ round: 0, step: 1 });
    expect((await m.post({ action: 'undo' })).body.progress).toMatchObject({ round: 0, step: 0, done: 0 });
    const none = await m.post({ action: 'undo' });
    expect(none.status).toBe(409);
    expect(none.body.error).toMatch(/nothing to undo/i);
  });

  it('undoes a jump back to where the jump started', async () => {
    const m = await maker();
    await m.post({ action: 'step' });
    await m.post({ action: 'set', to: { copy: 1, round: 2, step: 3 } });
    expect((await m.post({ action: 'undo' })).body.progress).toMatchObject({ round: 0, step: 1, done: 1 });
  });

  it('applies a retried undo once', async () => {
    const m = await maker();
    await m.post({ action: 'step' });
    await m.post({ action: 'step' });
    const opId = newOpId();
    await m.agent.post(m.url).send({ opId, action: 'undo' });
    const again = await m.agent.post(m.url).send({ opId, action: 'undo' });
    expect(again.body.progress).toMatchObject({ done: 1, version: 3 });
  });

  it('offers the undo stack for an offline device, newest last', async () => {
    const m = await maker();
    await m.post({ action: 'step' });
    await m.post({ action: 'round' });
    await m.post({ action: 'step' });
    await m.post({ action: 'undo' });
    const res = await m.agent.get(`${m.url}/history`);
    expect(res.status).toBe(200);
    expect(res.body).toEqual({
      version: 4,
      undo: [
        { copy: 1, round: 0, step: 0 },
        { copy: 1, round: 0, step: 1 },
      ],
    });
  });
});

describe('round and set', () => {
  it('"round" finishes the rest of the round and starts the next', async () => {
    const m = await maker();
    await m.post({ action: 'step' });
    const res = await m.post({ action: 'round' });
    expect(res.status).toBe(200);
    expect(res.body.progress).toMatchObject({ copy: 1, round: 1, step: 0, done: ball[0], version: 2 });
  });

  it('"set" jumps to any round or copy and works out what is done', async () => {
    const m = await maker([{ name: 'Ear', instructions: ballTop, copies: 3 }]);
    const res = await m.post({ action: 'set', to: { copy: 2, round: 1, step: 2 } });
    expect(res.status).toBe(200);
    expect(res.body.progress).toMatchObject({ copy: 2, round: 1, step: 2, done: perCopy + ball[0] + 2 });
    const stored = await t.db('piece_progress').where({ piece_id: m.pieceId }).first();
    expect(stored).toMatchObject({ copy: 2, round: 1, step: 2, done: perCopy + ball[0] + 2, version: 1 });
  });

  it('"set" to the end of a round lands at the start of the next', async () => {
    const m = await maker();
    const res = await m.post({ action: 'set', to: { copy: 1, round: 0, step: ball[0] } });
    expect(res.body.progress).toMatchObject({ round: 1, step: 0 });
  });

  it('refuses a "set" outside the piece with a sentence', async () => {
    const m = await maker();
    const copy = await m.post({ action: 'set', to: { copy: 2, round: 0, step: 0 } });
    expect(copy.status).toBe(422);
    expect(copy.body.error).toMatch(/made once, so there is no copy 2/);
    const round = await m.post({ action: 'set', to: { copy: 1, round: 3, step: 0 } });
    expect(round.status).toBe(422);
    expect(round.body.error).toMatch(/3 rounds/);
    const step = await m.post({ action: 'set', to: { copy: 1, round: 1, step: ball[1] + 1 } });
    expect(step.status).toBe(422);
    expect(step.body.error).toMatch(/Rnd 2 has/);
    expect((await m.agent.get(m.url)).body.progress.version).toBe(0);
  });
});

describe('the end of the piece', () => {
  it('answers 409 with a sentence past the last step of the last copy, and changes nothing', async () => {
    const m = await maker([{ name: 'Ear', instructions: ballTop, copies: 2 }]);
    await m.post({ action: 'set', to: { copy: 2, round: ball.length - 1, step: ball.at(-1)! - 1 } });
    const last = await m.post({ action: 'step' });
    expect(last.status).toBe(200);
    expect(last.body.progress).toMatchObject({ copy: 2, round: ball.length, step: 0, done: 2 * perCopy });
    const past = await m.post({ action: 'step' });
    expect(past.status).toBe(409);
    expect(past.body.error).toMatch(/last stitch of its last copy/);
    const round = await m.post({ action: 'round' });
    expect(round.status).toBe(409);
    expect((await m.agent.get(m.url)).body.progress).toMatchObject({ done: 2 * perCopy, version: 2 });
    // Undo from the end goes back to the last stitch.
    expect((await m.post({ action: 'undo' })).body.progress).toMatchObject({
      copy: 2,
      round: ball.length - 1,
      step: ball.at(-1)! - 1,
    });
    // A refused tap is not kept, so a retry is refused the same way rather than counted later.
    expect(await t.db('progress_events').where({ piece_id: m.pieceId }).count({ n: '*' }).first()).toEqual({
      n: 3,
    });
  });

  it('answers 409 for a piece with no rounds yet', async () => {
    const m = await maker([{ name: 'Scarf', instructions: '' }]);
    const res = await m.post({ action: 'step' });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/no rounds to count yet/);
  });
});

describe('isolation between members', () => {
  it('answers 404 for another member’s piece and leaves it alone', async () => {
    const owner = await maker();
    await owner.post({ action: 'step' });
    const { agent: other } = await signedInAgent(t.app, t.db);
    const get = await other.get(owner.url);
    expect(get.status).toBe(404);
    expect(get.body.error).toBe('That piece could not be found.');
    const post = await other.post(owner.url).send({ opId: newOpId(), action: 'step' });
    expect(post.status).toBe(404);
    expect((await other.get(`${owner.url}/history`)).status).toBe(404);
    expect((await other.get(`/api/pieces/${owner.pieceId}/placements`)).status).toBe(404);
    expect(
      (await other.post(`/api/pieces/${owner.pieceId}/placements`).send({ round: 1, label: 'nose' })).status,
    ).toBe(404);
    expect((await owner.agent.get(owner.url)).body.progress).toMatchObject({ done: 1, version: 1 });
  });

  it('keeps the same opId on two pieces apart', async () => {
    const a = await maker();
    const b = await maker();
    const opId = newOpId();
    await a.agent.post(a.url).send({ opId, action: 'step' });
    const res = await b.agent.post(b.url).send({ opId, action: 'step' });
    expect(res.body.progress.done).toBe(1);
  });

  it('asks a signed-out visitor to sign in', async () => {
    const m = await maker();
    const res = await request(t.app).get(m.url);
    expect(res.status).toBe(401);
    expect((await request(t.app).post(m.url).send({ opId: newOpId(), action: 'step' })).status).toBe(401);
  });
});

describe('bad input', () => {
  it.each([
    [
      'an unknown action',
      { opId: 'op-12345678', action: 'skip' },
      /action is one of step, undo, round or set/,
    ],
    ['no opId', { action: 'step' }, /opId/],
    ['a short opId', { opId: 'x', action: 'step' }, /opId is at least 8/],
    [
      'an opId with odd characters',
      { opId: '<script>alert(1)</script>', action: 'step' },
      /opId uses letters/,
    ],
    ['a set without a position', { opId: 'op-12345678', action: 'set' }, /needs to/],
    [
      'a step with a position',
      { opId: 'op-12345678', action: 'step', to: { copy: 1, round: 0, step: 0 } },
      /Only a "set"/,
    ],
    [
      'a position with a negative round',
      { opId: 'op-12345678', action: 'set', to: { copy: 1, round: -1, step: 0 } },
      /0-based/,
    ],
    [
      'a fractional step',
      { opId: 'op-12345678', action: 'set', to: { copy: 1, round: 0, step: 1.5 } },
      /step/,
    ],
    [
      'a tap time that is not a date',
      { opId: 'op-12345678', action: 'step', at: 'yesterday' },
      /ISO date-time/,
    ],
    ['an extra field', { opId: 'op-12345678', action: 'step', count: 5 }, /count|Unrecognized/i],
  ])('answers 422 for %s', async (_name, body, message) => {
    const m = await maker();
    const res = await m.agent.post(m.url).send(body);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(message);
    expect(Array.isArray(res.body.issues)).toBe(true);
    expect((await m.agent.get(m.url)).body.progress.version).toBe(0);
  });

  it('answers 400 for a body that is not JSON', async () => {
    const m = await maker();
    const res = await m.agent.post(m.url).set('Content-Type', 'application/json').send('{"opId":');
    expect(res.status).toBe(400);
  });

  it('answers 422 for a piece id that is not a number and 404 for one that does not exist', async () => {
    const m = await maker();
    expect((await m.agent.get('/api/pieces/abc/progress')).status).toBe(422);
    expect((await m.agent.get('/api/pieces/999999/progress')).status).toBe(404);
  });
});
