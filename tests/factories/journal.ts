import type { Knex } from 'knex';

// Projects and pieces straight into the database, so the journal tests do not depend on the projects API.

let n = 0;

export async function createProject(
  db: Knex,
  ownerId: string,
  overrides: Partial<{ title: string; visibility: 'private' | 'link' | 'public'; pieces: string[] }> = {},
) {
  n += 1;
  const { pieces = ['Body', 'Ear'], ...rest } = overrides;
  const [{ id }] = await db('projects')
    .insert({ owner_id: ownerId, title: rest.title ?? `Test project ${n}`, visibility: rest.visibility ?? 'private', share_token: rest.visibility && rest.visibility !== 'private' ? `token-${n}-${Date.now()}` : null })
    .returning('id');
  const pieceRows: Array<{ id: number; name: string }> = pieces.length
    ? await db('project_pieces')
        .insert(pieces.map((name, position) => ({ project_id: id, position, name })))
        .returning(['id', 'name'])
    : [];
  return { id: id as number, pieces: pieceRows };
}

export async function setVisibility(db: Knex, projectId: number, visibility: 'private' | 'link' | 'public') {
  await db('projects').where({ id: projectId }).update({ visibility, share_token: visibility === 'private' ? null : `token-${projectId}-${Date.now()}` });
}
