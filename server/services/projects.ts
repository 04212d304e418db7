import type { Knex } from 'knex';
import type { ProjectStatus } from '../../src/schemas/common.js';

// Foundation: the list the home screen ("On the hook") needs. The projects work extends this module.

export interface ProjectListItem {
  id: number;
  title: string;
  status: ProjectStatus;
  startedOn: string | null;
  finishedOn: string | null;
  updatedAt: string;
  pieceCount: number;
}

export async function listProjects(db: Knex, ownerId: string, status?: ProjectStatus): Promise<ProjectListItem[]> {
  const rows = await db('projects as p')
    .where('p.owner_id', ownerId)
    .modify((q) => {
      if (status) q.andWhere('p.status', status);
    })
    .select('p.id', 'p.title', 'p.status', 'p.started_on', 'p.finished_on', 'p.updated_at')
    .select(db.raw('(select count(*) from project_pieces pp where pp.project_id = p.id) as piece_count'))
    .orderBy('p.updated_at', 'desc');
  return rows.map((r: Record<string, any>) => ({
    id: r.id,
    title: r.title,
    status: r.status,
    startedOn: r.started_on,
    finishedOn: r.finished_on,
    updatedAt: r.updated_at,
    pieceCount: Number(r.piece_count),
  }));
}
