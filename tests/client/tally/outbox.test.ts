import { afterEach, describe, expect, it } from 'vitest';
import { http, HttpResponse } from 'msw';
import { Outbox } from '@/features/tally/lib/outbox';
import { server } from '../mocks/server';

// The outbox against the network (MSW): order, retries, and what it does with each kind of answer.

const boxes: Outbox[] = [];
function newBox() {
  const box = new Outbox(`test-outbox-${boxes.length}`);
  boxes.push(box);
  box.setMember('u1');
  return box;
}
afterEach(async () => {
  for (const b of boxes.splice(0)) await b.reset();
});

let n = 0;
const op = (action: 'step' | 'undo' | 'round' = 'step') => ({ opId: `op-test-${++n}-${Date.now()}`, action });
/** Waits until the member's taps have all been answered (or a couple of seconds have passed). */
const idle = async (box: Outbox) => {
  for (let i = 0; i < 200 && box.getSnapshot().items.some((x) => x.memberId === 'u1'); i += 1)
    await new Promise((r) => setTimeout(r, 10));
};

function recorder(status = 200, body: Record<string, unknown> = {}) {
  const seen: string[] = [];
  server.use(
    http.post('*/api/pieces/:pieceId/progress', async ({ request }) => {
      const b = (await request.json()) as { opId: string };
      seen.push(b.opId);
      return status === 200
        ? HttpResponse.json({
            progress: {
              copy: 1,
              round: 0,
              step: seen.length,
              done: seen.length,
              version: seen.length,
              updatedAt: null,
            },
          })
        : HttpResponse.json(body, { status });
    }),
  );
  return seen;
}

describe('the Tally outbox', () => {
  it('sends taps one at a time in the order they were made and forgets each once answered', async () => {
    const seen = recorder();
    const box = newBox();
    const acks: number[] = [];
    box.setHandlers({ progress: (_i, p) => acks.push(p.version) });
    const ops = [op(), op(), op('undo'), op()];
    for (const o of ops) box.enqueue({ kind: 'progress', pieceId: 1, op: o }, 'u1');
    await idle(box);
    expect(seen).toEqual(ops.map((o) => o.opId));
    expect(acks).toEqual([1, 2, 3, 4]);
    expect(box.getSnapshot().items).toEqual([]);
  });

  it('keeps taps while there is no connection and sends them, same ids, in order, when it is back', async () => {
    server.use(http.post('*/api/pieces/:pieceId/progress', () => HttpResponse.error()));
    const box = newBox();
    const ops = [op(), op(), op()];
    for (const o of ops) box.enqueue({ kind: 'progress', pieceId: 1, op: o }, 'u1');
    await new Promise((r) => setTimeout(r, 50));
    expect(box.getSnapshot().status).toBe('offline');
    expect(box.getSnapshot().items.map((i) => i.opId)).toEqual(ops.map((o) => o.opId));
    const seen = recorder();
    box.wake();
    await idle(box);
    expect(seen).toEqual(ops.map((o) => o.opId));
    expect(box.getSnapshot()).toMatchObject({ items: [], status: 'idle', failing: false });
  });

  it('retries after a server error instead of dropping the tap', async () => {
    let calls = 0;
    server.use(
      http.post('*/api/pieces/:pieceId/progress', () => {
        calls += 1;
        return calls === 1
          ? HttpResponse.json({ error: 'Something went wrong on our side.' }, { status: 500 })
          : HttpResponse.json({
              progress: { copy: 1, round: 0, step: 1, done: 1, version: 1, updatedAt: null },
            });
      }),
    );
    const box = newBox();
    box.enqueue({ kind: 'progress', pieceId: 1, op: op() }, 'u1');
    await new Promise((r) => setTimeout(r, 50));
    expect(box.getSnapshot()).toMatchObject({ status: 'retrying', failing: true });
    expect(box.getSnapshot().items).toHaveLength(1);
    // The first retry comes after about a second.
    for (let i = 0; i < 40 && box.getSnapshot().items.length; i += 1)
      await new Promise((r) => setTimeout(r, 50));
    expect(calls).toBe(2);
    expect(box.getSnapshot().items).toEqual([]);
  });

  it('says which tap the server refused (409) and goes on with the next', async () => {
    let calls = 0;
    server.use(
      http.post('*/api/pieces/:pieceId/progress', () => {
        calls += 1;
        return calls === 1
          ? HttpResponse.json(
              { error: 'This piece is already counted to its last stitch of its last copy.' },
              { status: 409 },
            )
          : HttpResponse.json({
              progress: { copy: 1, round: 0, step: 1, done: 1, version: 1, updatedAt: null },
            });
      }),
    );
    const box = newBox();
    const first = op();
    box.enqueue({ kind: 'progress', pieceId: 3, op: first }, 'u1');
    box.enqueue({ kind: 'progress', pieceId: 3, op: op('undo') }, 'u1');
    await idle(box);
    expect(calls).toBe(2);
    expect(box.getSnapshot().rejected).toEqual([
      {
        opId: first.opId,
        pieceId: 3,
        kind: 'progress',
        message: 'This piece is already counted to its last stitch of its last copy.',
      },
    ]);
    expect(box.getSnapshot().items).toEqual([]);
  });

  it('keeps taps for when the member signs in again, and never sends another member’s', async () => {
    const seen401: string[] = [];
    server.use(
      http.post('*/api/pieces/:pieceId/progress', async ({ request }) => {
        seen401.push(((await request.json()) as { opId: string }).opId);
        return HttpResponse.json({ error: 'Please sign in to continue.' }, { status: 401 });
      }),
    );
    const box = newBox();
    box.enqueue({ kind: 'progress', pieceId: 1, op: op() }, 'someone-else');
    box.enqueue({ kind: 'progress', pieceId: 1, op: op() }, 'u1');
    await new Promise((r) => setTimeout(r, 50));
    expect(box.getSnapshot().status).toBe('signed-out');
    expect(box.getSnapshot().items).toHaveLength(2);
    expect(seen401).toHaveLength(1);
    const seen = recorder();
    box.setMember(null);
    box.setMember('u1');
    await idle(box);
    expect(seen).toHaveLength(1);
    expect(box.getSnapshot().status).toBe('idle');
    expect(box.getSnapshot().items.map((i) => i.memberId)).toEqual(['someone-else']);
  });

  it('takes an acknowledgement from the stream before the answer arrives', async () => {
    server.use(http.post('*/api/pieces/:pieceId/progress', () => HttpResponse.error()));
    const box = newBox();
    const o = op();
    box.enqueue({ kind: 'progress', pieceId: 1, op: o }, 'u1');
    box.acknowledge(o.opId);
    expect(box.getSnapshot().items).toEqual([]);
  });
});
