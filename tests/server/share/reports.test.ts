import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser, signedInAgent } from '../../factories/users.js';
import { createShowcaseProject } from '../../factories/share.js';

let t: TestContext;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  t = await createTestContext();
  admin = await signedInAgent(t.app, t.db, { role: 'admin', displayName: 'Admin Ada' });
});
afterAll(() => t.close());

async function pageWithComment(body = 'Buy cheap yarn at spam.example') {
  const owner = await signedInAgent(t.app, t.db, { displayName: 'Owner Oak' });
  const p = await createShowcaseProject(t.db, owner.user.id);
  const commenter = await signedInAgent(t.app, t.db, { displayName: 'Spammy Sam' });
  const commentId: number = (await commenter.agent.post(`/api/share/${p.token}/comments`).send({ body })).body.comment.id;
  return { owner, p, commenter, commentId };
}

describe('POST /api/reports', () => {
  it('asks a visitor to sign in (401 with a sentence)', async () => {
    const { p, commentId } = await pageWithComment();
    const res = await request(t.app).post('/api/reports').send({ shareToken: p.token, commentId, reason: 'spam' });
    expect(res.status).toBe(401);
    expect(res.body.error).toMatch(/sign in to report/i);
  });

  it('lets any member report a comment or a page, once per open report', async () => {
    const { p, commentId } = await pageWithComment();
    const member = await signedInAgent(t.app, t.db);
    const first = await member.agent.post('/api/reports').send({ shareToken: p.token, commentId, reason: 'Advertising' });
    expect(first.status).toBe(201);
    expect(first.body.report).toEqual({ id: expect.any(Number), status: 'open' });
    const again = await member.agent.post('/api/reports').send({ shareToken: p.token, commentId, reason: 'Advertising again' });
    expect(again.status).toBe(200);
    expect(again.body.report.id).toBe(first.body.report.id);
    const page = await member.agent.post('/api/reports').send({ shareToken: p.token, reason: 'Not a crochet piece' });
    expect(page.status).toBe(201);
  });

  it('refuses a missing reason or page, and things the member cannot see (404)', async () => {
    const { p, commentId } = await pageWithComment();
    const member = await signedInAgent(t.app, t.db);
    expect((await member.agent.post('/api/reports').send({ shareToken: p.token, commentId })).status).toBe(422);
    // Neither a page nor a comment names nothing.
    const nothing = await member.agent.post('/api/reports').send({ reason: 'Looks wrong' });
    expect(nothing.status).toBe(422);
    expect(nothing.body.issues).toContainEqual({ path: 'shareToken', message: 'Say which page or comment this is about.' });
    // A bare comment id (the published shape) finds nothing on a page that is no longer shared.
    await t.db('projects').where({ id: p.id }).update({ visibility: 'private' });
    expect(await member.agent.post('/api/reports').send({ commentId, reason: 'Looks wrong' })).toMatchObject({ status: 404, body: { error: 'That comment could not be found.' } });
    await t.db('projects').where({ id: p.id }).update({ visibility: 'link' });
    const owner = await createTestUser(t.db);
    const priv = await createShowcaseProject(t.db, owner.id, { visibility: 'private' });
    expect((await member.agent.post('/api/reports').send({ shareToken: priv.token, reason: 'Looks wrong' })).status).toBe(404);
    expect((await member.agent.post('/api/reports').send({ shareToken: p.token, commentId: 999999, reason: 'Looks wrong' })).status).toBe(404);
    expect(await t.db('reports').where({ reporter_id: member.user.id }).count({ n: '*' }).first()).toEqual({ n: 0 });
  });
});

