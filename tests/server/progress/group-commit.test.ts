import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser } from '../../factories/users.js';
import { ballTop, createTallyProject, newOpId } from '../../factories/progress.js';
import { applyProgress } from '../../../server/services/progress.js';
import { HttpError } from '../../../server/lib/http-error.js';
import { checkPiece } from '../../../src/engine/index.js';

// Taps that reach the service in the same turn of the event loop are written in one transaction (group commit,
// D11). Calling the service without awaiting in between puts them in one batch for certain; these tests check that
// a batch keeps each tap's own outcome: a refused tap is rolled back alone, the others count once and in order.

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

const perCopy = checkPiece(ballTop).rounds.reduce((n, r) => n + Math.max(1, r.steps.length), 0);

async function settle<T>(promises: Promise<T>[]) {
  return Promise.allSettled(promises);
}

describe('taps written together', () => {
  it('counts the taps that fit and refuses the rest alone, in the order they came', async () => {
    const user = await createTestUser(t.db);
    const { pieceIds } = await createTallyProject(t.db, user.id);
    const pieceId = pieceIds[0];
    const taps = Array.from({ length: perCopy + 3 }, () =>
      applyProgress(t.db, user.id, pieceId, { opId: newOpId(), action: 'step' }),
    );
    const results = await settle(taps);

    const counted = results.slice(0, perCopy);
    const refused = results.slice(perCopy);
    expect(counted.map((r) => r.status)).toEqual(Array(perCopy).fill('fulfilled'));
    expect(counted.map((r) => (r.status === 'fulfilled' ? r.value.progress.version : null))).toEqual(
      Array.from({ length: perCopy }, (_, i) => i + 1),
    );
    for (const r of refused) {
      expect(r.status).toBe('rejected');
      const reason = (r as PromiseRejectedResult).reason;
      expect(reason).toBeInstanceOf(HttpError);
      expect((reason as HttpError).status).toBe(409);
    }
    const stored = await t.db('piece_progress').where({ piece_id: pieceId }).first();
    expect(stored).toMatchObject({ done: perCopy, version: perCopy });
    const events = await t.db('progress_events').where({ piece_id: pieceId }).count({ n: '*' }).first();
    expect(events).toEqual({ n: perCopy });
  });

  it('keeps one member’s refused tap from touching another’s taps in the same batch', async () => {
    const owner = await createTestUser(t.db);
    const other = await createTestUser(t.db);
    const { pieceIds } = await createTallyProject(t.db, owner.id);
    const pieceId = pieceIds[0];
    const repeated = newOpId();
    const results = await settle([
      applyProgress(t.db, owner.id, pieceId, { opId: repeated, action: 'step' }),
      applyProgress(t.db, other.id, pieceId, { opId: newOpId(), action: 'step' }),
      applyProgress(t.db, owner.id, pieceId, { opId: newOpId(), action: 'undo' }),
      applyProgress(t.db, owner.id, pieceId, { opId: repeated, action: 'step' }),
      applyProgress(t.db, owner.id, pieceId, {
        opId: newOpId(),
        action: 'set',
        to: { copy: 9, round: 0, step: 0 },
      }),
      applyProgress(t.db, owner.id, pieceId, { opId: newOpId(), action: 'step' }),
    ]);
    const [first, foreign, undo, retry, badSet, last] = results;
    expect(first).toMatchObject({
      status: 'fulfilled',
      value: { applied: true, progress: { done: 1, version: 1 } },
    });
    expect(foreign.status).toBe('rejected');
    expect(((foreign as PromiseRejectedResult).reason as HttpError).status).toBe(404);
    // The undo sees the first tap, written earlier in the same transaction.
    expect(undo).toMatchObject({
      status: 'fulfilled',
      value: { applied: true, progress: { done: 0, version: 2 } },
    });
    // The retry is recognised within the same batch and applies nothing.
    expect(retry).toMatchObject({ status: 'fulfilled', value: { applied: false, progress: { version: 2 } } });
    expect(badSet.status).toBe('rejected');
    expect(((badSet as PromiseRejectedResult).reason as HttpError).status).toBe(422);
    expect(last).toMatchObject({
      status: 'fulfilled',
      value: { applied: true, progress: { done: 1, version: 3 } },
    });

    const events = await t
      .db('progress_events')
      .where({ piece_id: pieceId })
      .orderBy('id')
      .select('action', 'op_id');
    expect(events.map((e) => e.action)).toEqual(['step', 'undo', 'step']);
    expect(events.filter((e) => e.op_id === repeated)).toHaveLength(1);
  });
});
