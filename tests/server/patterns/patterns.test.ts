import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { buildPattern } from '../../factories/patterns.js';
import type { Pattern } from '../../../src/types/api.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

const pebble = buildPattern().pieces[0];

async function newPattern(
  agent: ReturnType<typeof request.agent>,
  overrides: Parameters<typeof buildPattern>[0] = {},
) {
  const res = await agent.post('/api/patterns').send(buildPattern(overrides));
  expect(res.status, JSON.stringify(res.body)).toBe(201);
  return res.body.pattern as Pattern;
}

describe('POST /api/patterns', () => {
  it('creates a private pattern and answers 201 with pieces carrying the hook and the engine check', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/patterns').send(
      buildPattern({
        title: '  Moss pebble  ',
        sourceUrl: 'https://example.com/pebble',
        gauge: { stitches: 22, rows: 24, over: '10cm', stitch: 'sc', hookMm: 3.5 },
        pieces: [{ ...pebble, copies: 2, yarns: ['Moss cotton'] }],
        materials: {
          yarns: [{ name: 'Moss cotton', weight: 3, ply: '8 ply', metersPerSkein: 125 }],
          hooks: [{ mm: 3.5 }],
          notions: [],
        },
      }),
    );
    expect(res.status).toBe(201);
    expect(res.headers.location).toBe(`/api/patterns/${res.body.pattern.id}`);
    const p = res.body.pattern as Pattern;
    expect(p).toMatchObject({
      title: 'Moss pebble',
      terms: 'us',
      visibility: 'private',
      mine: true,
      sourceUrl: 'https://example.com/pebble',
      cautions: [],
    });
    expect(p.gauge).toEqual({ stitches: 22, rows: 24, over: '10cm', stitch: 'sc', hookMm: 3.5 });
    expect(p.materials.yarns[0]).toMatchObject({ name: 'Moss cotton', weight: 3 });
    expect(p.pieces).toHaveLength(1);
    const piece = p.pieces[0];
    expect(piece).toMatchObject({
      name: 'Pebble',
      copies: 2,
      hookMm: 3.5,
      yarns: ['Moss cotton'],
      position: 0,
    });
    // Source: Craft Yarn Council hook chart — 3.5 mm is US E-4.
    expect(piece.hook).toEqual({ mm: 3.5, us: 'E-4' });
    // Rnds 4-6 is one line standing for three rounds: 8 rounds from 6 lines.
    expect(piece.check.rounds.map((r) => r.number)).toEqual([1, 2, 3, 4, 5, 6, 7, 8]);
    expect(piece.check.rounds.map((r) => r.stitches)).toEqual([6, 12, 18, 18, 18, 18, 12, 6]);
    expect(piece.check.rounds[2]).toMatchObject({
      label: 'Rnd 3',
      line: 2,
      stated: 18,
      worked: 12,
      problems: [],
    });
    expect(piece.check.problemCount).toBe(0);
  });

  it('checks the counts on save: a wrong stated count comes back as a problem at that round', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const wrong = pebble.instructions.replace('Rnd 3: (sc, inc) x6 (18)', 'Rnd 3: (sc, inc) x6 (20)');
    const p = await newPattern(agent, { pieces: [{ ...pebble, instructions: wrong }] });
    const rounds = p.pieces[0].check.rounds;
    const r3 = rounds.find((r) => r.number === 3)!;
    expect(r3).toMatchObject({ line: 2, stitches: 18, stated: 20 });
    expect(r3.problems.length).toBeGreaterThan(0);
    expect(r3.problems[0].severity).toBe('error');
    expect(r3.problems[0].message).toMatch(/18/);
    expect(rounds.filter((r) => r.number !== 3 && r.problems.length)).toEqual([]);
    expect(p.pieces[0].check.problemCount).toBe(r3.problems.length);
  });

  it('returns the small-parts caution when the notions include safety eyes', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const p = await newPattern(agent, {
      materials: { yarns: [], hooks: [], notions: [{ kind: 'safety_eyes', sizeMm: 8, quantity: 2 }] },
    });
    expect(p.cautions.map((c) => c.code)).toEqual(['small-parts']);
    expect(p.cautions[0].message).toMatch(/choking hazard for children under 3/);
    expect(p.cautions[0].message).toMatch(/16 CFR 1501/);
  });

  it('gives a hook with no US name in the chart as us: null, and a piece without a hook as hook: null', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const p = await newPattern(agent, {
      pieces: [
        { ...pebble, hookMm: 2.5 },
        { ...pebble, name: 'Spare', hookMm: null },
      ],
    });
    // Source: Craft Yarn Council hook chart lists no US size for 2.5 mm.
    expect(p.pieces[0].hook).toEqual({ mm: 2.5, us: null });
    expect(p.pieces[1].hook).toBeNull();
  });

  const bad: Array<[string, (b: Record<string, any>) => unknown, RegExp]> = [
    ['a missing title', ({ title: _t, ...b }) => b, /title/i],
    ['a blank title', (b) => ({ ...b, title: '   ' }), /title/i],
    ['pieces that are not a list', (b) => ({ ...b, pieces: 'Body: Rnd 1: 6 sc in MR' }), /pieces/i],
    ['no pieces at all', (b) => ({ ...b, pieces: [] }), /at least one piece/i],
    ['0 copies', (b) => ({ ...b, pieces: [{ ...b.pieces[0], copies: 0 }] }), /at least 1/i],
    ['1.5 copies', (b) => ({ ...b, pieces: [{ ...b.pieces[0], copies: 1.5 }] }), /whole number/i],
    ['a 0 mm hook', (b) => ({ ...b, pieces: [{ ...b.pieces[0], hookMm: 0 }] }), /at least 0\.5 mm/i],
    ['a 40 mm hook', (b) => ({ ...b, pieces: [{ ...b.pieces[0], hookMm: 40 }] }), /at most 35 mm/i],
    ['a piece with no name', (b) => ({ ...b, pieces: [{ ...b.pieces[0], name: '' }] }), /name/i],
    ['a javascript: link', (b) => ({ ...b, sourceUrl: 'javascript:alert(1)' }), /http/i],
    ['an ftp link', (b) => ({ ...b, sourceUrl: 'ftp://example.com/pattern.pdf' }), /http/i],
    ['a link that is not a link', (b) => ({ ...b, sourceUrl: 'my friend gave it to me' }), /http/i],
    ['terms that are neither US nor UK', (b) => ({ ...b, terms: 'fr' }), /terms/i],
    ['a gauge with no rows', (b) => ({ ...b, gauge: { stitches: 22, over: '10cm' } }), /rows/i],
    ['an unknown visibility', (b) => ({ ...b, visibility: 'everyone' }), /visibility/i],
  ];
  it.each(bad)('refuses %s with 422 and the zod issues', async (_name, change, where) => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/patterns').send(change(buildPattern()) as object);
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/^Please check the form/);
    expect(Array.isArray(res.body.issues)).toBe(true);
    expect(JSON.stringify(res.body.issues)).toMatch(where);
    expect(await t.db('patterns').where({ owner_id: user.id }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('refuses malformed JSON with 400, and a signed-out visitor with 401', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/patterns').set('Content-Type', 'application/json').send('{"title":');
    expect(res.status).toBe(400);
    const anon = await request(t.app).post('/api/patterns').send(buildPattern());
    expect(anon.status).toBe(401);
    expect((await request(t.app).get('/api/patterns')).status).toBe(401);
  });
});

