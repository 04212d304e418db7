import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { ballTop, createTallyProject, newOpId } from '../../factories/progress.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

async function maker(copies = 2) {
  const { agent, user } = await signedInAgent(t.app, t.db);
  const { pieceIds } = await createTallyProject(t.db, user.id, [
    { name: 'Ear', instructions: ballTop, copies },
  ]);
  return { agent, user, pieceId: pieceIds[0], url: `/api/pieces/${pieceIds[0]}/placements` };
}

describe('placements', () => {
  it('records a mark at a round and stitch and lists it in piece order', async () => {
    const m = await maker();
    const later = await m.agent.post(m.url).send({ round: 3, step: 4, copy: 1, label: 'right eye' });
    expect(later.status).toBe(201);
    const first = await m.agent
      .post(m.url)
      .send({ round: 2, step: 10, copy: 1, label: '  left eye ', note: '6 sts apart' });
    expect(first.status).toBe(201);
    expect(first.body.placement).toEqual({
      id: expect.any(Number),
      pieceId: m.pieceId,
      copy: 1,
      round: 2,
      step: 10,
      label: 'left eye',
      note: '6 sts apart',
      createdAt: expect.any(String),
    });
    const list = await m.agent.get(m.url);
    expect(list.status).toBe(200);
    expect(list.body.placements.map((p: { label: string }) => p.label)).toEqual(['left eye', 'right eye']);
  });

  it('puts a mark without a copy on the copy the Tally is on', async () => {
    const m = await maker();
    await m.agent
      .post(`/api/pieces/${m.pieceId}/progress`)
      .send({ opId: newOpId(), action: 'set', to: { copy: 2, round: 1, step: 0 } });
    const res = await m.agent.post(m.url).send({ round: 2, label: 'arm' });
    expect(res.body.placement).toMatchObject({ copy: 2, step: null, note: null });
  });

  it('keeps a replayed mark once when it carries an opId', async () => {
    const m = await maker();
    const opId = newOpId();
    const a = await m.agent.post(m.url).send({ round: 2, step: 3, label: 'nose', opId });
    const b = await m.agent.post(m.url).send({ round: 2, step: 3, label: 'nose', opId });
    expect(a.status).toBe(201);
    expect(b.body.placement.id).toBe(a.body.placement.id);
    expect((await m.agent.get(m.url)).body.placements).toHaveLength(1);
  });

  it('refuses a mark without a label, with a bad round, or on a copy the piece does not have', async () => {
    const m = await maker(1);
    const noLabel = await m.agent.post(m.url).send({ round: 2, label: '   ' });
    expect(noLabel.status).toBe(422);
    expect(noLabel.body.error).toMatch(/Say what was placed/);
    expect((await m.agent.post(m.url).send({ round: -1, label: 'arm' })).status).toBe(422);
    expect((await m.agent.post(m.url).send({ round: 'nine', label: 'arm' })).status).toBe(422);
    const copy = await m.agent.post(m.url).send({ round: 2, label: 'arm', copy: 2 });
    expect(copy.status).toBe(422);
    expect(copy.body.error).toMatch(/made once/);
    expect((await m.agent.get(m.url)).body.placements).toEqual([]);
  });

  it('lets only the owner delete a mark', async () => {
    const m = await maker();
    const { body } = await m.agent.post(m.url).send({ round: 2, label: 'tail' });
    const { agent: other } = await signedInAgent(t.app, t.db);
    const refused = await other.delete(`/api/placements/${body.placement.id}`);
    expect(refused.status).toBe(404);
    expect(refused.body.error).toBe('That placement could not be found.');
    expect((await other.get(m.url)).status).toBe(404);
    expect((await m.agent.get(m.url)).body.placements).toHaveLength(1);
    expect((await request(t.app).delete(`/api/placements/${body.placement.id}`)).status).toBe(401);
    const gone = await m.agent.delete(`/api/placements/${body.placement.id}`);
    expect(gone.status).toBe(204);
    expect((await m.agent.get(m.url)).body.placements).toEqual([]);
    expect((await m.agent.delete(`/api/placements/${body.placement.id}`)).status).toBe(404);
  });
});
