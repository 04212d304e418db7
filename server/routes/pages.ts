import { Router, type Response } from 'express';
import type { AppContext } from '../context.js';
import { HttpError } from '../lib/http-error.js';
import { escapeHtml, renderIndex } from '../lib/spa.js';
import { absoluteUrl, makerProfile, profilePath, showcaseView, type ShowcaseView } from '../services/share.js';
import { requestOrigin } from './share.js';

// Server-rendered page routes that need their own <head>: the showcase /p/:token and the maker profile /m/:id.
// A link pasted into a chat is fetched by a bot that runs no script, so the title, description and Open Graph /
// Twitter card tags are written here (Open Graph protocol, ogp.me; X/Twitter "Cards markup" reference); the React
// app then takes over in the browser. Every value goes through escapeHtml.

const SITE = 'Whorlbook';
const DESCRIPTION_MAX = 200;

type Meta = { name?: string; property?: string; content: string };

const metaTag = ({ name, property, content }: Meta) =>
  `<meta ${name ? `name="${escapeHtml(name)}"` : `property="${escapeHtml(property!)}"`} content="${escapeHtml(content)}" />`;

function clip(text: string, max = DESCRIPTION_MAX) {
  const chars = [...text.replace(/\s+/g, ' ').trim()];
  return chars.length > max ? `${chars.slice(0, max - 1).join('').trimEnd()}…` : chars.join('');
}

/**
 * index.html carries a generic <title> and description; a page with its own must not leave the generic ones in
 * front of them (most readers take the first). They are only removed when the page's own are present.
 */
export function pageHtml(title: string, tags: string[]) {
  let html = renderIndex([`<title>${escapeHtml(title)}</title>`, ...tags].join('\n    '));
  for (const pattern of [/<title>[^<]*<\/title>\s*/g, /<meta name="description"[^>]*>\s*/g]) {
    const found: string[] = html.match(pattern) ?? [];
    if (found.length > 1) html = html.replace(found[0]!, '');
  }
  return html;
}

const friendlyDate = (iso: string) => {
  const d = new Date(`${iso}T12:00:00Z`);
  return Number.isNaN(d.getTime()) ? iso : d.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' });
};

export function showcaseDescription(v: ShowcaseView) {
  const parts = [`Made by ${v.maker.displayName}`];
  if (v.pattern) parts[0] += ` from the pattern “${v.pattern.title}”${v.pattern.designerCredit ? ` by ${v.pattern.designerCredit}` : ''}`;
  parts[0] += '.';
  if (v.finishedOn) parts.push(`Finished ${friendlyDate(v.finishedOn)}.`);
  else parts.push(`${v.statusLabel}.`);
  if (v.pieces.length) parts.push(`${v.pieces.length} ${v.pieces.length === 1 ? 'piece' : 'pieces'}.`);
  return clip(parts.join(' '));
}

function showcaseHead(v: ShowcaseView, origin: string) {
  const title = `${v.title} by ${v.maker.displayName} · ${SITE}`;
  const description = showcaseDescription(v);
  const cover = v.photos.find((p) => p.cover) ?? v.photos[0];
  const tags: Meta[] = [
    { name: 'description', content: description },
    { property: 'og:type', content: 'article' },
    { property: 'og:site_name', content: SITE },
    { property: 'og:title', content: v.title },
    { property: 'og:description', content: description },
    { property: 'og:url', content: v.url },
    { name: 'twitter:card', content: cover ? 'summary_large_image' : 'summary' },
    { name: 'twitter:title', content: v.title },
    { name: 'twitter:description', content: description },
  ];
  if (cover) {
    const image = absoluteUrl(origin, cover.url);
    tags.push(
      { property: 'og:image', content: image },
      { property: 'og:image:width', content: String(cover.width) },
      { property: 'og:image:height', content: String(cover.height) },
      { property: 'og:image:alt', content: cover.alt },
      { name: 'twitter:image', content: image },
      { name: 'twitter:image:alt', content: cover.alt },
    );
  }
  // "Anyone with the link" is unlisted: search engines are asked to leave it out.
  if (v.visibility === 'link') tags.push({ name: 'robots', content: 'noindex, nofollow' });
  return pageHtml(title, [...tags.map(metaTag), `<link rel="canonical" href="${escapeHtml(v.url)}" />`]);
}

function notShared(res: Response, title: string) {
  res
    .status(404)
    .type('html')
    .set('Cache-Control', 'no-cache')
    .send(pageHtml(`${title} · ${SITE}`, [metaTag({ name: 'robots', content: 'noindex' }), metaTag({ name: 'description', content: 'This page is not shared, or its link was replaced.' })]));
}

export function pagesRouter(ctx: AppContext) {
  const router = Router();

  router.get('/p/:token', async (req, res) => {
    const origin = requestOrigin(ctx, req);
    let view: ShowcaseView;
    try {
      view = await showcaseView(ctx, String(req.params.token), res.locals.user, origin);
    } catch (err) {
      if (err instanceof HttpError && err.status === 404) return notShared(res, 'Page not found');
      throw err;
    }
    // Sharing can be turned off at any moment, so the page is never served from a cache without asking again.
    res.type('html').set('Cache-Control', 'no-cache').send(showcaseHead(view, origin));
  });

  router.get('/m/:makerId', async (req, res) => {
    const origin = requestOrigin(ctx, req);
    let profile: Awaited<ReturnType<typeof makerProfile>>;
    try {
      profile = await makerProfile(ctx.db, String(req.params.makerId));
    } catch (err) {
      if (err instanceof HttpError && err.status === 404) return notShared(res, 'Maker not found');
      throw err;
    }
    const name = profile.maker.displayName;
    const url = absoluteUrl(origin, profilePath(profile.maker.id));
    const description = clip(`${profile.projects.length} finished and shared ${profile.projects.length === 1 ? 'piece' : 'pieces'} by ${name}: ${profile.projects.map((p) => p.title).join(', ')}.`);
    const cover = profile.projects.find((p) => p.cover)?.cover;
    const tags: Meta[] = [
      { name: 'description', content: description },
      { property: 'og:type', content: 'profile' },
      { property: 'og:site_name', content: SITE },
      { property: 'og:title', content: `${name} on ${SITE}` },
      { property: 'og:description', content: description },
      { property: 'og:url', content: url },
      { name: 'twitter:card', content: cover ? 'summary_large_image' : 'summary' },
      ...(cover ? [{ property: 'og:image', content: absoluteUrl(origin, cover.url) }, { name: 'twitter:image', content: absoluteUrl(origin, cover.url) }] : []),
    ];
    res
      .type('html')
      .set('Cache-Control', 'no-cache')
      .send(pageHtml(`${name}’s makes · ${SITE}`, [...tags.map(metaTag), `<link rel="canonical" href="${escapeHtml(url)}" />`]));
  });

  return router;
}
