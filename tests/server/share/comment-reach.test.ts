import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { createShowcaseProject } from '../../factories/share.js';

// A comment (and a report about one) is reached only through the page it is on: the route or the report carries the
// page's link token, the comment must belong to that page's project, and the page must be open. Anything else is
// the same 404 as an id that does not exist, so a member stepping through ids learns nothing about other pages,
// unlisted (link-only) ones above all.

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

type Agent = Awaited<ReturnType<typeof signedInAgent>>;

/** Two open pages: a public one the stranger knows, and an unlisted one they were never sent, each with a comment. */
async function twoPages() {
  const known = await signedInAgent(t.app, t.db, { displayName: 'Known Kit' });
  const knownPage = await createShowcaseProject(t.db, known.user.id, { visibility: 'public' });
  const unlisted = await signedInAgent(t.app, t.db, { displayName: 'Unlisted Una' });
  const unlistedPage = await createShowcaseProject(t.db, unlisted.user.id, { visibility: 'link' });
  const author = await signedInAgent(t.app, t.db, { displayName: 'Author Ash' });
  const stranger = await signedInAgent(t.app, t.db, { displayName: 'Stranger Sol' });
  const post = async (who: Agent, token: string, body: string) => {
    const res = await who.agent.post(`/api/share/${token}/comments`).send({ body });
    expect(res.status).toBe(201);
    return res.body.comment.id as number;
  };
  const knownComment = await post(author, knownPage.token, 'Lovely ears');
  const unlistedComment = await post(author, unlistedPage.token, 'Only for friends with the link');
  // An id no comment has: one past the highest, so it is "unknown" for sure.
  const { max } = (await t.db('comments').max({ max: 'id' }).first()) as { max: number };
  return { known, knownPage, unlisted, unlistedPage, author, stranger, knownComment, unlistedComment, unknownId: max + 1000 };
}

const answer = (res: request.Response) => ({ status: res.status, body: res.body as unknown });

