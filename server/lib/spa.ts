import fs from 'node:fs';
import path from 'node:path';

export const distDir = path.resolve('dist');

let cached: string | null = null;

/** The client's index.html (built if present, else the source template), with extra tags in its <head>. */
export function renderIndex(head = ''): string {
  if (cached === null || process.env.NODE_ENV !== 'production') {
    const built = path.join(distDir, 'index.html');
    cached = fs.readFileSync(fs.existsSync(built) ? built : path.resolve('index.html'), 'utf8');
  }
  return cached.replace('<!--app-head-->', head);
}

/** Escapes text for an HTML attribute or text node (server-rendered meta on shared pages). */
export function escapeHtml(value: string): string {
  return value.replace(/[&<>"']/g, (c) => ({ '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' })[c]!);
}
