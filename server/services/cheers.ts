import type { Knex } from 'knex';
import type { User } from 'lucia';
import { cheerSummary, sharedProjectByToken } from './share.js';

// A cheer is idempotent: POST adds the member's one cheer (again is a no-op), DELETE takes it back. A toggle on
// POST would flip twice on a double tap or a retried request; add/remove cannot.

export async function addCheer(db: Knex, token: string, user: User) {
  const project = await sharedProjectByToken(db, token);
  await db('cheers').insert({ project_id: project.id, user_id: user.id }).onConflict(['project_id', 'user_id']).ignore();
  return cheerSummary(db, project.id, user.id);
}

export async function removeCheer(db: Knex, token: string, user: User) {
  const project = await sharedProjectByToken(db, token);
  await db('cheers').where({ project_id: project.id, user_id: user.id }).delete();
  return cheerSummary(db, project.id, user.id);
}
