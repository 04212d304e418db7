import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { DEMO_ADMIN, DEMO_MAKER, seedDemo } from '../../../server/services/demo.js';
import { demoPattern } from '../../../server/services/demo-pattern.js';
import { checkPiece } from '../../../src/engine/index.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext({ SEED_DEMO: 'true' });
  await seedDemo(t.db);
});
afterAll(() => t.close());

describe('the demo', () => {
  it('has every stated count right in every piece of the demo pattern', () => {
    for (const piece of demoPattern.pieces) {
      const check = checkPiece(piece.instructions, { terms: demoPattern.terms });
      expect(check.rounds.length, piece.name).toBeGreaterThan(0);
      for (const round of check.rounds) {
        expect(round.problems, `${piece.name} ${round.label}`).toEqual([]);
        expect(round.stated, `${piece.name} ${round.label} states its count`).toBe(round.stitches);
      }
    }
  });

  it('body grows by 6 a round to 36 and closes back to 6 (sphere, common practice)', () => {
    const body = checkPiece(demoPattern.pieces[0].instructions);
    expect(body.rounds.slice(0, 6).map((r) => r.stitches)).toEqual([6, 12, 18, 24, 30, 36]);
    expect(body.rounds.slice(-5).map((r) => r.stitches)).toEqual([30, 24, 18, 12, 6]);
  });

  it('lets the demo maker and the admin sign in through the API', async () => {
    const maker = await request(t.app).post('/api/auth/signin').send({ email: DEMO_MAKER.email, password: DEMO_MAKER.password });
    expect(maker.status).toBe(200);
    expect(maker.body.user.role).toBe('member');
    const admin = await request(t.app).post('/api/auth/signin').send({ email: DEMO_ADMIN.email, password: DEMO_ADMIN.password });
    expect(admin.status).toBe(200);
    expect(admin.body.user.role).toBe('admin');
  });

  it("gives the demo maker a hook roll with the body's 3.5 mm hook but not the stalk's 2.5 mm, so both states show", async () => {
    const agent = request.agent(t.app);
    await agent.post('/api/auth/signin').send({ email: DEMO_MAKER.email, password: DEMO_MAKER.password }).expect(200);
    const sizes = (await agent.get('/api/hooks')).body.hooks.map((h: { mm: number }) => h.mm);
    const pieces = demoPattern.pieces.map((p) => [p.name, p.hookMm] as const);
    expect(pieces.filter(([, mm]) => sizes.includes(mm)).map(([n]) => n)).toEqual(expect.arrayContaining(['Body']));
    expect(pieces.filter(([, mm]) => !sizes.includes(mm)).map(([n]) => n)).toEqual(['Stalk']);
  });

  it('offers the demo account on the sign-in page only while running with demo data', async () => {
    const res = await request(t.app).get('/api/auth/demo');
    expect(res.body.demo).toEqual({ email: DEMO_MAKER.email, password: DEMO_MAKER.password });
    const plain = await createTestContext({ SEED_DEMO: 'false' });
    try {
      expect((await request(plain.app).get('/api/auth/demo')).body.demo).toBeNull();
    } finally {
      await plain.close();
    }
  });

  it('seeds only into an empty database', async () => {
    expect(await seedDemo(t.db)).toBe(false);
    const { count } = (await t.db('users').count({ count: '*' }).first()) as { count: number };
    expect(Number(count)).toBe(2);
  });
});
