import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { seedDemo, DEMO_MAKER } from '../../../server/services/demo.js';
import { demoPattern } from '../../../server/services/demo-pattern.js';
import { checkPiece } from '../../../src/engine/index.js';
import { newOpId } from '../../factories/progress.js';
import request from 'supertest';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
  await seedDemo(t.db);
});
afterAll(() => t.close());

describe('the demo', () => {
  it('opens the Body mid-piece at Rnd 10 with the eye spots marked, and counts on from there', async () => {
    const agent = request.agent(t.app);
    await agent
      .post('/api/auth/signin')
      .send({ email: DEMO_MAKER.email, password: DEMO_MAKER.password })
      .expect(200);
    const body = await t.db('project_pieces').where({ name: 'Body' }).first();
    const rounds = checkPiece(demoPattern.pieces[0].instructions).rounds;
    expect(rounds[9].number).toBe(10);
    const before = rounds.slice(0, 9).reduce((a, r) => a + r.steps.length, 0);

    const res = await agent.get(`/api/pieces/${body.id}/progress`);
    expect(res.body.progress).toMatchObject({ copy: 1, round: 9, step: 9, done: before + 9 });
    const marks = await agent.get(`/api/pieces/${body.id}/placements`);
    expect(marks.body.placements.map((p: { label: string; round: number }) => [p.label, p.round])).toEqual([
      ['left eye', 9],
      ['right eye', 9],
    ]);
    // Nothing to undo in a seeded position: the history starts with the maker's own taps.
    expect(
      (await agent.post(`/api/pieces/${body.id}/progress`).send({ opId: newOpId(), action: 'undo' })).status,
    ).toBe(409);
    expect(
      (await agent.post(`/api/pieces/${body.id}/progress`).send({ opId: newOpId(), action: 'step' })).body
        .progress,
    ).toMatchObject({ step: 10, done: before + 10 });
  });
});