describe('a comment is only reachable through its own page', () => {
  it('a comment id from another page gets the same 404 as an unknown id, for delete, hide and report', async () => {
    const s = await twoPages();
    const viaKnown = (id: number) => `/api/share/${s.knownPage.token}/comments/${id}`;

    for (const who of [s.stranger, s.known]) {
      const unknownDelete = answer(await who.agent.delete(viaKnown(s.unknownId)));
      expect(unknownDelete).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });
      expect(answer(await who.agent.delete(viaKnown(s.unlistedComment)))).toEqual(unknownDelete);

      const unknownHide = answer(await who.agent.patch(viaKnown(s.unknownId)).send({ hidden: true }));
      expect(unknownHide).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });
      expect(answer(await who.agent.patch(viaKnown(s.unlistedComment)).send({ hidden: true }))).toEqual(unknownHide);

      const unknownReport = answer(await who.agent.post('/api/reports').send({ shareToken: s.knownPage.token, commentId: s.unknownId, reason: 'Looks wrong' }));
      expect(unknownReport).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });
      const crossReport = answer(await who.agent.post('/api/reports').send({ shareToken: s.knownPage.token, commentId: s.unlistedComment, reason: 'Looks wrong' }));
      expect(crossReport).toEqual(unknownReport);
    }

    // Not even the comment's own author reaches it through another page's link.
    expect(answer(await s.author.agent.delete(viaKnown(s.unlistedComment)))).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });

    // Nothing changed: the comment is still there, still shown, and nobody reported it.
    const row = await t.db('comments').where({ id: s.unlistedComment }).first();
    expect(row).toMatchObject({ hidden_at: null });
    expect(await t.db('reports').where({ comment_id: s.unlistedComment }).count({ n: '*' }).first()).toEqual({ n: 0 });
    expect((await request(t.app).get(`/api/share/${s.unlistedPage.token}/comments`)).body.comments).toHaveLength(1);
  });

  it("an unlisted page's comment cannot be reported without its token, and can with it", async () => {
    const s = await twoPages();
    const reason = 'Rude words';
    // By id alone (the published shape), an unknown comment is not found, like one on a page that is not shared.
    const idAlone = await s.stranger.agent.post('/api/reports').send({ commentId: s.unknownId, reason });
    expect(answer(idAlone)).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });
    // With another page's token, or a made-up one of the right shape.
    const cross = await s.stranger.agent.post('/api/reports').send({ shareToken: s.knownPage.token, commentId: s.unlistedComment, reason });
    expect(answer(cross)).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });
    const madeUp = await s.stranger.agent.post('/api/reports').send({ shareToken: 'A'.repeat(24), commentId: s.unlistedComment, reason });
    expect(answer(madeUp)).toEqual({ status: 404, body: { error: 'That page could not be found.' } });
    // The page answer does not depend on the comment id either.
    const madeUpUnknown = await s.stranger.agent.post('/api/reports').send({ shareToken: 'A'.repeat(24), commentId: s.unknownId, reason });
    expect(answer(madeUpUnknown)).toEqual(answer(madeUp));
    expect(await t.db('reports').where({ reporter_id: s.stranger.user.id }).count({ n: '*' }).first()).toEqual({ n: 0 });

    // A friend who was sent the link can report it; the admins see it against the right page.
    const withToken = await s.stranger.agent.post('/api/reports').send({ shareToken: s.unlistedPage.token, commentId: s.unlistedComment, reason });
    expect(withToken.status).toBe(201);
    const stored = await t.db('reports').where({ id: withToken.body.report.id }).first();
    expect(stored).toMatchObject({ target: 'comment', comment_id: s.unlistedComment, project_id: s.unlistedPage.id, reason });
  });

  it('a hidden comment is the same 404 for anyone but its author and the page owner; a shown one tells them why not (403)', async () => {
    const s = await twoPages();
    const url = `/api/share/${s.knownPage.token}/comments/${s.knownComment}`;
    const unknown = answer(await s.stranger.agent.delete(`/api/share/${s.knownPage.token}/comments/${s.unknownId}`));

    // While the comment is on the page for everyone to read, saying it exists reveals nothing.
    const shown = await s.stranger.agent.delete(url);
    expect(shown.status).toBe(403);
    expect(shown.body.error).toMatch(/Only the person who wrote a comment, or the owner of the page/);

    expect((await s.known.agent.patch(url).send({ hidden: true })).status).toBe(200);
    expect(answer(await s.stranger.agent.delete(url))).toEqual(unknown);
    expect(answer(await s.stranger.agent.patch(url).send({ hidden: false }))).toEqual(unknown);
    const report = await s.stranger.agent.post('/api/reports').send({ shareToken: s.knownPage.token, commentId: s.knownComment, reason: 'Saw it earlier' });
    expect(answer(report)).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });
    expect((await t.db('comments').where({ id: s.knownComment }).first()).hidden_at).not.toBeNull();
  });

  it('a retired or private link reaches no comment; the new link does', async () => {
    const s = await twoPages();
    const oldToken = s.knownPage.token;
    const rotated = await s.known.agent.post(`/api/projects/${s.knownPage.id}/share-link`).send({});
    expect(rotated.status).toBe(200);
    const newToken = (rotated.body.shareUrl as string).split('/p/')[1];
    expect(newToken).not.toBe(oldToken);

    // Through the old link: the page is gone, for the owner too, whatever the id.
    const gone = { status: 404, body: { error: 'That page could not be found.' } };
    expect(answer(await s.known.agent.patch(`/api/share/${oldToken}/comments/${s.knownComment}`).send({ hidden: true }))).toEqual(gone);
    expect(answer(await s.author.agent.delete(`/api/share/${oldToken}/comments/${s.knownComment}`))).toEqual(gone);
    expect(answer(await s.author.agent.delete(`/api/share/${oldToken}/comments/${s.unknownId}`))).toEqual(gone);
    expect(answer(await s.stranger.agent.post('/api/reports').send({ shareToken: oldToken, commentId: s.knownComment, reason: 'Old link' }))).toEqual(gone);

    expect((await s.known.agent.patch(`/api/share/${newToken}/comments/${s.knownComment}`).send({ hidden: true })).body.comment.hidden).toBe(true);

    await s.known.agent.patch(`/api/projects/${s.knownPage.id}`).send({ visibility: 'private' });
    expect(answer(await s.known.agent.patch(`/api/share/${newToken}/comments/${s.knownComment}`).send({ hidden: false }))).toEqual(gone);
    expect(await t.db('comments').where({ id: s.knownComment }).first()).toMatchObject({ hidden_by: s.known.user.id });
  });

  it('DELETE /api/comments/:id (the published shape) is for the author and the page owner; anyone else gets the unknown-id 404', async () => {
    const s = await twoPages();
    const unknown = answer(await s.stranger.agent.delete(`/api/comments/${s.unknownId}`));
    expect(unknown).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });
    // A stranger and another page's owner cannot tell an existing comment from a missing one.
    expect(answer(await s.stranger.agent.delete(`/api/comments/${s.unlistedComment}`))).toEqual(unknown);
    expect(answer(await s.known.agent.delete(`/api/comments/${s.unlistedComment}`))).toEqual(unknown);
    expect(await t.db('comments').where({ id: s.unlistedComment }).first()).toBeDefined();
    // Hiding has no id-only route: it goes through the page.
    expect((await s.unlisted.agent.patch(`/api/comments/${s.unlistedComment}`).send({ hidden: true })).status).toBe(404);
    expect(await t.db('comments').where({ id: s.unlistedComment }).first()).toMatchObject({ hidden_at: null });
    // The page owner and the author may delete.
    expect((await s.unlisted.agent.delete(`/api/comments/${s.unlistedComment}`)).status).toBe(204);
    expect((await s.author.agent.delete(`/api/comments/${s.knownComment}`)).status).toBe(204);
    expect(await t.db('comments').whereIn('id', [s.unlistedComment, s.knownComment])).toEqual([]);
  });
});

