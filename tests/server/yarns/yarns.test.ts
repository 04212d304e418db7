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

const plum = { name: 'Plum cotton', colour: 'plum', fibre: 'cotton', weight: 3, ply: '8 ply', metersPerSkein: 125, yardsPerSkein: 137, skeinsOwned: 3, notes: 'From the autumn fair' };

describe('the yarn shelf', () => {
  it('adds, lists, changes and removes a yarn', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const created = await agent.post('/api/yarns').send(plum);
    expect(created.status).toBe(201);
    const { yarn } = created.body;
    expect(yarn).toEqual({ id: expect.any(Number), ...plum, metersUsed: 0, metersLeft: 375, yardsLeft: 410.1, notes: 'From the autumn fair' });

    const list = await agent.get('/api/yarns');
    expect(list.status).toBe(200);
    expect(list.body.yarns).toEqual([yarn]);

    const changed = await agent.patch(`/api/yarns/${yarn.id}`).send({ skeinsOwned: 2.5, colour: null });
    expect(changed.status).toBe(200);
    expect(changed.body.yarn).toMatchObject({ skeinsOwned: 2.5, metersLeft: 312.5, name: 'Plum cotton' });
    expect(changed.body.yarn.colour).toBeUndefined();
    expect((await agent.get(`/api/yarns/${yarn.id}`)).body.yarn.skeinsOwned).toBe(2.5);

    expect((await agent.delete(`/api/yarns/${yarn.id}`)).status).toBe(204);
    expect((await agent.get('/api/yarns')).body.yarns).toEqual([]);
    expect((await agent.delete(`/api/yarns/${yarn.id}`)).status).toBe(404);
  });

  it('keeps skeins owned at 1 when not given, and lists by name', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    await agent.post('/api/yarns').send({ name: 'Wool, undyed' });
    await agent.post('/api/yarns').send({ name: 'Acrylic, red', yardsPerSkein: 100 });
    const { body } = await agent.get('/api/yarns');
    expect(body.yarns.map((y: { name: string }) => y.name)).toEqual(['Acrylic, red', 'Wool, undyed']);
    expect(body.yarns[1]).toMatchObject({ skeinsOwned: 1, metersLeft: null, yardsLeft: null });
    // Only yards known: 100 yd × 0.9144 m/yd (international yard) = 91.44 m.
    expect(body.yarns[0]).toMatchObject({ metersLeft: 91.4, yardsLeft: 100 });
  });

  it("subtracts what the member's projects used, but not a frogged project's or another member's", async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/yarns').send(plum);
    const id = body.yarn.id;
    const uses = (materials: object) => ({ title: 'Use', materials });
    await agent.post('/api/projects').send(uses({ yarns: [{ name: 'Plum cotton', shelfYarnId: id, metersUsed: 100 }] }));
    // Counted in skeins: one skein is 125 m on the shelf.
    await agent.post('/api/projects').send(uses({ yarns: [{ name: 'Plum cotton', shelfYarnId: id, skeinsUsed: 1 }] }));
    await agent.post('/api/projects').send({ ...uses({ yarns: [{ name: 'Plum cotton', shelfYarnId: id, metersUsed: 90 }] }), status: 'frogged' });
    // Named but with no amount yet: nothing subtracted.
    await agent.post('/api/projects').send(uses({ yarns: [{ name: 'Plum cotton', shelfYarnId: id }] }));
    // Someone else's project cannot even name it.
    expect((await other.post('/api/projects').send(uses({ yarns: [{ name: 'x', shelfYarnId: id, metersUsed: 300 }] }))).status).toBe(422);

    const { body: after } = await agent.get(`/api/yarns/${id}`);
    // 3 × 125 = 375 m owned; 100 + 125 used; 150 m left = 164.0 yd (150 ÷ 0.9144).
    expect(after.yarn).toMatchObject({ metersUsed: 225, metersLeft: 150, yardsLeft: 164 });

    await agent.post('/api/projects').send(uses({ yarns: [{ name: 'Plum cotton', shelfYarnId: id, metersUsed: 500 }] }));
    expect((await agent.get(`/api/yarns/${id}`)).body.yarn.metersLeft).toBe(0);
  });

  it("keeps each member's shelf to themselves", async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/yarns').send(plum);
    expect((await other.get('/api/yarns')).body.yarns).toEqual([]);
    for (const res of [
      await other.get(`/api/yarns/${body.yarn.id}`),
      await other.patch(`/api/yarns/${body.yarn.id}`).send({ skeinsOwned: 0 }),
      await other.delete(`/api/yarns/${body.yarn.id}`),
    ]) {
      expect(res.status).toBe(404);
      expect(res.body.error).toBe('That yarn could not be found.');
    }
    expect((await agent.get(`/api/yarns/${body.yarn.id}`)).body.yarn.skeinsOwned).toBe(3);
  });

  it('asks signed-out visitors to sign in', async () => {
    const anon = request(t.app);
    for (const res of [await anon.get('/api/yarns'), await anon.post('/api/yarns').send(plum), await anon.patch('/api/yarns/1').send({ name: 'x' }), await anon.delete('/api/yarns/1')]) {
      expect(res.status).toBe(401);
    }
  });

  const bad: Array<[string, object, string]> = [
    ['no name', { skeinsOwned: 1 }, 'name'],
    ['weight 8 (CYC categories are 0–7)', { name: 'x', weight: 8 }, 'weight'],
    ['a weight of 2.5', { name: 'x', weight: 2.5 }, 'weight'],
    ['negative skeins', { name: 'x', skeinsOwned: -1 }, 'skeinsOwned'],
    ['zero meters per skein', { name: 'x', metersPerSkein: 0 }, 'metersPerSkein'],
    ['skeins as text', { name: 'x', skeinsOwned: 'three' }, 'skeinsOwned'],
    ['an unknown field', { name: 'x', ownerId: 'someone' }, ''],
  ];
  it.each(bad)('answers 422 for %s', async (_n, send, issuePath) => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/yarns').send(send);
    expect(res.status).toBe(422);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(issuePath);
    expect(await t.db('yarns').count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('answers 422 for bad changes and bad ids', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/yarns').send(plum);
    expect((await agent.patch(`/api/yarns/${body.yarn.id}`).send({})).status).toBe(422);
    expect((await agent.patch(`/api/yarns/${body.yarn.id}`).send({ name: '' })).status).toBe(422);
    expect((await agent.patch('/api/yarns/zero').send({ name: 'y' })).status).toBe(422);
    expect((await agent.get('/api/yarns/0')).status).toBe(422);
  });
});
