import type { Request } from 'express';
import type { Env } from '../env.js';
import { escapeHtml } from './spa.js';

export interface MailContent {
  greeting: string;
  paragraphs: string[];
  action?: { label: string; url: string };
  footer?: string;
}

// Our palette (product brief): oat, ink, moss, wool. Mail clients ignore <style> and web fonts unevenly, so every
// rule is inline and Quicksand falls back to the reader's rounded or system sans.
const c = { oat: '#F7F1E6', ink: '#2A2622', moss: '#3F6B4E', wool: '#E4D9C6' };
const font = "Quicksand, 'Segoe UI', system-ui, -apple-system, Helvetica, Arial, sans-serif";

/** One Whorlbook e-mail as a plain-text part and an HTML part with the same words. Every piece of text is escaped. */
export function renderMail({ greeting, paragraphs, action, footer }: MailContent): { text: string; html: string } {
  const closing = footer ?? 'Happy making,\nWhorlbook';
  const text = [greeting, ...paragraphs, ...(action ? [`${action.label}:\n${action.url}`] : []), closing].join('\n\n') + '\n';

  const p = (s: string) => `<p style="margin:0 0 16px;line-height:1.55">${escapeHtml(s).replace(/\n/g, '<br>')}</p>`;
  const button = action
    ? `<p style="margin:24px 0"><a href="${escapeHtml(action.url)}" style="display:inline-block;background:${c.moss};color:${c.oat};font-weight:700;text-decoration:none;padding:14px 24px;border-radius:20px">${escapeHtml(action.label)}</a></p>` +
      `<p style="margin:0 0 16px;font-size:13px;line-height:1.5">If the button does not work, copy this address into your browser:<br><a href="${escapeHtml(action.url)}" style="color:${c.moss};word-break:break-all">${escapeHtml(action.url)}</a></p>`
    : '';
  const html = `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width"><title>Whorlbook</title></head>
<body style="margin:0;padding:0;background:${c.oat};color:${c.ink};font-family:${font};font-size:16px">
<div style="max-width:560px;margin:0 auto;padding:24px 16px">
<p style="margin:0 0 20px;font-size:22px;font-weight:700;color:${c.moss}">Whorlbook</p>
<div style="background:#ffffff;border:1px solid ${c.wool};border-radius:32px;padding:24px">
${p(greeting)}
${paragraphs.map(p).join('\n')}
${button}
${p(closing)}
</div>
</div>
</body></html>`;
  return { text, html };
}

/**
 * The origin e-mail links start with. APP_ORIGIN when set (it must be whenever real mail goes out: see mail.ts);
 * otherwise, which only happens while the built-in mail fake keeps every message on this machine, the origin the
 * request itself came to, so links work on whatever port and address a person is trying Whorlbook on.
 */
export function publicOrigin(env: Env, req: Request): string {
  if (env.APP_ORIGIN) return env.APP_ORIGIN;
  return `${req.protocol}://${req.get('host') ?? `127.0.0.1:${env.PORT}`}`;
}

/** An absolute link into the client carrying `token=…` (and nothing else secret). */
export function tokenLink(origin: string, pathname: string, token: string): string {
  const url = new URL(pathname, origin);
  url.searchParams.set('token', token);
  return url.toString();
}