describe('the people a comment belongs to keep their controls, through the page', () => {
  it('the owner hides, shows again and deletes a comment on their unlisted page', async () => {
    const s = await twoPages();
    const url = `/api/share/${s.unlistedPage.token}/comments/${s.unlistedComment}`;
    const hid = await s.unlisted.agent.patch(url).send({ hidden: true });
    expect(hid.status).toBe(200);
    expect(hid.body.comment).toMatchObject({ id: s.unlistedComment, hidden: true, hiddenByAdmin: false, canHide: true, canDelete: true });
    expect((await request(t.app).get(`/api/share/${s.unlistedPage.token}/comments`)).body.comments).toEqual([]);
    expect((await s.unlisted.agent.patch(url).send({ hidden: false })).body.comment.hidden).toBe(false);
    expect((await s.unlisted.agent.delete(url)).status).toBe(204);
    expect(await t.db('comments').where({ id: s.unlistedComment }).first()).toBeUndefined();
  });

  it('the author deletes their own comment, even after the owner hid it, but cannot hide it', async () => {
    const s = await twoPages();
    const url = `/api/share/${s.knownPage.token}/comments/${s.knownComment}`;
    expect((await s.author.agent.patch(url).send({ hidden: true })).status).toBe(403);
    expect((await s.known.agent.patch(url).send({ hidden: true })).status).toBe(200);
    expect((await s.author.agent.delete(url)).status).toBe(204);
    expect(await t.db('comments').where({ id: s.knownComment }).first()).toBeUndefined();
    // Deleted is now the same as never there.
    expect(answer(await s.author.agent.delete(url))).toEqual({ status: 404, body: { error: 'That comment could not be found.' } });
  });

  it('a visitor who is not signed in is asked to sign in (401) before anything is looked up', async () => {
    const s = await twoPages();
    expect((await request(t.app).delete(`/api/share/${s.knownPage.token}/comments/${s.knownComment}`)).status).toBe(401);
    expect((await request(t.app).delete(`/api/share/${s.knownPage.token}/comments/${s.unknownId}`)).status).toBe(401);
    expect((await request(t.app).patch(`/api/share/${s.knownPage.token}/comments/${s.knownComment}`).send({ hidden: true })).status).toBe(401);
  });
});
