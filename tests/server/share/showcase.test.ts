import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser, signedInAgent } from '../../factories/users.js';
import { createShowcaseProject, PRIVATE_MARKERS, type ShowcaseFixture } from '../../factories/share.js';
import { placementText } from '../../../server/services/share.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

const EMAIL_RE = /[A-Za-z0-9._%+-]+@[A-Za-z0-9.-]+\.[A-Za-z]{2,}/;

describe('GET /api/share/:token — each visibility', () => {
  it('shows a link-shared project to a signed-out visitor', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id, { visibility: 'link' });
    const res = await request(t.app).get(`/api/share/${p.token}`);
    expect(res.status).toBe(200);
    expect(res.body.showcase.title).toMatch(/Moss the hedgehog/);
    expect(res.body.showcase.visibility).toBe('link');
    expect(res.body.showcase.viewer).toEqual({ signedIn: false, isOwner: false, ownerProjectId: null });
  });

  it('shows a public project too, and lists it on the maker profile', async () => {
    const owner = await createTestUser(t.db, { displayName: 'Juniper Ash' });
    const pub = await createShowcaseProject(t.db, owner.id, { visibility: 'public', title: 'Public hedgehog' });
    await createShowcaseProject(t.db, owner.id, { visibility: 'link', title: 'Unlisted hedgehog' });
    await createShowcaseProject(t.db, owner.id, { visibility: 'private', title: 'Secret hedgehog' });

    const res = await request(t.app).get(`/api/share/${pub.token}`);
    expect(res.status).toBe(200);
    expect(res.body.showcase.maker).toEqual({ displayName: 'Juniper Ash', profileUrl: `/m/${owner.id}` });

    const profile = await request(t.app).get(`/api/makers/${owner.id}`);
    expect(profile.status).toBe(200);
    expect(profile.body.maker.displayName).toBe('Juniper Ash');
    expect(profile.body.projects.map((x: { title: string }) => x.title)).toEqual(['Public hedgehog']);
    expect(profile.body.projects[0].url).toBe(`/p/${pub.token}`);
    expect(JSON.stringify(profile.body)).not.toMatch(EMAIL_RE);
  });

  it('answers 404 for a private project, an unknown token and a malformed one', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id, { visibility: 'private' });
    for (const token of [p.token, 'A'.repeat(24), '../../etc']) {
      const res = await request(t.app).get(`/api/share/${encodeURIComponent(token)}`);
      expect(res.status).toBe(404);
      expect(res.body.error).toBe('That page could not be found.');
    }
  });

  it('does not list a maker with no public project (link-only pages stay unlisted)', async () => {
    const owner = await createTestUser(t.db);
    await createShowcaseProject(t.db, owner.id, { visibility: 'link' });
    expect((await request(t.app).get(`/api/makers/${owner.id}`)).status).toBe(404);
    const shared = await createShowcaseProject(t.db, owner.id, { visibility: 'link' });
    const res = await request(t.app).get(`/api/share/${shared.token}`);
    expect(res.body.showcase.maker.profileUrl).toBeNull();
  });

  it('closes the page when the maker’s account is disabled', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id);
    await t.db('users').where({ id: owner.id }).update({ disabled_at: new Date().toISOString() });
    expect((await request(t.app).get(`/api/share/${p.token}`)).status).toBe(404);
  });
});

