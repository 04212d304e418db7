import fs from 'node:fs';
import path from 'node:path';
import request from 'supertest';
import { afterEach, beforeEach, describe, expect, it } from 'vitest';
import { checkPiece } from '@/engine/index';
import { createTestContext, type TestContext } from '../../setup/test-app';
import { signedInAgent } from '../../factories/users';
import { buildProjectInput, createPattern, twoRoundBall } from '../../factories/projects';
import { newStorageKey, photoFilePath } from '../../../server/lib/storage';

let t: TestContext;
beforeEach(async () => {
  t = await createTestContext();
});
afterEach(async () => {
  await t.close();
});

const today = () => new Date().toISOString().slice(0, 10);

describe('POST /api/projects from scratch', () => {
  it('creates the project with its pieces, default progress, engine totals and no cautions', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/projects').send(buildProjectInput({ recipient: 'the cat', notes: 'Catnip inside.' }));
    expect(res.status).toBe(201);
    const { project } = res.body;
    expect(res.headers.location).toBe(`/api/projects/${project.id}`);
    expect(project).toMatchObject({
      title: 'A ball for the cat',
      status: 'planned',
      patternId: null,
      patternCredit: null,
      terms: 'us',
      recipient: 'the cat',
      notes: 'Catnip inside.',
      forYoungChild: false,
      visibility: 'private',
      shareUrl: null,
      cautions: [],
      materials: { yarns: [], hooks: [], notions: [] },
    });
    expect(project.pieces).toHaveLength(1);
    const [piece] = project.pieces;
    expect(piece).toMatchObject({ name: 'Ball', instructions: twoRoundBall, copies: 1, hookMm: 3.5, placements: [] });
    expect(typeof piece.id).toBe('number');
    // Source: Craft Yarn Council hook chart — 3.5 mm is E-4.
    expect(piece.hook).toEqual({ mm: 3.5, us: 'E-4' });
    expect(piece.progress).toEqual({ copy: 1, round: 0, step: 0, done: 0, version: 0, updatedAt: null });
    const check = checkPiece(twoRoundBall, { terms: 'us' });
    expect(piece.totals).toEqual({ rounds: 3, stepsPerCopy: check.totalSteps, copiesDone: 0, roundsDone: 0 });
    expect(piece.totals.stepsPerCopy).toBeGreaterThan(0);
  });

  it('stores top-level notions in materials.notions and answers the small-parts caution for safety eyes', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/projects').send(buildProjectInput({ notions: [{ kind: 'safety_eyes', sizeMm: 8, quantity: 2 }, { kind: 'stuffing' }] }));
    expect(res.status).toBe(201);
    expect(res.body.project.materials.notions).toEqual([{ kind: 'safety_eyes', sizeMm: 8, quantity: 2 }, { kind: 'stuffing' }]);
    expect(res.body.project.cautions.map((c: { code: string }) => c.code)).toEqual(['small-parts']);
    expect(res.body.project.cautions[0].message).toMatch(/choking hazard for children under 3/);
    expect(res.body.project.cautions[0].message).toMatch(/16 CFR 1501/);
    const row = await t.db('projects').where({ id: res.body.project.id }).first();
    expect(JSON.parse(row.materials).notions[0]).toMatchObject({ kind: 'safety_eyes' });
  });

  it('answers the young-child caution for a toy for a child under 3, and both when it also has buttons', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const young = await agent.post('/api/projects').send(buildProjectInput({ forYoungChild: true }));
    expect(young.body.project.forYoungChild).toBe(true);
    expect(young.body.project.cautions.map((c: { code: string }) => c.code)).toEqual(['young-child']);
    expect(young.body.project.cautions[0].message).toMatch(/Embroider/);
    const both = await agent.post('/api/projects').send(buildProjectInput({ forYoungChild: true, notions: [{ kind: 'buttons', quantity: 3 }] }));
    expect(both.body.project.cautions.map((c: { code: string }) => c.code).sort()).toEqual(['small-parts', 'young-child']);
  });

  it('sets the start date when a project starts on the hook, and the finish date when it is made finished', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const onHook = await agent.post('/api/projects').send(buildProjectInput({ status: 'on_the_hook' }));
    expect(onHook.body.project).toMatchObject({ status: 'on_the_hook', startedOn: today(), finishedOn: null });
    const given = await agent.post('/api/projects').send(buildProjectInput({ status: 'on_the_hook', startedOn: '2026-10-01' }));
    expect(given.body.project.startedOn).toBe('2026-10-01');
    const done = await agent.post('/api/projects').send(buildProjectInput({ status: 'finished' }));
    expect(done.body.project).toMatchObject({ status: 'finished', finishedOn: today(), startedOn: null });
  });

  it('creates a project with no pieces at all', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/projects').send({ title: 'Just an idea' });
    expect(res.status).toBe(201);
    expect(res.body.project.pieces).toEqual([]);
  });
});

