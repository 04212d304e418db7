import fs from 'node:fs';
import path from 'node:path';
import type { Knex } from 'knex';

/** Every file under the test's uploads folder (relative paths), to prove nothing was left behind. */
export function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return (fs.readdirSync(dir, { recursive: true }) as string[]).filter((f) => fs.statSync(path.join(dir, f)).isFile()).sort();
}

export async function photoCount(db: Knex) {
  const { c } = (await db('photos').count({ c: '*' }).first()) as { c: number };
  return Number(c);
}

/** supertest's binary parser for images, so res.body is a Buffer. */
// superagent hands the raw Node response here although its types say otherwise.
export function binary(res: any, cb: (err: Error | null, body: Buffer) => void) {
  const chunks: Buffer[] = [];
  res.on('data', (c: Buffer) => chunks.push(c));
  res.on('end', () => cb(null, Buffer.concat(chunks)));
}
