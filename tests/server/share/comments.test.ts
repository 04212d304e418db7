import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser, signedInAgent } from '../../factories/users.js';
import { createShowcaseProject } from '../../factories/share.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

const XSS = '<img src=x onerror=alert(1)>';

describe('posting comments', () => {
  it('needs sign-in (401) but anyone with the link can read them', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id);
    const res = await request(t.app).post(`/api/share/${p.token}/comments`).send({ body: 'Lovely!' });
    expect(res.status).toBe(401);
    expect(res.body.error).toMatch(/sign in/i);

    const friend = await signedInAgent(t.app, t.db, { displayName: 'Friend Fen' });
    const posted = await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Lovely!' });
    expect(posted.status).toBe(201);
    expect(posted.body.comment).toMatchObject({ body: 'Lovely!', author: { displayName: 'Friend Fen' }, mine: true, canDelete: true, canHide: false, hidden: false });

    const list = await request(t.app).get(`/api/share/${p.token}/comments`);
    expect(list.status).toBe(200);
    expect(list.body.comments).toHaveLength(1);
    expect(list.body.comments[0]).toMatchObject({ body: 'Lovely!', mine: false, canDelete: false });
    expect(JSON.stringify(list.body)).not.toContain(friend.user.email);
    expect((await request(t.app).get(`/api/share/${p.token}`)).body.showcase.commentCount).toBe(1);
  });

  it('keeps markup inert: stored and returned exactly as typed, never as HTML', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id);
    const friend = await signedInAgent(t.app, t.db, { displayName: '<b>Bold</b> friend' });
    const posted = await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: XSS });
    expect(posted.status).toBe(201);
    expect(posted.body.comment.body).toBe(XSS);
    const list = await request(t.app).get(`/api/share/${p.token}/comments`);
    expect(list.type).toMatch(/json/);
    expect(list.body.comments[0].body).toBe(XSS);
    expect(list.body.comments[0].author.displayName).toBe('<b>Bold</b> friend');
    expect((await t.db('comments').where({ id: posted.body.comment.id }).first()).body).toBe(XSS);
    // The server-rendered page never carries comments at all, so the markup cannot appear there unescaped.
    const html = (await request(t.app).get(`/p/${p.token}`)).text;
    expect(html).not.toContain(XSS);
    expect(html).not.toContain('onerror');
  });

  it('accepts 2000 characters and refuses 2001 with a sentence (422)', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id);
    const friend = await signedInAgent(t.app, t.db);
    expect((await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'a'.repeat(2000) })).status).toBe(201);
    // An emoji is one character to a person even though it is two UTF-16 units.
    expect((await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: '🧶'.repeat(2000) })).status).toBe(201);
    const long = await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'a'.repeat(2001) });
    expect(long.status).toBe(422);
    expect(long.body.error).toMatch(/at most 2,000 characters; this one has 2,001/);
    const empty = await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: '   ' });
    expect(empty.status).toBe(422);
    expect(empty.body.error).toMatch(/Write a comment first/);
  });

  it('refuses comments on a private page (404) and on a retired link', async () => {
    const { agent: ownerAgent, user: owner } = await signedInAgent(t.app, t.db);
    const p = await createShowcaseProject(t.db, owner.id, { visibility: 'private' });
    const friend = await signedInAgent(t.app, t.db);
    expect((await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Hi' })).status).toBe(404);
    expect((await request(t.app).get(`/api/share/${p.token}/comments`)).status).toBe(404);
    const shared = await createShowcaseProject(t.db, owner.id);
    await ownerAgent.post(`/api/projects/${shared.id}/share-link`).send({});
    expect((await friend.agent.post(`/api/share/${shared.token}/comments`).send({ body: 'Hi' })).status).toBe(404);
  });

  it('refuses a cross-site post (same-origin guard)', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id);
    const friend = await signedInAgent(t.app, t.db);
    const res = await friend.agent.post(`/api/share/${p.token}/comments`).set('Origin', 'https://elsewhere.example').send({ body: 'Hi' });
    expect(res.status).toBe(403);
  });
});