describe('POST /api/projects from a pattern', () => {
  it('copies pieces, terms, materials and a credit snapshot', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const patternId = await createPattern(t.db, user.id, { terms: 'uk' });
    const res = await agent.post('/api/projects').send({ title: 'Owl for Ada', patternId });
    expect(res.status).toBe(201);
    const { project } = res.body;
    expect(project.patternId).toBe(patternId);
    expect(project.terms).toBe('uk');
    expect(project.patternCredit).toEqual({ title: 'Moss the pocket owl', designerCredit: 'Test studio', sourceUrl: 'https://example.com/moss-owl' });
    expect(project.pieces.map((p: { name: string; copies: number; hookMm: number; yarns: string[] }) => [p.name, p.copies, p.hookMm, p.yarns])).toEqual([
      ['Head', 1, 3.5, ['Moss cotton']],
      ['Ear', 2, 2.75, ['Moss cotton']],
    ]);
    expect(project.pieces[0].instructions).toBe(twoRoundBall);
    expect(project.pieces[1].hook).toEqual({ mm: 2.75, us: 'C-2' }); // Source: Craft Yarn Council hook chart
    expect(project.materials.yarns[0]).toMatchObject({ name: 'Moss cotton', weight: 3 });
    expect(project.materials.hooks).toEqual([{ mm: 3.5 }]);
    expect(project.cautions.map((c: { code: string }) => c.code)).toEqual(['small-parts']);
  });

  it('keeps its own copy: later edits to the pattern never shift a started project', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const patternId = await createPattern(t.db, user.id);
    const { body } = await agent.post('/api/projects').send({ title: 'Owl', patternId });
    const before = await agent.get(`/api/projects/${body.project.id}`);

    await t.db('pattern_pieces').where({ pattern_id: patternId, name: 'Head' }).update({ instructions: 'Rnd 1: 8 sc in MR (8)', copies: 3, hook_mm: 5 });
    await t.db('pattern_pieces').insert({ pattern_id: patternId, position: 5, name: 'Tail', copies: 1, instructions: 'Rnd 1: 4 sc in MR (4)' });
    await t.db('patterns').where({ id: patternId }).update({ title: 'Renamed owl', materials: JSON.stringify({ notions: [] }) });

    const after = await agent.get(`/api/projects/${body.project.id}`);
    expect(after.body.project.pieces).toEqual(before.body.project.pieces);
    expect(after.body.project.pieces[0].totals.rounds).toBe(3);
    expect(after.body.project.patternCredit.title).toBe('Moss the pocket owl');
    expect(after.body.project.materials).toEqual(before.body.project.materials);

    // Even deleting the pattern leaves the project, its pieces and the credit.
    await t.db('patterns').where({ id: patternId }).delete();
    const gone = await agent.get(`/api/projects/${body.project.id}`);
    expect(gone.status).toBe(200);
    expect(gone.body.project.patternId).toBeNull();
    expect(gone.body.project.patternCredit.title).toBe('Moss the pocket owl');
    expect(gone.body.project.pieces).toHaveLength(2);
  });

  it('lets the maker replace the notions and materials they actually use', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const patternId = await createPattern(t.db, user.id);
    const res = await agent.post('/api/projects').send({ title: 'Owl for a baby', patternId, forYoungChild: true, notions: [{ kind: 'stuffing' }], materials: { hooks: [{ mm: 3.25 }] } });
    expect(res.status).toBe(201);
    expect(res.body.project.materials.notions).toEqual([{ kind: 'stuffing' }]);
    expect(res.body.project.materials.hooks).toEqual([{ mm: 3.25 }]);
    expect(res.body.project.materials.yarns[0].name).toBe('Moss cotton');
    expect(res.body.project.cautions.map((c: { code: string }) => c.code)).toEqual(['young-child']);
  });

  it("starts from another member's public pattern, but not from a private one (404)", async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { user: designer } = await signedInAgent(t.app, t.db);
    const privateId = await createPattern(t.db, designer.id);
    const testersId = await createPattern(t.db, designer.id, { visibility: 'testers' });
    const publicId = await createPattern(t.db, designer.id, { visibility: 'public' });
    const denied = await agent.post('/api/projects').send({ title: 'Owl', patternId: privateId });
    expect(denied.status).toBe(404);
    expect(denied.body.error).toBe('That pattern could not be found.');
    expect((await agent.post('/api/projects').send({ title: 'Owl', patternId: testersId })).status).toBe(404);
    expect((await agent.post('/api/projects').send({ title: 'Owl', patternId: 999_999 })).status).toBe(404);
    expect(await t.db('projects').count({ n: '*' }).first()).toEqual({ n: 0 });
    const ok = await agent.post('/api/projects').send({ title: 'Owl', patternId: publicId });
    expect(ok.status).toBe(201);
    expect(ok.body.project.pieces).toHaveLength(2);
  });
});