describe('GET /api/patterns', () => {
  it("lists only the member's own patterns, newest change first, as light items with problem counts", async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    await newPattern(other, { title: 'Not yours', visibility: 'public' });
    const first = await newPattern(agent, { title: 'First' });
    const wrong = pebble.instructions.replace('Rnd 2: inc x6 (12)', 'Rnd 2: inc x6 (13)');
    const second = await newPattern(agent, {
      title: 'Second',
      pieces: [
        { ...pebble, instructions: wrong },
        { ...pebble, name: 'Twin' },
      ],
    });
    const res = await agent.get('/api/patterns');
    expect(res.status).toBe(200);
    expect(res.body.patterns.map((p: { title: string }) => p.title)).toEqual(['Second', 'First']);
    expect(res.body.patterns[0]).toEqual({
      id: second.id,
      title: 'Second',
      designerCredit: 'Test studio',
      pieceCount: 2,
      problemCount: second.pieces[0].check.problemCount,
      updatedAt: second.updatedAt,
      visibility: 'private',
    });
    expect(res.body.patterns[0].problemCount).toBeGreaterThan(0);
    expect(res.body.patterns[1]).toMatchObject({ id: first.id, pieceCount: 1, problemCount: 0 });
  });
});

describe('GET /api/patterns/:id', () => {
  it('reads the whole pattern back, checked again', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const made = await newPattern(agent);
    const res = await agent.get(`/api/patterns/${made.id}`);
    expect(res.status).toBe(200);
    expect(res.body.pattern).toEqual(made);
  });

  it("answers 404 for someone else's private pattern and for one that does not exist, with the same sentence", async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const secret = await newPattern(agent, { title: 'Secret bunny' });
    const theirs = await other.get(`/api/patterns/${secret.id}`);
    const none = await other.get('/api/patterns/999999');
    expect(theirs.status).toBe(404);
    expect(none.status).toBe(404);
    expect(theirs.body).toEqual(none.body);
    expect(JSON.stringify(theirs.body)).not.toMatch(/Secret bunny/);
    // "shared with testers" is not public either (testers come in a later issue)
    await agent.patch(`/api/patterns/${secret.id}`).send({ visibility: 'testers' });
    expect((await other.get(`/api/patterns/${secret.id}`)).status).toBe(404);
  });

  it('answers 422 for an id that is not a number', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.get('/api/patterns/bramble');
    expect(res.status).toBe(422);
    expect(res.body.issues[0].path).toBe('id');
  });

  it('lets any signed-in member read a public pattern, read-only', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const open = await newPattern(agent, { title: 'Open pebble', visibility: 'public' });
    const read = await other.get(`/api/patterns/${open.id}`);
    expect(read.status).toBe(200);
    expect(read.body.pattern).toMatchObject({ title: 'Open pebble', mine: false });
    expect((await request(t.app).get(`/api/patterns/${open.id}`)).status).toBe(401);

    const patch = await other.patch(`/api/patterns/${open.id}`).send({ title: 'Taken over' });
    expect(patch.status).toBe(403);
    expect(patch.body.error).toMatch(/Only the member who wrote this pattern/);
    const del = await other.delete(`/api/patterns/${open.id}`);
    expect(del.status).toBe(403);
    expect((await agent.get(`/api/patterns/${open.id}`)).body.pattern.title).toBe('Open pebble');
    // and it is not in their list
    expect((await other.get('/api/patterns')).body.patterns.map((p: { id: number }) => p.id)).not.toContain(
      open.id,
    );
  });
});

