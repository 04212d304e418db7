import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { createProject } from '../../factories/journal.js';
import { patternChanges, showcaseEntries } from '../../../server/services/journal.js';

let t: TestContext;
let maker: Awaited<ReturnType<typeof signedInAgent>>;
let other: Awaited<ReturnType<typeof signedInAgent>>;
let project: Awaited<ReturnType<typeof createProject>>;

beforeAll(async () => {
  t = await createTestContext();
  maker = await signedInAgent(t.app, t.db);
  other = await signedInAgent(t.app, t.db);
  project = await createProject(t.db, maker.user.id, { title: 'Pip the pear', pieces: ['Body', 'Leaf', 'Stalk'] });
});
afterAll(() => t.close());

const entries = (projectId = project.id, who = maker.agent) => who.get(`/api/projects/${projectId}/entries`);

describe('journal entries', () => {
  it('creates an entry and answers 201 { entry } in the shared shape', async () => {
    const res = await maker.agent.post(`/api/projects/${project.id}/entries`).send({
      body: '  Leaf *done*, both copies.  ',
      pieceId: project.pieces[1].id,
      tags: ['progress', 'finished', 'progress'],
      minutes: 42,
      entryDate: '2026-11-20',
      onShowcase: true,
    });
    expect(res.status).toBe(201);
    expect(res.body.entry).toEqual({
      id: expect.any(Number),
      projectId: project.id,
      pieceId: project.pieces[1].id,
      pieceName: 'Leaf',
      body: 'Leaf *done*, both copies.',
      entryDate: '2026-11-20',
      minutes: 42,
      tags: ['progress', 'finished'],
      onShowcase: true,
      photos: [],
      createdAt: expect.any(String),
      updatedAt: expect.any(String),
    });
  });

  it('defaults to today, no piece, no tags, no minutes, not on the showcase', async () => {
    const res = await maker.agent.post(`/api/projects/${project.id}/entries`).send({ body: 'Bought stuffing.' });
    expect(res.status).toBe(201);
    expect(res.body.entry).toMatchObject({ pieceId: null, pieceName: null, tags: [], minutes: null, onShowcase: false });
    expect(res.body.entry.entryDate).toBe(new Date().toISOString().slice(0, 10));
  });

  it('refuses bad input with 422 and a sentence per field', async () => {
    const cases: Array<[Record<string, unknown>, RegExp]> = [
      [{ body: '   ' }, /Write a few words/],
      [{}, /Write a few words/],
      [{ body: 'x', tags: ['gossip'] }, /tags/],
      [{ body: 'x', minutes: -5 }, /cannot be negative/],
      [{ body: 'x', minutes: 1441 }, /at most 24 hours/],
      [{ body: 'x', minutes: 2.5 }, /whole number/],
      [{ body: 'x', entryDate: '2026-02-30' }, /does not exist/],
      [{ body: 'x', entryDate: '30/11/2026' }, /like 2026-11-24/],
      [{ body: 'x'.repeat(10_001) }, /under 10,000 characters/],
      [{ body: 'x', ownerId: 'someone' }, /ownerId|Unrecognized/i],
    ];
    for (const [body, pattern] of cases) {
      const res = await maker.agent.post(`/api/projects/${project.id}/entries`).send(body);
      expect(res.status, JSON.stringify(body)).toBe(422);
      expect(JSON.stringify(res.body), JSON.stringify(body)).toMatch(pattern);
    }
  });

  it('refuses a piece from another project', async () => {
    const elsewhere = await createProject(t.db, maker.user.id, { pieces: ['Arm'] });
    const res = await maker.agent.post(`/api/projects/${project.id}/entries`).send({ body: 'x', pieceId: elsewhere.pieces[0].id });
    expect(res.status).toBe(422);
    expect(res.body.error).toMatch(/not part of this project/);
  });

  it('lists newest first by day, then by when written, and filters by piece', async () => {
    const p = await createProject(t.db, maker.user.id, { pieces: ['Head', 'Tail'] });
    const [head, tail] = p.pieces;
    const add = (body: string, entryDate: string, pieceId?: number) =>
      maker.agent.post(`/api/projects/${p.id}/entries`).send({ body, entryDate, pieceId }).expect(201);
    await add('first', '2026-11-01', head.id);
    await add('third', '2026-11-03', tail.id);
    await add('second', '2026-11-02');
    await add('third, later', '2026-11-03', head.id);
    const all = await entries(p.id);
    expect(all.status).toBe(200);
    expect(all.body.entries.map((e: { body: string }) => e.body)).toEqual(['third, later', 'third', 'second', 'first']);
    const heads = await maker.agent.get(`/api/projects/${p.id}/entries`).query({ pieceId: head.id });
    expect(heads.body.entries.map((e: { body: string }) => e.body)).toEqual(['third, later', 'first']);
    const foreignPiece = await maker.agent.get(`/api/projects/${p.id}/entries`).query({ pieceId: project.pieces[0].id });
    expect(foreignPiece.status).toBe(404);
  });

  it('edits an entry: only the fields sent change', async () => {
    const made = await maker.agent.post(`/api/projects/${project.id}/entries`).send({ body: 'Stalk started', pieceId: project.pieces[2].id, tags: ['progress'], minutes: 10, entryDate: '2026-11-21' });
    const id = made.body.entry.id;
    const res = await maker.agent.patch(`/api/entries/${id}`).send({ body: 'Stalk started with a 3 mm hook', tags: ['change'], minutes: null });
    expect(res.status).toBe(200);
    expect(res.body.entry).toMatchObject({ id, body: 'Stalk started with a 3 mm hook', tags: ['change'], minutes: null, pieceId: project.pieces[2].id, entryDate: '2026-11-21' });
    const unpiece = await maker.agent.patch(`/api/entries/${id}`).send({ pieceId: null });
    expect(unpiece.body.entry.pieceId).toBeNull();
    expect((await maker.agent.patch(`/api/entries/${id}`).send({})).status).toBe(422);
  });

  it('deletes an entry', async () => {
    const made = await maker.agent.post(`/api/projects/${project.id}/entries`).send({ body: 'Oops, duplicate' });
    expect((await maker.agent.delete(`/api/entries/${made.body.entry.id}`)).status).toBe(204);
    expect((await maker.agent.delete(`/api/entries/${made.body.entry.id}`)).status).toBe(404);
    const list = await entries();
    expect(list.body.entries.some((e: { id: number }) => e.id === made.body.entry.id)).toBe(false);
  });
});