describe('POST /api/projects with bad input', () => {
  const cases: Array<[string, unknown, string]> = [
    ['no title', { pieces: [] }, 'title'],
    ['an empty title', { title: '   ' }, 'title'],
    ['a title too long', { title: 'x'.repeat(121) }, 'title'],
    ['zero copies', { title: 'a', pieces: [{ name: 'Body', instructions: '', copies: 0 }] }, 'pieces.0.copies'],
    ['a piece with no name', { title: 'a', pieces: [{ name: '', instructions: '' }] }, 'pieces.0.name'],
    ['a hook too big', { title: 'a', pieces: [{ name: 'Body', instructions: '', copies: 1, hookMm: 100 }] }, 'pieces.0.hookMm'],
    ['an unknown notion', { title: 'a', notions: [{ kind: 'glitter' }] }, 'notions.0.kind'],
    ['a notion size of zero', { title: 'a', notions: [{ kind: 'safety_eyes', sizeMm: 0 }] }, 'notions.0.sizeMm'],
    ['an unknown status', { title: 'a', status: 'done' }, 'status'],
    ['a date in words', { title: 'a', startedOn: 'last Tuesday' }, 'startedOn'],
    ['a pattern id that is not a number', { title: 'a', patternId: 'abc' }, 'patternId'],
    ['forYoungChild as a string', { title: 'a', forYoungChild: 'yes' }, 'forYoungChild'],
    ['an unknown field', { title: 'a', owner_id: 'someone-else' }, ''],
    ['too many pieces', { title: 'a', pieces: Array.from({ length: 41 }, (_, i) => ({ name: `P${i}`, instructions: '' })) }, 'pieces'],
    ['a yarn weight of 8', { title: 'a', materials: { yarns: [{ name: 'Cloud', weight: 8 }] } }, 'materials.yarns.0.weight'],
  ];
  it.each(cases)('answers 422 with zod issues for %s', async (_name, body, issuePath) => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/projects').send(body as object);
    expect(res.status).toBe(422);
    expect(typeof res.body.error).toBe('string');
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(issuePath);
    expect(await t.db('projects').count({ n: '*' }).first()).toEqual({ n: 0 });
  });

  it('answers 422 when both a pattern and typed pieces are sent', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const patternId = await createPattern(t.db, user.id);
    const res = await agent.post('/api/projects').send({ title: 'a', patternId, pieces: [{ name: 'Body', instructions: '' }] });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/pattern or type your own pieces/);
  });

  it('answers 400 for a body that is not JSON', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/projects').set('Content-Type', 'application/json').send('{"title": ');
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/not valid JSON/);
  });

  it("refuses a shelf yarn from someone else's shelf and writes nothing", async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const theirs = await other.post('/api/yarns').send({ name: 'Their plum', metersPerSkein: 100 });
    const res = await agent.post('/api/projects').send(buildProjectInput({ materials: { yarns: [{ name: 'Their plum', shelfYarnId: theirs.body.yarn.id, metersUsed: 10 }] } }));
    expect(res.status).toBe(422);
    expect(res.body.issues[0].path).toBe('materials.yarns.0.shelfYarnId');
    expect(await t.db('projects').count({ n: '*' }).first()).toEqual({ n: 0 });
    expect(await t.db('project_pieces').count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});