describe('the admins’ report queue', () => {
  it('is for admins only: a member gets 403, a visitor 401', async () => {
    const member = await signedInAgent(t.app, t.db);
    expect((await member.agent.get('/api/admin/reports')).status).toBe(403);
    expect((await member.agent.post('/api/admin/reports/1/resolve').send({ action: 'dismiss' })).status).toBe(403);
    expect((await request(t.app).get('/api/admin/reports')).status).toBe(401);
  });

  it('lists open reports with what was reported, and hiding a comment closes every report on it', async () => {
    const { p, commentId, owner } = await pageWithComment('Visit spam.example <b>now</b>');
    const r1 = await signedInAgent(t.app, t.db, { displayName: 'Reporter One' });
    const r2 = await signedInAgent(t.app, t.db, { displayName: 'Reporter Two' });
    const id1 = (await r1.agent.post('/api/reports').send({ shareToken: p.token, commentId, reason: 'Spam link' })).body.report.id;
    await r2.agent.post('/api/reports').send({ shareToken: p.token, commentId, reason: 'Advertising' });

    const list = await admin.agent.get('/api/admin/reports');
    expect(list.status).toBe(200);
    const mine = list.body.reports.find((r: { id: number }) => r.id === id1);
    expect(mine).toMatchObject({
      target: 'comment',
      reason: 'Spam link',
      status: 'open',
      reporter: { displayName: 'Reporter One' },
      page: { title: expect.stringMatching(/hedgehog/), path: `/p/${p.token}`, ownerDisplayName: 'Owner Oak', hidden: false },
      comment: { id: commentId, body: 'Visit spam.example <b>now</b>', authorDisplayName: 'Spammy Sam', hidden: false },
      openReportsOnTarget: 2,
    });
    expect(JSON.stringify(list.body)).not.toMatch(/@example\.com/);

    const resolved = await admin.agent.post(`/api/admin/reports/${id1}/resolve`).send({ action: 'hide' });
    expect(resolved.status).toBe(200);
    expect(resolved.body.report).toMatchObject({ status: 'hidden', handledBy: { displayName: 'Admin Ada' }, comment: { hidden: true } });
    expect((await request(t.app).get(`/api/share/${p.token}/comments`)).body.comments).toEqual([]);
    const open = (await admin.agent.get('/api/admin/reports')).body.reports.filter((r: { comment: { id: number } | null }) => r.comment?.id === commentId);
    expect(open).toEqual([]);
    const handled = (await admin.agent.get('/api/admin/reports?status=handled')).body.reports.filter((r: { comment: { id: number } | null }) => r.comment?.id === commentId);
    expect(handled.map((r: { status: string }) => r.status)).toEqual(['hidden', 'hidden']);

    // The owner sees it marked as hidden by an admin and cannot show it again.
    const ownerView = await owner.agent.get(`/api/share/${p.token}/comments`);
    expect(ownerView.body.comments[0]).toMatchObject({ hidden: true, hiddenByAdmin: true });
    const unhide = await owner.agent.patch(`/api/share/${p.token}/comments/${commentId}`).send({ hidden: false });
    expect(unhide.status).toBe(409);
    expect(unhide.body.error).toMatch(/admin hid this comment/);

    expect((await admin.agent.post(`/api/admin/reports/${id1}/resolve`).send({ action: 'dismiss' })).status).toBe(409);
  });

  it('hiding a page takes the whole showcase down, and the owner cannot reopen it with a new link', async () => {
    const { owner, p } = await pageWithComment('Fine comment');
    const reporter = await signedInAgent(t.app, t.db);
    const id = (await reporter.agent.post('/api/reports').send({ shareToken: p.token, reason: 'Copied photos' })).body.report.id;
    const res = await admin.agent.post(`/api/admin/reports/${id}/resolve`).send({ action: 'hide' });
    expect(res.status).toBe(200);
    expect(res.body.report.page.hidden).toBe(true);
    expect((await request(t.app).get(`/api/share/${p.token}`)).status).toBe(404);
    expect((await request(t.app).get(`/p/${p.token}`)).status).toBe(404);
    const status = await owner.agent.get(`/api/projects/${p.id}/share`);
    expect(status.body.share).toMatchObject({ hiddenByAdmin: true, shareUrl: null });
    const again = await owner.agent.post(`/api/projects/${p.id}/share-link`).send({});
    expect(again.status).toBe(409);
  });

  it('dismissing leaves the comment up', async () => {
    const { p, commentId } = await pageWithComment('Just a nice comment');
    const reporter = await signedInAgent(t.app, t.db);
    const id = (await reporter.agent.post('/api/reports').send({ shareToken: p.token, commentId, reason: 'I misread it' })).body.report.id;
    const res = await admin.agent.post(`/api/admin/reports/${id}/resolve`).send({ action: 'dismiss' });
    expect(res.body.report.status).toBe('dismissed');
    expect((await request(t.app).get(`/api/share/${p.token}/comments`)).body.comments).toHaveLength(1);
    expect((await admin.agent.post(`/api/admin/reports/${id}/resolve`).send({ action: 'erase' })).status).toBe(422);
  });
});
