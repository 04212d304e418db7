import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app';
import { signedInAgent } from '../../factories/users';

let t: TestContext;
beforeEach(async () => {
  t = await createTestContext();
});
afterEach(async () => {
  await t.close();
});

const bamboo = { mm: 3.5, material: 'bamboo', brand: 'Fernside', note: 'The one with the chipped thumb rest', quantity: 2 };

describe('the hook roll', () => {
  it('adds, lists, changes and removes a hook', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const created = await agent.post('/api/hooks').send(bamboo);
    expect(created.status).toBe(201);
    const { hook } = created.body;
    expect(hook).toEqual({ id: expect.any(Number), ...bamboo, us: 'E-4', createdAt: expect.any(String), updatedAt: expect.any(String) });

    const list = await agent.get('/api/hooks');
    expect(list.status).toBe(200);
    expect(list.body.hooks).toEqual([hook]);

    const changed = await agent.patch(`/api/hooks/${hook.id}`).send({ mm: 2.75, brand: null, quantity: 1 });
    expect(changed.status).toBe(200);
    expect(changed.body.hook).toMatchObject({ id: hook.id, mm: 2.75, us: 'C-2', brand: null, quantity: 1, material: 'bamboo', note: bamboo.note });
    expect(changed.body.hook.updatedAt > hook.updatedAt).toBe(true);
    expect((await agent.get('/api/hooks')).body.hooks[0].mm).toBe(2.75);

    expect((await agent.delete(`/api/hooks/${hook.id}`)).status).toBe(204);
    expect((await agent.get('/api/hooks')).body.hooks).toEqual([]);
    const again = await agent.delete(`/api/hooks/${hook.id}`);
    expect(again.status).toBe(404);
    expect(again.body.error).toBe('That hook could not be found.');
  });

  it('keeps how many at 1 when not given, leaves material and brand empty, and lists the smallest hook first', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    for (const mm of [5, 2.25, 12, 3.5]) expect((await agent.post('/api/hooks').send({ mm })).status).toBe(201);
    const { body } = await agent.get('/api/hooks');
    expect(body.hooks.map((h: { mm: number }) => h.mm)).toEqual([2.25, 3.5, 5, 12]);
    expect(body.hooks[0]).toMatchObject({ quantity: 1, material: null, brand: null, note: null });
  });

  // Source: Craft Yarn Council "Getting Started" hook chart (media.craftyarncouncil.com, getting_started.php3) for
  // 2.25 mm = B-1 and 19 mm = S; the other rows as the conversion charts S9, S10 and S13 of
  // /work/shared/reference/standards.md §2 print them (they agree with each other on these rows).
  const chart: Array<[number, string]> = [
    [2.25, 'B-1'],
    [2.75, 'C-2'],
    [3.25, 'D-3'],
    [3.5, 'E-4'],
    [3.75, 'F-5'],
    [4, 'G-6'],
    [4.5, '7'],
    [5, 'H-8'],
    [5.5, 'I-9'],
    [6, 'J-10'],
    [6.5, 'K-10½'],
    [8, 'L-11'],
    [19, 'S'],
  ];
  it('names each hook by its US size on the chart', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    for (const [mm] of chart) await agent.post('/api/hooks').send({ mm });
    const { body } = await agent.get('/api/hooks');
    expect(body.hooks.map((h: { mm: number; us: string }) => [h.mm, h.us])).toEqual(chart);
  });

  it('keeps sizes the chart does not name, in mm only', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    // 2.5, 3 and 7 mm are sold in metric but have no US letter on the chart; 1.25 mm is a thread (steel) size.
    for (const mm of [2.5, 3, 7, 1.25]) {
      const res = await agent.post('/api/hooks').send({ mm, material: mm < 2 ? 'steel' : 'aluminium' });
      expect(res.status).toBe(201);
      expect(res.body.hook).toMatchObject({ mm, us: null });
    }
  });

  it("keeps each member's hooks to themselves", async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/hooks').send(bamboo);
    expect((await other.get('/api/hooks')).body.hooks).toEqual([]);
    for (const res of [await other.patch(`/api/hooks/${body.hook.id}`).send({ quantity: 9 }), await other.delete(`/api/hooks/${body.hook.id}`)]) {
      expect(res.status).toBe(404);
      expect(res.body.error).toBe('That hook could not be found.');
    }
    expect((await agent.get('/api/hooks')).body.hooks).toEqual([body.hook]);
  });

  it('asks signed-out visitors to sign in', async () => {
    const anon = request(t.app);
    for (const res of [await anon.get('/api/hooks'), await anon.post('/api/hooks').send(bamboo), await anon.patch('/api/hooks/1').send({ mm: 4 }), await anon.delete('/api/hooks/1')]) {
      expect(res.status).toBe(401);
      expect(res.body.error).toEqual(expect.any(String));
    }
  });

  it('refuses changes sent from another site', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/hooks').send(bamboo);
    const foreign = 'https://elsewhere.example';
    for (const res of [
      await agent.post('/api/hooks').set('Origin', foreign).send({ mm: 4 }),
      await agent.patch(`/api/hooks/${body.hook.id}`).set('Origin', foreign).send({ quantity: 5 }),
      await agent.delete(`/api/hooks/${body.hook.id}`).set('Origin', foreign),
    ]) {
      expect(res.status).toBe(403);
      expect(res.body.error).toMatch(/another site/);
    }
    expect((await agent.get('/api/hooks')).body.hooks).toEqual([body.hook]);
  });

  const bad: Array<[string, object, string]> = [
    ['no size', { material: 'wood' }, 'mm'],
    ['a size as text', { mm: '3.5 mm' }, 'mm'],
    ['0.25 mm (below 0.5 mm)', { mm: 0.25 }, 'mm'],
    ['40 mm (above 35 mm)', { mm: 40 }, 'mm'],
    ['three decimals', { mm: 3.125 }, 'mm'],
    ['an unknown material', { mm: 4, material: 'glass' }, 'material'],
    ['none of them', { mm: 4, quantity: 0 }, 'quantity'],
    ['half a hook', { mm: 4, quantity: 1.5 }, 'quantity'],
    ['a very long brand', { mm: 4, brand: 'x'.repeat(81) }, 'brand'],
    ['an unknown field', { mm: 4, ownerId: 'someone' }, ''],
  ];
  it.each(bad)('answers 422 with a sentence for %s', async (_n, send, issuePath) => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/hooks').send(send);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/^Please check the form: .+\.$/);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(issuePath);
    expect(await t.db('hooks').count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('answers 422 for empty or bad changes and bad ids, and changes nothing', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/hooks').send(bamboo);
    expect((await agent.patch(`/api/hooks/${body.hook.id}`).send({})).status).toBe(422);
    expect((await agent.patch(`/api/hooks/${body.hook.id}`).send({ mm: 0 })).status).toBe(422);
    expect((await agent.patch('/api/hooks/zero').send({ mm: 4 })).status).toBe(422);
    expect((await agent.delete('/api/hooks/0')).status).toBe(422);
    expect((await agent.get('/api/hooks')).body.hooks).toEqual([body.hook]);
  });
});