describe('signed-out visitors', () => {
  it('get 401 from every projects route', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(buildProjectInput());
    const anon = request(t.app);
    for (const res of [
      await anon.get('/api/projects'),
      await anon.post('/api/projects').send(buildProjectInput()),
      await anon.get(`/api/projects/${body.project.id}`),
      await anon.patch(`/api/projects/${body.project.id}`).send({ title: 'Mine now' }),
      await anon.delete(`/api/projects/${body.project.id}`),
    ]) {
      expect(res.status).toBe(401);
      expect(res.body.error).toBe('Please sign in to continue.');
    }
    expect((await t.db('projects').first()).title).toBe('A ball for the cat');
  });
});

describe('GET /api/projects', () => {
  it("lists only the member's own projects, newest change first, filtered by status", async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const { agent: other } = await signedInAgent(t.app, t.db);
    const patternId = await createPattern(t.db, user.id);
    await agent.post('/api/projects').send(buildProjectInput({ title: 'Planned one' }));
    const onHook = await agent.post('/api/projects').send({ title: 'Owl on the hook', patternId, status: 'on_the_hook', recipient: 'Ada', forYoungChild: true });
    await other.post('/api/projects').send(buildProjectInput({ title: 'Not yours' }));

    const all = await agent.get('/api/projects');
    expect(all.status).toBe(200);
    expect(all.body.projects.map((p: { title: string }) => p.title).sort()).toEqual(['Owl on the hook', 'Planned one']);
    const owl = all.body.projects.find((p: { id: number }) => p.id === onHook.body.project.id);
    expect(owl).toEqual({
      id: onHook.body.project.id,
      title: 'Owl on the hook',
      status: 'on_the_hook',
      startedOn: today(),
      finishedOn: null,
      updatedAt: expect.any(String),
      pieceCount: 2,
      recipient: 'Ada',
      patternTitle: 'Moss the pocket owl',
      forYoungChild: true,
      visibility: 'private',
      cautionCount: 2,
    });

    const filtered = await agent.get('/api/projects?status=on_the_hook');
    expect(filtered.body.projects.map((p: { title: string }) => p.title)).toEqual(['Owl on the hook']);
    expect((await agent.get('/api/projects?status=finished')).body.projects).toEqual([]);
  });

  it('answers 422 for an unknown status filter', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent.get('/api/projects?status=knitting');
    expect(res.status).toBe(422);
    expect(res.body.issues[0].path).toBe('status');
  });
});

describe("another member's project", () => {
  it('is a 404 for GET, PATCH and DELETE, and stays as it was', async () => {
    const { agent: owner } = await signedInAgent(t.app, t.db);
    const { agent: stranger } = await signedInAgent(t.app, t.db);
    const { body } = await owner.post('/api/projects').send(buildProjectInput());
    const id = body.project.id;
    for (const res of [
      await stranger.get(`/api/projects/${id}`),
      await stranger.patch(`/api/projects/${id}`).send({ title: 'Taken', visibility: 'public' }),
      await stranger.delete(`/api/projects/${id}`),
      await stranger.get('/api/projects/987654'),
    ]) {
      expect(res.status).toBe(404);
      expect(res.body.error).toBe('That project could not be found.');
    }
    const still = await owner.get(`/api/projects/${id}`);
    expect(still.body.project).toMatchObject({ title: 'A ball for the cat', visibility: 'private' });
  });

  it('answers 422 for an id that is not a number', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    for (const res of [await agent.get('/api/projects/abc'), await agent.patch('/api/projects/-1').send({ title: 'x' }), await agent.delete('/api/projects/1.5')]) {
      expect(res.status).toBe(422);
      expect(res.body.issues[0].path).toBe('id');
    }
  });
});