describe('what the public view holds', () => {
  let body: any;
  let token: string;
  let ownerEmail: string;
  let fixture: ShowcaseFixture;
  beforeAll(async () => {
    const owner = await createTestUser(t.db, { displayName: 'Rowan Tull' });
    ownerEmail = owner.email;
    // Someone else's project first, so this fixture's row ids cannot coincide with positions.
    await createShowcaseProject(t.db, (await createTestUser(t.db)).id);
    const p = await createShowcaseProject(t.db, owner.id);
    fixture = p;
    token = p.token;
    body = (await request(t.app).get(`/api/share/${p.token}`)).body.showcase;
  });

  it('names the maker by display name and never carries an e-mail address', () => {
    expect(body.maker.displayName).toBe('Rowan Tull');
    const text = JSON.stringify(body);
    expect(text).not.toContain(ownerEmail);
    expect(text).not.toMatch(EMAIL_RE);
  });

  it('leaves out the recipient, the maker’s notes and every journal entry not marked for the showcase', () => {
    const text = JSON.stringify(body);
    for (const secret of Object.values(PRIVATE_MARKERS)) expect(text).not.toContain(secret);
    expect(body.journal.map((e: { body: string }) => e.body)).toEqual(['Body done, **so round**.']);
  });

  it('lists the changes from the pattern from entries tagged "change" that the owner marked', () => {
    expect(body.changes).toEqual([{ id: expect.any(Number), date: '2026-11-07', body: 'Worked Rnds 7–12 with a 3.25 mm hook for a firmer fabric.' }]);
  });

  it('credits the pattern with its designer and source link', () => {
    expect(body.pattern).toEqual({ title: 'Round-back hedgehog', designerCredit: 'Pip & Bramble Studio', sourceUrl: 'https://patterns.example/hedgehog' });
  });

  it('gives status, dates and the working time summed over all journal minutes', () => {
    expect(body.status).toBe('finished');
    expect(body.statusLabel).toBe('Finished');
    expect(body.startedOn).toBe('2026-11-02');
    expect(body.finishedOn).toBe('2026-11-20');
    expect(body.workingMinutes).toBe(60 + 30 + 45);
  });

  it('describes yarns by CYC weight and amount, hooks in mm with the US size, and notions', () => {
    // Source: Craft Yarn Council, Standard Yarn Weight System — category 3 is "DK, Light".
    expect(body.materials.yarns[0]).toEqual({ name: 'Cotton 8', colour: 'Moss green', fibre: 'cotton', weight: { category: 3, label: 'DK, Light (3)', approximate: false }, amount: '1.5 skeins' });
    // 8 ply maps to category 3 by convention, not a standard, hence "approximate"; 40 m ÷ 0.9144 = 43.7 yd.
    expect(body.materials.yarns[1].weight).toEqual({ category: 3, label: 'DK, Light (3)', approximate: true });
    expect(body.materials.yarns[1].amount).toBe('40 m (44 yd)');
    // Source: Craft Yarn Council hook chart — 3.5 mm is US E-4; 2.5 mm has no US size.
    expect(body.materials.hooks).toEqual([
      { mm: 3.5, us: 'E-4', note: null },
      { mm: 2.5, us: null, note: 'for the nose' },
    ]);
    expect(body.materials.notions[0]).toEqual({ kind: 'safety_eyes', label: 'Safety eyes', sizeMm: 8, quantity: 2, note: null });
  });

  it('lists pieces with copies and placements in words', () => {
    expect(body.pieces).toEqual([
      { name: 'Body', copies: 1 },
      { name: 'Ear', copies: 2 },
    ]);
    expect(body.placements.map((p: { text: string }) => p.text)).toEqual([
      'Left eye: Body, between Rnds 9 and 10, at stitch 14 — 6 stitches apart',
      'Ear: Ear (copy 2), between Rnds 2 and 3',
    ]);
  });

  it('words a mark in the first round without a round before it', () => {
    expect(placementText({ label: 'Nose', piece: 'Head', copy: 1, copies: 1, round: 1, step: 3, note: null })).toBe('Nose: Head, in Rnd 1, at stitch 3');
  });

  it('shows the cover first, then project photos and photos of marked entries — never those of private entries', () => {
    expect(body.photos.map((p: { alt: string }) => p.alt)).toEqual(['Moss the hedgehog on a windowsill', 'The body after stuffing']);
    expect(body.photos[0].cover).toBe(true);
    // Photo URLs go through this link, never the owner's own /media/photos/<key> URL.
    expect(body.photos[0].url).toMatch(new RegExp(`^/media/shared/${token}/[A-Za-z0-9_-]{24}/display\\.jpg$`));
    expect(body.photos[0].thumbUrl).toMatch(new RegExp(`^/media/shared/${token}/[A-Za-z0-9_-]{24}/thumb\\.jpg$`));
    expect(JSON.stringify(body)).not.toContain('Receipt for the yarn');
    for (const key of [fixture.coverKey, fixture.shownEntryPhotoKey, fixture.privateEntryPhotoKey]) expect(JSON.stringify(body)).not.toContain(key);
  });

  it('numbers photos and journal entries by position, never by their row ids', async () => {
    expect(body.photos.map((p: { id: number }) => p.id)).toEqual([1, 2]);
    expect([...body.journal, ...body.changes].map((e: { id: number }) => e.id).sort()).toEqual([1, 2]);
    // The fixture's rows come after others' in this database, so their real ids are larger than any position.
    const entryIds: number[] = await t.db('journal_entries').where({ project_id: fixture.id }).pluck('id');
    const photoIds: number[] = await t.db('photos').where({ project_id: fixture.id }).pluck('id');
    expect(Math.min(...entryIds, ...photoIds, fixture.id)).toBeGreaterThan(2);
    expect(JSON.stringify(body)).not.toMatch(new RegExp(`"id":(${[...entryIds, ...photoIds, fixture.id].join('|')})[,}]`));
  });

  it('carries the small-parts caution because the project uses safety eyes', () => {
    expect(body.cautions.map((c: { code: string }) => c.code)).toEqual(['small-parts']);
  });

  it('gives an absolute link to itself', () => {
    expect(body.url).toMatch(new RegExp(`^http://127\\.0\\.0\\.1(:\\d+)?/p/${token}$`));
  });

  it('adds the young-child caution when the project is for a child under 3', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id, { forYoungChild: true });
    const res = await request(t.app).get(`/api/share/${p.token}`);
    expect(res.body.showcase.cautions.map((c: { code: string }) => c.code)).toEqual(['small-parts', 'young-child']);
  });

  it('never turns a non-http source into a link', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id, { patternCredit: { title: 'Sneaky', designerCredit: null, sourceUrl: 'javascript:alert(1)' } });
    const res = await request(t.app).get(`/api/share/${p.token}`);
    expect(res.body.showcase.pattern).toEqual({ title: 'Sneaky', designerCredit: null, sourceUrl: null });
  });
});

