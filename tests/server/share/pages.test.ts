import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser, signedInAgent } from '../../factories/users.js';
import { createShowcaseProject, PRIVATE_MARKERS } from '../../factories/share.js';
import { sharedPhotoRef } from '../../../server/services/share.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

const EMAIL_RE = /[A-Za-z0-9._%+-]+@[A-Za-z0-9.-]+\.[A-Za-z]{2,}/;

/** The content of <meta property|name="key" content="…">, still escaped as sent. */
function meta(html: string, key: string) {
  const m = html.match(new RegExp(`<meta (?:property|name)="${key.replace(/[:]/g, '\\:')}" content="([^"]*)"`));
  return m?.[1];
}

describe('GET /p/:token (server-rendered head for link previews)', () => {
  it('writes the title, description, canonical link, Open Graph and Twitter card tags', async () => {
    const owner = await createTestUser(t.db, { displayName: 'Tamsin Ode' });
    const p = await createShowcaseProject(t.db, owner.id, { title: 'Moss the hedgehog' });
    const res = await request(t.app).get(`/p/${p.token}`).set('Host', 'share.example:8080');
    expect(res.status).toBe(200);
    expect(res.type).toBe('text/html');
    const html = res.text;
    expect(html).toContain('<title>Moss the hedgehog by Tamsin Ode · Whorlbook</title>');
    // The generic title and description of index.html are replaced, not left in front of the page's own.
    expect(html.match(/<title>/g)).toHaveLength(1);
    expect(html.match(/<meta name="description"/g)).toHaveLength(1);
    expect(meta(html, 'description')).toBe('Made by Tamsin Ode from the pattern “Round-back hedgehog” by Pip &amp; Bramble Studio. Finished 20 November 2026. 2 pieces.');
    expect(meta(html, 'og:title')).toBe('Moss the hedgehog');
    expect(meta(html, 'og:url')).toBe(`http://share.example:8080/p/${p.token}`);
    expect(html).toContain(`<link rel="canonical" href="http://share.example:8080/p/${p.token}" />`);
    // og:image must be absolute (Open Graph protocol, ogp.me): the cover's display variant, through this link.
    expect(meta(html, 'og:image')).toBe(`http://share.example:8080/media/shared/${p.token}/${sharedPhotoRef(p.token, p.coverKey)}/display.jpg`);
    // The storage key names the owner's own URL; it stays out of the page.
    expect(html).not.toContain(p.coverKey);
    expect(meta(html, 'og:image:alt')).toBe('Moss the hedgehog on a windowsill');
    expect(meta(html, 'twitter:card')).toBe('summary_large_image');
    expect(meta(html, 'twitter:image')).toBe(meta(html, 'og:image'));
    // Link-only pages are unlisted.
    expect(meta(html, 'robots')).toBe('noindex, nofollow');
    // The client app still boots from the same document.
    expect(html).toContain('<div id="root"></div>');
  });

  it('uses APP_ORIGIN for absolute links when it is set', async () => {
    const t2 = await createTestContext({ APP_ORIGIN: 'https://whorlbook.example' });
    try {
      const owner = await createTestUser(t2.db);
      const p = await createShowcaseProject(t2.db, owner.id, { visibility: 'public' });
      const html = (await request(t2.app).get(`/p/${p.token}`).set('Host', 'evil.example')).text;
      expect(meta(html, 'og:url')).toBe(`https://whorlbook.example/p/${p.token}`);
      expect(meta(html, 'og:image')).toBe(`https://whorlbook.example/media/shared/${p.token}/${sharedPhotoRef(p.token, p.coverKey)}/display.jpg`);
      expect(meta(html, 'robots')).toBeUndefined();
    } finally {
      await t2.close();
    }
  });

  it('escapes a title with quotes and angle brackets everywhere it appears', async () => {
    const owner = await createTestUser(t.db, { displayName: 'Kit "Two Hooks" <b>' });
    const title = `"Bun" <script>alert('x')</script> & co`;
    const p = await createShowcaseProject(t.db, owner.id, { title });
    const html = (await request(t.app).get(`/p/${p.token}`)).text;
    expect(html).not.toContain('<script>alert');
    expect(html).not.toContain('"Bun"');
    expect(html).not.toContain('<b>');
    const escaped = '&quot;Bun&quot; &lt;script&gt;alert(&#39;x&#39;)&lt;/script&gt; &amp; co';
    expect(meta(html, 'og:title')).toBe(escaped);
    expect(meta(html, 'twitter:title')).toBe(escaped);
    expect(html).toContain(`<title>${escaped} by Kit &quot;Two Hooks&quot; &lt;b&gt; · Whorlbook</title>`);
  });

  it('leaves out the Twitter large image when there is no photo', async () => {
    const owner = await createTestUser(t.db);
    const p = await createShowcaseProject(t.db, owner.id, { withPhotos: false });
    const html = (await request(t.app).get(`/p/${p.token}`)).text;
    expect(meta(html, 'twitter:card')).toBe('summary');
    expect(meta(html, 'og:image')).toBeUndefined();
  });

  it('never carries an e-mail address or anything private', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const p = await createShowcaseProject(t.db, user.id);
    // Even the owner, signed in, gets no address in the page.
    const html = (await agent.get(`/p/${p.token}`)).text;
    expect(html).not.toContain(user.email);
    expect(html).not.toMatch(EMAIL_RE);
    for (const secret of Object.values(PRIVATE_MARKERS)) expect(html).not.toContain(secret);
  });

  it('answers an HTML 404 for a private, retired or unknown link', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const priv = await createShowcaseProject(t.db, user.id, { visibility: 'private' });
    const retired = await createShowcaseProject(t.db, user.id);
    expect((await agent.post(`/api/projects/${retired.id}/share-link`).send({})).status).toBe(200);
    for (const token of [priv.token, retired.token, 'NoSuchTokenAtAllNoSuchToken']) {
      const res = await request(t.app).get(`/p/${token}`);
      expect(res.status).toBe(404);
      expect(res.type).toBe('text/html');
      expect(res.text).toContain('<div id="root"></div>');
      expect(meta(res.text, 'robots')).toBe('noindex');
      expect(res.text).not.toContain('Moss the hedgehog');
    }
  });
});

describe('GET /m/:makerId (public maker profile)', () => {
  it('is a page with its own title while the maker has a public project, a 404 otherwise', async () => {
    const owner = await createTestUser(t.db, { displayName: 'Ivy & "Co"' });
    const none = await request(t.app).get(`/m/${owner.id}`);
    expect(none.status).toBe(404);
    await createShowcaseProject(t.db, owner.id, { visibility: 'public', title: 'Shown' });
    const res = await request(t.app).get(`/m/${owner.id}`);
    expect(res.status).toBe(200);
    expect(res.text).toContain('<title>Ivy &amp; &quot;Co&quot;’s makes · Whorlbook</title>');
    expect(res.text).not.toMatch(EMAIL_RE);
  });
});