describe('GET /api/projects/:id reads the Tally records', () => {
  it('shows the progress row, totals from it and placements newest last', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(
      buildProjectInput({
        pieces: [
          { name: 'Ball', instructions: twoRoundBall, copies: 2 },
          { name: 'Tail', instructions: 'Rnd 1: 4 sc in MR (4)', copies: 1 },
        ],
      }),
    );
    const [ball, tail] = body.project.pieces;
    await t.db('piece_progress').insert({ piece_id: ball.id, copy: 2, round: 1, step: 3, done: 20, version: 7, updated_at: '2026-12-02T10:00:00.000Z' });
    await t.db('piece_progress').insert({ piece_id: tail.id, copy: 1, round: 1, step: 0, done: 1, version: 2 });
    await t.db('placements').insert({ piece_id: ball.id, copy: 1, round: 2, step: 4, label: 'right eye', note: 'a bit high', created_at: '2026-12-02T09:00:00.000Z' });
    await t.db('placements').insert({ piece_id: ball.id, copy: 1, round: 2, step: 1, label: 'left eye', created_at: '2026-12-01T09:00:00.000Z' });

    const res = await agent.get(`/api/projects/${body.project.id}`);
    const [b, tl] = res.body.project.pieces;
    expect(b.progress).toEqual({ copy: 2, round: 1, step: 3, done: 20, version: 7, updatedAt: '2026-12-02T10:00:00.000Z' });
    // Copy 1 is done; on copy 2, round index 1 means one round is done.
    expect(b.totals).toMatchObject({ rounds: 3, copiesDone: 1, roundsDone: 1 });
    expect(b.placements.map((p: { label: string }) => p.label)).toEqual(['left eye', 'right eye']);
    expect(b.placements[1]).toMatchObject({ pieceId: ball.id, copy: 1, round: 2, step: 4, note: 'a bit high' });
    // The only round of the only copy is done.
    expect(tl.totals).toMatchObject({ rounds: 1, copiesDone: 1, roundsDone: 1 });
    expect(tl.placements).toEqual([]);
  });
});

describe('the cover photo', () => {
  it('is null until a photo is the cover, then carries its links from the photos work', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(buildProjectInput());
    expect(body.project.coverPhoto).toBeNull();
    const key = newStorageKey();
    const [{ id: photoId }] = await t.db('photos').insert({ project_id: body.project.id, owner_id: user.id, storage_key: key, width: 1200, height: 900, bytes: 5000, alt: 'The ball on the sill' }).returning('id');
    await t.db('projects').where({ id: body.project.id }).update({ cover_photo_id: photoId });
    const res = await agent.get(`/api/projects/${body.project.id}`);
    expect(res.body.project.coverPhoto).toMatchObject({ id: photoId, width: 1200, height: 900, alt: 'The ball on the sill' });
    expect(res.body.project.coverPhoto.url).toContain(key);
    expect(res.body.project.coverPhoto.thumbUrl).toContain(key);
  });
});