describe('sharing and retiring links (owner only)', () => {
  it('PATCH visibility to link gives a /p/ link that works, and private closes it at once', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const p = await createShowcaseProject(t.db, user.id, { visibility: 'private' });
    await t.db('projects').where({ id: p.id }).update({ share_token: null });

    const shared = await agent.patch(`/api/projects/${p.id}`).send({ visibility: 'link' });
    expect(shared.status).toBe(200);
    const url: string = shared.body.project.shareUrl;
    expect(url).toMatch(/\/p\/[A-Za-z0-9_-]{22,}$/);
    const token = url.split('/p/')[1]!;
    // At least 128 random bits: 22+ base64url characters carry 132+ bits.
    expect(token.length).toBeGreaterThanOrEqual(22);
    expect((await request(t.app).get(`/api/share/${token}`)).status).toBe(200);

    const closed = await agent.patch(`/api/projects/${p.id}`).send({ visibility: 'private' });
    expect(closed.body.project.shareUrl).toBeNull();
    expect((await request(t.app).get(`/api/share/${token}`)).status).toBe(404);
    expect((await request(t.app).get(`/p/${token}`)).status).toBe(404);
  });

  it('a new link retires the old one at once and answers with the project and the new shareUrl', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const p = await createShowcaseProject(t.db, user.id, { visibility: 'link' });
    const res = await agent.post(`/api/projects/${p.id}/share-link`).send({});
    expect(res.status).toBe(200);
    expect(res.body.project.id).toBe(p.id);
    const fresh = res.body.shareUrl.split('/p/')[1];
    expect(fresh).not.toBe(p.token);
    expect(res.body.project.shareUrl.endsWith(`/p/${fresh}`)).toBe(true);
    expect((await request(t.app).get(`/api/share/${p.token}`)).status).toBe(404);
    expect((await request(t.app).get(`/p/${p.token}`)).status).toBe(404);
    expect((await request(t.app).get(`/api/share/${fresh}`)).status).toBe(200);
  });

  it('refuses a new link for someone else’s project (404) and for a visitor (401)', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id);
    const { agent } = await signedInAgent(t.app, t.db);
    expect((await agent.post(`/api/projects/${p.id}/share-link`).send({})).status).toBe(404);
    expect((await request(t.app).post(`/api/projects/${p.id}/share-link`).send({})).status).toBe(401);
    expect((await agent.get(`/api/projects/${p.id}/share`)).status).toBe(404);
    expect((await request(t.app).get(`/api/share/${p.token}`)).status).toBe(200);
  });

  it('tells the owner where the page stands', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const p = await createShowcaseProject(t.db, user.id, { visibility: 'public' });
    const res = await agent.get(`/api/projects/${p.id}/share`);
    expect(res.status).toBe(200);
    // Three photos, but the one on the private entry is not on the page.
    expect(res.body.share).toMatchObject({ visibility: 'public', sharePath: `/p/${p.token}`, profilePath: `/m/${user.id}`, hiddenByAdmin: false, cheerCount: 0, commentCount: 0, shownEntryCount: 2, photoCount: 2, coverHidden: false });
  });
});

describe('cheers', () => {
  it('needs sign-in, adds one cheer per member (twice is still one) and can be taken back', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id);
    expect((await request(t.app).post(`/api/share/${p.token}/cheer`).send({})).status).toBe(401);
    const a = await signedInAgent(t.app, t.db);
    const b = await signedInAgent(t.app, t.db);
    expect((await a.agent.post(`/api/share/${p.token}/cheer`).send({})).body.cheers).toEqual({ count: 1, cheered: true });
    expect((await a.agent.post(`/api/share/${p.token}/cheer`).send({})).body.cheers).toEqual({ count: 1, cheered: true });
    expect((await b.agent.post(`/api/share/${p.token}/cheer`).send({})).body.cheers).toEqual({ count: 2, cheered: true });
    expect((await a.agent.get(`/api/share/${p.token}`)).body.showcase.cheers).toEqual({ count: 2, cheered: true });
    expect((await request(t.app).get(`/api/share/${p.token}`)).body.showcase.cheers).toEqual({ count: 2, cheered: false });
    expect((await a.agent.delete(`/api/share/${p.token}/cheer`)).body.cheers).toEqual({ count: 1, cheered: false });
  });

  it('cannot cheer a private page', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id, { visibility: 'private' });
    const a = await signedInAgent(t.app, t.db);
    expect((await a.agent.post(`/api/share/${p.token}/cheer`).send({})).status).toBe(404);
  });
});

describe('share settings', () => {
  it('turns comment e-mails off and on again', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    expect((await agent.get('/api/share-settings')).body.settings).toEqual({ notifyComments: true });
    expect((await agent.patch('/api/share-settings').send({ notifyComments: false })).body.settings).toEqual({ notifyComments: false });
    expect((await agent.get('/api/share-settings')).body.settings).toEqual({ notifyComments: false });
    expect((await agent.patch('/api/share-settings').send({ notifyComments: 'no' })).status).toBe(422);
    expect((await request(t.app).get('/api/share-settings')).status).toBe(401);
  });
});
