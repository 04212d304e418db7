import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { createTallyProject, newOpId } from '../../factories/progress.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

describe('the project last worked on', () => {
  it('comes first on the home list after a tap on one of its pieces', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const older = await createTallyProject(t.db, user.id);
    const newer = await createTallyProject(t.db, user.id);
    // Give them distinct times: the newer project was touched last.
    await t.db('projects').where({ id: older.projectId }).update({ status: 'on_the_hook', updated_at: '2026-11-01T10:00:00.000Z' });
    await t.db('projects').where({ id: newer.projectId }).update({ status: 'on_the_hook', updated_at: '2026-11-02T10:00:00.000Z' });
    const before = await agent.get('/api/projects?status=on_the_hook');
    expect(before.body.projects.map((p: { id: number }) => p.id)).toEqual([newer.projectId, older.projectId]);

    const tap = await agent.post(`/api/pieces/${older.pieceIds[0]}/progress`).send({ opId: newOpId(), action: 'step' });
    expect(tap.status).toBe(200);
    const after = await agent.get('/api/projects?status=on_the_hook');
    expect(after.body.projects.map((p: { id: number }) => p.id)).toEqual([older.projectId, newer.projectId]);
  });
});