describe('PATCH /api/projects/:id', () => {
  it('changes details and dates with status, keeping dates already set', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(buildProjectInput({ startedOn: '2026-11-01' }));
    const id = body.project.id;
    const r1 = await agent.patch(`/api/projects/${id}`).send({ title: 'A ball for Biscuit', recipient: 'Biscuit', notes: null, status: 'on_the_hook' });
    expect(r1.status).toBe(200);
    expect(r1.body.project).toMatchObject({ title: 'A ball for Biscuit', recipient: 'Biscuit', notes: null, status: 'on_the_hook', startedOn: '2026-11-01' });
    expect(r1.body.project.updatedAt > body.project.updatedAt).toBe(true);
    const r2 = await agent.patch(`/api/projects/${id}`).send({ status: 'finished' });
    expect(r2.body.project).toMatchObject({ status: 'finished', finishedOn: today() });
    const r3 = await agent.patch(`/api/projects/${id}`).send({ status: 'resting', finishedOn: null });
    expect(r3.body.project).toMatchObject({ status: 'resting', finishedOn: null });
  });

  it('replaces notions and yarns in materials and recomputes cautions', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(buildProjectInput({ notions: [{ kind: 'beads', quantity: 10 }] }));
    expect(body.project.cautions).toHaveLength(1);
    const res = await agent.patch(`/api/projects/${body.project.id}`).send({ notions: [{ kind: 'stuffing' }], materials: { yarns: [{ name: 'Oat wool', weight: 4, metersUsed: 40 }] } });
    expect(res.body.project.materials).toEqual({ yarns: [{ name: 'Oat wool', weight: 4, metersUsed: 40 }], hooks: [], notions: [{ kind: 'stuffing' }] });
    expect(res.body.project.cautions).toEqual([]);
    const young = await agent.patch(`/api/projects/${body.project.id}`).send({ forYoungChild: true });
    expect(young.body.project.cautions.map((c: { code: string }) => c.code)).toEqual(['young-child']);
  });

  it('edits, adds and removes pieces, and refuses a piece of another project', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(
      buildProjectInput({ pieces: [{ name: 'Ball', instructions: twoRoundBall }, { name: 'Bell', instructions: '' }] }),
    );
    const { body: other } = await agent.post('/api/projects').send(buildProjectInput());
    const [ball, bell] = body.project.pieces;
    await t.db('piece_progress').insert({ piece_id: bell.id, round: 0, step: 1, done: 1, version: 1 });

    const res = await agent.patch(`/api/projects/${body.project.id}`).send({ pieces: [{ name: 'Tail', instructions: 'Rnd 1: 4 sc in MR (4)', copies: 2 }, { id: ball.id, name: 'Big ball' }] });
    expect(res.status).toBe(200);
    const pieces = res.body.project.pieces;
    expect(pieces.map((p: { name: string; copies: number }) => [p.name, p.copies])).toEqual([
      ['Tail', 2],
      ['Big ball', 1],
    ]);
    expect(pieces[1].id).toBe(ball.id);
    expect(pieces[1].instructions).toBe(twoRoundBall);
    expect(await t.db('piece_progress').where({ piece_id: bell.id }).first()).toBeUndefined();

    const foreign = await agent.patch(`/api/projects/${body.project.id}`).send({ pieces: [{ id: other.project.pieces[0].id, name: 'Stolen' }] });
    expect(foreign.status).toBe(422);
    expect(foreign.body.issues[0].path).toBe('pieces.0.id');
    // Nothing changed: the transaction rolled back.
    expect((await agent.get(`/api/projects/${body.project.id}`)).body.project.pieces.map((p: { name: string }) => p.name)).toEqual(['Tail', 'Big ball']);
    expect((await agent.get(`/api/projects/${other.project.id}`)).body.project.pieces[0].name).toBe('Ball');
  });

  it('answers 422 for bad changes and an empty body', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(buildProjectInput());
    const id = body.project.id;
    for (const [send, p] of [
      [{}, ''],
      [{ title: '' }, 'title'],
      [{ status: 'done' }, 'status'],
      [{ visibility: 'everyone' }, 'visibility'],
      [{ finishedOn: '02/12/2026' }, 'finishedOn'],
      [{ shareToken: 'mine' }, ''],
      [{ pieces: [{ name: 'X', copies: 'many' }] }, 'pieces.0.copies'],
    ] as const) {
      const res = await agent.patch(`/api/projects/${id}`).send(send);
      expect(res.status, JSON.stringify(send)).toBe(422);
      expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(p);
    }
  });
});

