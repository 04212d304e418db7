import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { AddressInfo } from 'node:net';
import type { Server } from 'node:http';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser } from '../../factories/users.js';
import { createTallyProject, newOpId } from '../../factories/progress.js';

// The second device hears taps through server-sent events: a real listening server and a real streaming fetch.
let t: TestContext;
let server: Server;
let base: string;
beforeAll(async () => {
  t = await createTestContext();
  server = t.app.listen(0, '127.0.0.1');
  await new Promise((r) => server.once('listening', r));
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
});
afterAll(async () => {
  server.closeAllConnections();
  await new Promise((r) => server.close(r));
  await t.close();
});

async function signIn() {
  const user = await createTestUser(t.db);
  const res = await request(t.app)
    .post('/api/auth/signin')
    .send({ email: user.email, password: user.password });
  const cookie = (res.headers['set-cookie'] as unknown as string[]).map((c) => c.split(';')[0]).join('; ');
  return { user, cookie };
}

/** Reads server-sent events from a stream until `want` of them have arrived. */
async function openStream(url: string, cookie: string) {
  const controller = new AbortController();
  const res = await fetch(url, {
    headers: { cookie, accept: 'text/event-stream' },
    signal: controller.signal,
  });
  const events: Array<{ event: string; data: any }> = [];
  let buffer = '';
  const reader = res.body!.getReader();
  const decoder = new TextDecoder();
  const pump = (async () => {
    try {
      for (;;) {
        const { value, done } = await reader.read();
        if (done) return;
        buffer += decoder.decode(value, { stream: true });
        let i: number;
        while ((i = buffer.indexOf('\n\n')) >= 0) {
          const block = buffer.slice(0, i);
          buffer = buffer.slice(i + 2);
          const event = /^event: (.*)$/m.exec(block)?.[1];
          const data = /^data: (.*)$/m.exec(block)?.[1];
          if (event && data) events.push({ event, data: JSON.parse(data) });
        }
      }
    } catch {
      /* aborted */
    }
  })();
  const until = async (want: number) => {
    const start = Date.now();
    while (events.length < want && Date.now() - start < 5000) await new Promise((r) => setTimeout(r, 10));
    return events;
  };
  return { res, events, until, close: async () => (controller.abort(), await pump) };
}

describe('GET /api/pieces/:pieceId/stream', () => {
  it('sends the position at once, then every committed tap with its opId', async () => {
    const { user, cookie } = await signIn();
    const { pieceIds } = await createTallyProject(t.db, user.id);
    const stream = await openStream(`${base}/api/pieces/${pieceIds[0]}/stream`, cookie);
    expect(stream.res.status).toBe(200);
    expect(stream.res.headers.get('content-type')).toMatch(/text\/event-stream/);
    const [hello] = await stream.until(1);
    expect(hello).toEqual({
      event: 'progress',
      data: {
        type: 'progress',
        opId: null,
        progress: { copy: 1, round: 0, step: 0, done: 0, version: 0, updatedAt: null },
      },
    });

    const opId = newOpId();
    const tap = await fetch(`${base}/api/pieces/${pieceIds[0]}/progress`, {
      method: 'POST',
      headers: { cookie, 'content-type': 'application/json' },
      body: JSON.stringify({ opId, action: 'step' }),
    });
    expect(tap.status).toBe(200);
    const events = await stream.until(2);
    expect(events[1]).toMatchObject({ event: 'progress', data: { opId, progress: { done: 1, version: 1 } } });

    await fetch(`${base}/api/pieces/${pieceIds[0]}/placements`, {
      method: 'POST',
      headers: { cookie, 'content-type': 'application/json' },
      body: JSON.stringify({ round: 1, label: 'nose' }),
    });
    expect((await stream.until(3))[2]).toEqual({
      event: 'placements',
      data: { type: 'placements', pieceId: pieceIds[0] },
    });
    await stream.close();
  });

  it('does not hear another piece, and refuses another member’s piece with 404', async () => {
    const a = await signIn();
    const b = await signIn();
    const { pieceIds: mine } = await createTallyProject(t.db, a.user.id, [
      { name: 'One', instructions: 'Rnd 1: 6 sc in MR (6)' },
      { name: 'Two', instructions: 'Rnd 1: 6 sc in MR (6)' },
    ]);
    const refused = await fetch(`${base}/api/pieces/${mine[0]}/stream`, { headers: { cookie: b.cookie } });
    expect(refused.status).toBe(404);
    expect(await refused.json()).toEqual({ error: 'That piece could not be found.' });
    expect((await fetch(`${base}/api/pieces/${mine[0]}/stream`)).status).toBe(401);

    const stream = await openStream(`${base}/api/pieces/${mine[0]}/stream`, a.cookie);
    await stream.until(1);
    await fetch(`${base}/api/pieces/${mine[1]}/progress`, {
      method: 'POST',
      headers: { cookie: a.cookie, 'content-type': 'application/json' },
      body: JSON.stringify({ opId: newOpId(), action: 'step' }),
    });
    await new Promise((r) => setTimeout(r, 200));
    expect(stream.events).toHaveLength(1);
    await stream.close();
  });

  it('lets go of the piece when the device disconnects', async () => {
    const { user, cookie } = await signIn();
    const { pieceIds } = await createTallyProject(t.db, user.id);
    const { hubFor } = await import('../../../server/services/progress.js');
    const channel = `piece:${pieceIds[0]}`;
    const stream = await openStream(`${base}/api/pieces/${pieceIds[0]}/stream`, cookie);
    await stream.until(1);
    expect(hubFor(t.db).listenerCount(channel)).toBe(1);
    await stream.close();
    const start = Date.now();
    while (hubFor(t.db).listenerCount(channel) > 0 && Date.now() - start < 3000)
      await new Promise((r) => setTimeout(r, 20));
    expect(hubFor(t.db).listenerCount(channel)).toBe(0);
  });
});
