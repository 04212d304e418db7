import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { createShowcaseProject, PRIVATE_MARKERS, type ShowcaseFixture } from '../../factories/share.js';

// Everything a visitor can fetch about a shared project (the JSON view, the server-rendered page, comments, the
// maker profile), checked for what must never be there: e-mail addresses, the recipient ("who is it for?"),
// the maker's notes, journal entries and photos the owner did not put on the showcase, storage keys and row ids.

let t: TestContext;
let owner: Awaited<ReturnType<typeof signedInAgent>>;
let friend: Awaited<ReturnType<typeof signedInAgent>>;
let p: ShowcaseFixture;
let secrets: string[];
beforeAll(async () => {
  t = await createTestContext();
  owner = await signedInAgent(t.app, t.db, { displayName: 'Wren Hollow' });
  friend = await signedInAgent(t.app, t.db, { displayName: 'Pim Friend' });
  p = await createShowcaseProject(t.db, owner.user.id, { visibility: 'public' });
  expect((await friend.agent.post(`/api/share/${p.token}/comments`).send({ body: 'So round!' })).status).toBe(201);
  secrets = [owner.user.email, friend.user.email, ...Object.values(PRIVATE_MARKERS), p.coverKey, p.shownEntryPhotoKey, p.privateEntryPhotoKey, 'Receipt for the yarn'];
});
afterAll(() => t.close());

const EMAIL_RE = /[A-Za-z0-9._%+-]+@[A-Za-z0-9.-]+\.[A-Za-z]{2,}/;

function expectNothingPrivate(text: string) {
  for (const secret of secrets) expect(text).not.toContain(secret);
  expect(text).not.toMatch(EMAIL_RE);
}

describe('nothing private reaches a visitor', () => {
  it('the JSON view holds only the showcase’s own fields, for a visitor, a member and the owner alike', async () => {
    for (const who of [request(t.app), friend.agent, owner.agent]) {
      const body = (await who.get(`/api/share/${p.token}`)).body.showcase;
      expectNothingPrivate(JSON.stringify(body));
      // An explicit list, so a field added later has to be added here on purpose.
      expect(Object.keys(body).sort()).toEqual(
        ['cautions', 'changes', 'cheers', 'commentCount', 'finishedOn', 'journal', 'maker', 'materials', 'pattern', 'photos', 'pieces', 'placements', 'startedOn', 'status', 'statusLabel', 'title', 'token', 'url', 'viewer', 'visibility', 'workingMinutes'].sort(),
      );
      expect(Object.keys(body.photos[0]).sort()).toEqual(['alt', 'cover', 'height', 'id', 'thumbUrl', 'url', 'width']);
      expect(Object.keys(body.journal[0]).sort()).toEqual(['body', 'date', 'id', 'minutes', 'tags']);
      expect(Object.keys(body.maker).sort()).toEqual(['displayName', 'profileUrl']);
    }
  });

  it('only the owner is given the project’s id (to go back to it); a member and a visitor are not', async () => {
    const visitor = (await request(t.app).get(`/api/share/${p.token}`)).body.showcase.viewer;
    const member = (await friend.agent.get(`/api/share/${p.token}`)).body.showcase.viewer;
    const own = (await owner.agent.get(`/api/share/${p.token}`)).body.showcase.viewer;
    expect(visitor).toEqual({ signedIn: false, isOwner: false, ownerProjectId: null });
    expect(member).toEqual({ signedIn: true, isOwner: false, ownerProjectId: null });
    expect(own).toEqual({ signedIn: true, isOwner: true, ownerProjectId: p.id });
  });

  it('the server-rendered page carries none of it either, signed in or not', async () => {
    for (const who of [request(t.app), friend.agent, owner.agent]) {
      const html = (await who.get(`/p/${p.token}`)).text;
      expectNothingPrivate(html);
      expect(html).not.toContain('So round!');
    }
  });

  it('comments name their authors by display name only: no e-mail, no member ids', async () => {
    const text = JSON.stringify((await request(t.app).get(`/api/share/${p.token}/comments`)).body);
    expect(text).toContain('Pim Friend');
    expectNothingPrivate(text);
    expect(text).not.toContain(friend.user.id);
    expect(text).not.toContain(owner.user.id);
  });

  it('the maker profile lists pages by link, with no project ids, keys or addresses', async () => {
    const profile = (await request(t.app).get(`/api/makers/${owner.user.id}`)).body;
    const text = JSON.stringify(profile);
    expectNothingPrivate(text);
    expect(Object.keys(profile.projects[0]).sort()).toEqual(['cheerCount', 'cover', 'finishedOn', 'statusLabel', 'title', 'url']);
    expect(profile.projects[0].url).toBe(`/p/${p.token}`);
    const html = (await request(t.app).get(`/m/${owner.user.id}`)).text;
    expectNothingPrivate(html);
  });

  it('a retired link’s page, view and photos say nothing about the project', async () => {
    const q = await createShowcaseProject(t.db, owner.user.id, { title: 'Hush the hedgehog' });
    const photos: Array<{ url: string }> = (await request(t.app).get(`/api/share/${q.token}`)).body.showcase.photos;
    expect((await owner.agent.post(`/api/projects/${q.id}/share-link`).send({})).status).toBe(200);
    const page = await request(t.app).get(`/p/${q.token}`);
    expect(page.status).toBe(404);
    expect(page.text).not.toContain('Hush the hedgehog');
    const view = await request(t.app).get(`/api/share/${q.token}`);
    expect(view.status).toBe(404);
    expect(JSON.stringify(view.body)).not.toContain('Hush');
    for (const photo of photos) {
      const res = await request(t.app).get(photo.url);
      expect(res.status).toBe(404);
      expect(JSON.stringify(res.body)).not.toContain('Hush');
    }
  });
});