describe('visibility and the share link', () => {
  it('makes a 128-bit+ token on the first switch away from private and keeps it', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(buildProjectInput());
    const id = body.project.id;
    const linked = await agent.patch(`/api/projects/${id}`).send({ visibility: 'link' });
    expect(linked.status).toBe(200);
    expect(linked.body.project.visibility).toBe('link');
    const url: string = linked.body.project.shareUrl;
    expect(url).toMatch(/^\/p\/[A-Za-z0-9_-]{22,}$/);
    const token = url.slice(3);
    // base64url of ≥16 random bytes: at least 22 characters.
    expect(Buffer.from(token, 'base64url').length).toBeGreaterThanOrEqual(16);

    const pub = await agent.patch(`/api/projects/${id}`).send({ visibility: 'public' });
    expect(pub.body.project.shareUrl).toBe(url);

    const priv = await agent.patch(`/api/projects/${id}`).send({ visibility: 'private' });
    expect(priv.body.project).toMatchObject({ visibility: 'private', shareUrl: null });
    expect((await t.db('projects').where({ id }).first()).share_token).toBe(token);
    expect((await agent.patch(`/api/projects/${id}`).send({ visibility: 'link' })).body.project.shareUrl).toBe(url);

    const { body: second } = await agent.post('/api/projects').send(buildProjectInput());
    const otherUrl = (await agent.patch(`/api/projects/${second.project.id}`).send({ visibility: 'link' })).body.project.shareUrl;
    expect(otherUrl).not.toBe(url);
  });

  it('is an absolute link from APP_ORIGIN when that is set', async () => {
    await t.close();
    t = await createTestContext({ APP_ORIGIN: 'https://whorlbook.example' });
    const { agent } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(buildProjectInput());
    const res = await agent.patch(`/api/projects/${body.project.id}`).send({ visibility: 'public' });
    expect(res.body.project.shareUrl).toMatch(/^https:\/\/whorlbook\.example\/p\/[A-Za-z0-9_-]{22,}$/);
  });
});

describe('DELETE /api/projects/:id', () => {
  it('removes the project, its pieces, progress, placements, photo rows and photo files, and nothing of others', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const { agent: other, user: otherUser } = await signedInAgent(t.app, t.db);
    const { body } = await agent.post('/api/projects').send(buildProjectInput());
    const { body: theirs } = await other.post('/api/projects').send(buildProjectInput());
    const id = body.project.id;
    const pieceId = body.project.pieces[0].id;
    await t.db('piece_progress').insert({ piece_id: pieceId, done: 3, version: 3 });
    await t.db('placements').insert({ piece_id: pieceId, round: 2, label: 'eye' });

    // Photo rows and files made by hand, where the photos work keeps them (server/lib/storage.ts).
    const files: Record<string, string[]> = {};
    const addPhoto = async (projectId: number, ownerId: string) => {
      const key = newStorageKey();
      await t.db('photos').insert({ project_id: projectId, owner_id: ownerId, storage_key: key, width: 10, height: 10, bytes: 100 });
      files[key] = (['display', 'thumb'] as const).map((v) => photoFilePath(t.env.uploadsDir, projectId, key, v));
      for (const f of files[key]) {
        fs.mkdirSync(path.dirname(f), { recursive: true });
        fs.writeFileSync(f, 'jpeg bytes');
      }
      return key;
    };
    const mine = [await addPhoto(id, user.id), await addPhoto(id, user.id)];
    const theirsKey = await addPhoto(theirs.project.id, otherUser.id);

    const res = await agent.delete(`/api/projects/${id}`);
    expect(res.status).toBe(204);
    expect((await agent.get(`/api/projects/${id}`)).status).toBe(404);
    expect(await t.db('project_pieces').where({ project_id: id })).toEqual([]);
    expect(await t.db('piece_progress').where({ piece_id: pieceId })).toEqual([]);
    expect(await t.db('placements').where({ piece_id: pieceId })).toEqual([]);
    expect(await t.db('photos').where({ project_id: id })).toEqual([]);
    for (const f of mine.flatMap((k) => files[k])) expect(fs.existsSync(f), f).toBe(false);
    for (const f of files[theirsKey]) expect(fs.existsSync(f), f).toBe(true);
    expect((await other.get(`/api/projects/${theirs.project.id}`)).status).toBe(200);

    expect((await agent.delete(`/api/projects/${id}`)).status).toBe(404);
  });
});
