// `npm run db:make -- create_widgets`: writes migrations/YYYYMMDDHHMMSS_create_widgets.ts with up and down.
import fs from 'node:fs';
import path from 'node:path';

const name = process.argv[2];
if (!name || !/^[a-z][a-z0-9_]*$/.test(name)) {
  console.error('usage: npm run db:make -- <verb>_<table>   (snake_case, e.g. create_yarns or add_cover_to_projects)');
  process.exit(2);
}
const d = new Date();
const pad = (n: number) => String(n).padStart(2, '0');
const stamp = `${d.getUTCFullYear()}${pad(d.getUTCMonth() + 1)}${pad(d.getUTCDate())}${pad(d.getUTCHours())}${pad(d.getUTCMinutes())}${pad(d.getUTCSeconds())}`;
const file = path.resolve('migrations', `${stamp}_${name}.ts`);
fs.writeFileSync(
  file,
  `import type { Knex } from 'knex';

export async function up(knex: Knex) {
  // one change per migration
}

export async function down(knex: Knex) {
  // undo exactly what up() did
}
`,
);
console.log(`Created ${path.relative(process.cwd(), file)}`);