describe('deleting and hiding', () => {
  async function setUp() {
    const owner = await signedInAgent(t.app, t.db, { displayName: 'Owner Oona' });
    const p = await createShowcaseProject(t.db, owner.user.id);
    const author = await signedInAgent(t.app, t.db, { displayName: 'Author Ari' });
    const stranger = await signedInAgent(t.app, t.db, { displayName: 'Stranger Sol' });
    const id: number = (await author.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Nice ears' })).body.comment.id;
    return { owner, author, stranger, p, id };
  }

  it('the author can delete their own comment', async () => {
    const { author, p, id } = await setUp();
    expect((await author.agent.delete(`/api/share/${p.token}/comments/${id}`)).status).toBe(204);
    expect((await request(t.app).get(`/api/share/${p.token}/comments`)).body.comments).toEqual([]);
  });

  it('the page owner can delete any comment on their page', async () => {
    const { owner, p, id } = await setUp();
    const asOwner = await owner.agent.get(`/api/share/${p.token}/comments`);
    expect(asOwner.body.comments[0]).toMatchObject({ canDelete: true, canHide: true, mine: false });
    expect((await owner.agent.delete(`/api/share/${p.token}/comments/${id}`)).status).toBe(204);
    expect(await t.db('comments').where({ id }).first()).toBeUndefined();
  });

  it('anyone else gets 403 (and a visitor 401); an unknown id is 404', async () => {
    const { stranger, p, id } = await setUp();
    const res = await stranger.agent.delete(`/api/share/${p.token}/comments/${id}`);
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/Only the person who wrote/);
    expect((await stranger.agent.patch(`/api/share/${p.token}/comments/${id}`).send({ hidden: true })).status).toBe(403);
    expect((await request(t.app).delete(`/api/share/${p.token}/comments/${id}`)).status).toBe(401);
    expect((await stranger.agent.delete(`/api/share/${p.token}/comments/999999`)).status).toBe(404);
    expect(await t.db('comments').where({ id }).first()).toBeDefined();
  });

  it('the owner can hide a comment: gone for everyone else, marked hidden for the owner, and can show it again', async () => {
    const { owner, author, p, id } = await setUp();
    const hid = await owner.agent.patch(`/api/share/${p.token}/comments/${id}`).send({ hidden: true });
    expect(hid.status).toBe(200);
    expect(hid.body.comment).toMatchObject({ hidden: true, hiddenByAdmin: false });
    expect((await request(t.app).get(`/api/share/${p.token}/comments`)).body.comments).toEqual([]);
    expect((await author.agent.get(`/api/share/${p.token}/comments`)).body.comments).toEqual([]);
    expect((await request(t.app).get(`/api/share/${p.token}`)).body.showcase.commentCount).toBe(0);
    const ownerView = await owner.agent.get(`/api/share/${p.token}/comments`);
    expect(ownerView.body.comments).toHaveLength(1);
    expect(ownerView.body.comments[0].hidden).toBe(true);
    // The author cannot hide (it is the owner's page), but can still delete their own words.
    expect((await author.agent.patch(`/api/share/${p.token}/comments/${id}`).send({ hidden: false })).status).toBe(403);
    expect((await owner.agent.patch(`/api/share/${p.token}/comments/${id}`).send({ hidden: false })).body.comment.hidden).toBe(false);
    expect((await request(t.app).get(`/api/share/${p.token}/comments`)).body.comments).toHaveLength(1);
    expect((await author.agent.delete(`/api/share/${p.token}/comments/${id}`)).status).toBe(204);
  });
});

describe('rate limit', () => {
  it('stops a member after the configured number of comments with 429 and a sentence', async () => {
    process.env.RATE_LIMIT_COMMENTS_PER_MEMBER = '3';
    const t2 = await createTestContext();
    delete process.env.RATE_LIMIT_COMMENTS_PER_MEMBER;
    try {
      const owner = await createTestUser(t2.db);
      const p = await createShowcaseProject(t2.db, owner.id);
      const a = await signedInAgent(t2.app, t2.db);
      const b = await signedInAgent(t2.app, t2.db);
      for (let i = 0; i < 3; i++) expect((await a.agent.post(`/api/share/${p.token}/comments`).send({ body: `Comment ${i}` })).status).toBe(201);
      const limited = await a.agent.post(`/api/share/${p.token}/comments`).send({ body: 'One more' });
      expect(limited.status).toBe(429);
      expect(limited.body.error).toMatch(/a lot of comments.*Wait \d+ minutes/);
      expect(limited.headers['retry-after']).toBeDefined();
      // Per member: someone else can still comment.
      expect((await b.agent.post(`/api/share/${p.token}/comments`).send({ body: 'Me too' })).status).toBe(201);
      expect(await t2.db('comments').where({ project_id: p.id }).count({ n: '*' }).first()).toEqual({ n: 4 });
    } finally {
      await t2.close();
    }
  });
});