describe('isolation', () => {
  let entryId: number;
  beforeAll(async () => {
    const made = await maker.agent.post(`/api/projects/${project.id}/entries`).send({ body: 'Private note about the gift' });
    entryId = made.body.entry.id;
  });

  it('another member gets 404 for the list, a new entry, an edit and a delete', async () => {
    expect((await entries(project.id, other.agent)).status).toBe(404);
    expect((await other.agent.post(`/api/projects/${project.id}/entries`).send({ body: 'hi' })).status).toBe(404);
    expect((await other.agent.patch(`/api/entries/${entryId}`).send({ body: 'changed' })).status).toBe(404);
    expect((await other.agent.delete(`/api/entries/${entryId}`)).status).toBe(404);
    const still = await t.db('journal_entries').where({ id: entryId }).first();
    expect(still.body).toBe('Private note about the gift');
  });

  it('a signed-out visitor gets 401', async () => {
    expect((await request(t.app).get(`/api/projects/${project.id}/entries`)).status).toBe(401);
    expect((await request(t.app).post(`/api/projects/${project.id}/entries`).send({ body: 'x' })).status).toBe(401);
  });

  it('a member does not see another member’s entries in their own project list', async () => {
    const mine = await createProject(t.db, other.user.id);
    await other.agent.post(`/api/projects/${mine.id}/entries`).send({ body: 'Mine' }).expect(201);
    const list = await entries(mine.id, other.agent);
    expect(list.body.entries.map((e: { body: string }) => e.body)).toEqual(['Mine']);
  });

  it('refuses a cross-site form post', async () => {
    const res = await maker.agent.post(`/api/projects/${project.id}/entries`).set('Origin', 'https://elsewhere.example').send({ body: 'x' });
    expect(res.status).toBe(403);
  });
});

describe('for the showcase', () => {
  it('lists only entries chosen for the showcase, and the "change" entries as modifications', async () => {
    const p = await createProject(t.db, maker.user.id, { pieces: ['Body'] });
    const add = (body: Record<string, unknown>) => maker.agent.post(`/api/projects/${p.id}/entries`).send(body).expect(201);
    await add({ body: 'Shown', onShowcase: true, entryDate: '2026-11-02' });
    await add({ body: 'Hidden', entryDate: '2026-11-03' });
    await add({ body: 'Used a 3 mm hook instead of 3.5', tags: ['change'], entryDate: '2026-11-01' });
    await add({ body: 'Skipped Rnd 9', tags: ['problem', 'change'], entryDate: '2026-11-04' });
    expect((await showcaseEntries(t.db, p.id)).map((e) => e.body)).toEqual(['Shown']);
    expect((await patternChanges(t.db, p.id)).map((e) => e.body)).toEqual(['Used a 3 mm hook instead of 3.5', 'Skipped Rnd 9']);
  });
});