describe('PATCH /api/patterns/:id', () => {
  it('changes only the fields sent and moves updatedAt on', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const made = await newPattern(agent, { skillNotes: 'Easy.' });
    await new Promise((r) => setTimeout(r, 5));
    const res = await agent
      .patch(`/api/patterns/${made.id}`)
      .send({ title: 'Renamed pebble', terms: 'uk', sourceUrl: '' });
    expect(res.status).toBe(200);
    const p = res.body.pattern as Pattern;
    expect(p).toMatchObject({
      title: 'Renamed pebble',
      terms: 'uk',
      skillNotes: 'Easy.',
      sourceUrl: null,
      designerCredit: 'Test studio',
    });
    expect(p.pieces.map((x) => x.id)).toEqual(made.pieces.map((x) => x.id));
    expect(p.updatedAt > made.updatedAt).toBe(true);
  });

  it('replaces the pieces when they are sent, keeping the ids of the pieces sent back', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const made = await newPattern(agent, {
      pieces: [
        { ...pebble, name: 'Body' },
        { ...pebble, name: 'Ear', copies: 2 },
        { ...pebble, name: 'Tail' },
      ],
    });
    const [body, ear, tail] = made.pieces;
    const res = await agent.patch(`/api/patterns/${made.id}`).send({
      pieces: [
        {
          id: ear.id,
          name: 'Ear',
          copies: 2,
          hookMm: 3,
          instructions: 'Rnd 1: 6 sc in MR (6)\nRnd 2: inc x6 (12)',
        },
        { id: body.id, name: 'Body', copies: 1, hookMm: 3.5, instructions: body.instructions },
        { name: 'Arm', copies: 2, hookMm: 3.5, instructions: 'Rnd 1: 5 sc in MR (5)' },
      ],
    });
    expect(res.status).toBe(200);
    const pieces = (res.body.pattern as Pattern).pieces;
    expect(pieces.map((p) => p.name)).toEqual(['Ear', 'Body', 'Arm']);
    expect(pieces.map((p) => p.position)).toEqual([0, 1, 2]);
    expect(pieces[0].id).toBe(ear.id);
    expect(pieces[1].id).toBe(body.id);
    expect([body.id, ear.id, tail.id]).not.toContain(pieces[2].id);
    expect(pieces[0].hook).toEqual({ mm: 3, us: null });
    expect(pieces[0].check.rounds.map((r) => r.stitches)).toEqual([6, 12]);
    expect(await t.db('pattern_pieces').where({ id: tail.id }).first()).toBeUndefined();
  });

  it('never takes over a piece of another pattern by its id: that piece becomes a new one', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const theirs = await newPattern(other, { title: 'Their pattern' });
    const mine = await newPattern(agent);
    const res = await agent
      .patch(`/api/patterns/${mine.id}`)
      .send({ pieces: [{ id: theirs.pieces[0].id, name: 'Sneaky', copies: 1, instructions: '' }] });
    expect(res.status).toBe(200);
    expect(res.body.pattern.pieces[0].id).not.toBe(theirs.pieces[0].id);
    const still = await other.get(`/api/patterns/${theirs.id}`);
    expect(still.body.pattern.pieces[0].name).toBe('Pebble');
  });

  it('refuses bad input with 422 and leaves the pattern as it was', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const made = await newPattern(agent);
    for (const body of [
      {},
      { title: '' },
      { pieces: {} },
      { pieces: [{ ...pebble, copies: 0 }] },
      { sourceUrl: 'data:text/html,hi' },
    ]) {
      const res = await agent.patch(`/api/patterns/${made.id}`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(422);
      expect(res.body.issues.length).toBeGreaterThan(0);
    }
    expect((await agent.get(`/api/patterns/${made.id}`)).body.pattern).toEqual(made);
  });

  it("answers 404 for someone else's private pattern and changes nothing", async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const made = await newPattern(agent);
    expect((await other.patch(`/api/patterns/${made.id}`).send({ title: 'Mine now' })).status).toBe(404);
    expect((await other.delete(`/api/patterns/${made.id}`)).status).toBe(404);
    expect((await agent.get(`/api/patterns/${made.id}`)).body.pattern.title).toBe(made.title);
  });
});

describe('DELETE /api/patterns/:id', () => {
  it('deletes the pattern and its pieces; projects started from it keep their own copy', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const made = await newPattern(agent);
    const [{ id: projectId }] = await t
      .db('projects')
      .insert({ owner_id: user.id, pattern_id: made.id, title: 'My pebble' })
      .returning('id');
    await t
      .db('project_pieces')
      .insert({ project_id: projectId, name: 'Pebble', instructions: pebble.instructions });

    const res = await agent.delete(`/api/patterns/${made.id}`);
    expect(res.status).toBe(204);
    expect((await agent.get(`/api/patterns/${made.id}`)).status).toBe(404);
    expect(await t.db('pattern_pieces').where({ pattern_id: made.id })).toEqual([]);
    const project = await t.db('projects').where({ id: projectId }).first();
    expect(project.pattern_id).toBeNull();
    expect(await t.db('project_pieces').where({ project_id: projectId }).first()).toMatchObject({
      instructions: pebble.instructions,
    });
    expect((await agent.delete(`/api/patterns/${made.id}`)).status).toBe(404);
  });
});
