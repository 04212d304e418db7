import type { Knex } from 'knex';
import type { User } from 'lucia';
import { HttpError, notFound } from '../lib/http-error.js';
import type { CreateReportInput } from '../../src/schemas/share.js';
import { sharePath, sharedProjectByToken } from './share.js';
import type { Report as ReportOut } from '../../src/types/showcase.js';

export type { ReportOut };

// Reports of a comment or a whole showcase page, always reached through the page's link. Members report what they
// can see; admins hide or dismiss.

type Row = Record<string, any>;


export async function createReport(db: Knex, user: User, input: CreateReportInput) {
  // The page first: a link that does not open a page this member may see is "not found", whatever the comment id.
  // A bare comment id finds its page through the comment, and then passes the same check.
  let token = input.shareToken;
  if (token === undefined) {
    const owner = await db('comments as c').join('projects as p', 'p.id', 'c.project_id').where('c.id', input.commentId!).first('p.share_token');
    if (!owner?.share_token) throw notFound('That comment');
    token = owner.share_token as string;
  }
  const project = await sharedProjectByToken(db, token).catch((err: unknown) => {
    // Reached through a bare comment id, a closed page means that comment is not there to report.
    if (input.shareToken === undefined && err instanceof HttpError && err.status === 404) throw notFound('That comment');
    throw err;
  });
  let target: { target: 'comment' | 'project'; comment_id: number | null; project_id: number };
  if (input.commentId !== undefined) {
    // Only a comment the member can read on this very page can be reported. An unknown id, one from another page
    // and a hidden one get the same 404, so ids reveal nothing.
    const comment = await db('comments').where({ id: input.commentId, project_id: project.id }).whereNull('hidden_at').first('id');
    if (!comment) throw notFound('That comment');
    target = { target: 'comment', comment_id: comment.id, project_id: project.id };
  } else {
    target = { target: 'project', comment_id: null, project_id: project.id };
  }
  // Reporting the same thing twice while the first report is open adds nothing for the admins to read.
  const existing = await db('reports')
    .where({ reporter_id: user.id, target: target.target, project_id: target.project_id, status: 'open' })
    .modify((q) => (target.comment_id ? q.where('comment_id', target.comment_id) : q.whereNull('comment_id')))
    .first('id', 'status');
  if (existing) return { id: existing.id as number, status: 'open' as const, duplicate: true };
  const [{ id }] = await db('reports').insert({ reporter_id: user.id, ...target, reason: input.reason }).returning('id');
  return { id: id as number, status: 'open' as const, duplicate: false };
}

function toReport(r: Row): ReportOut {
  return {
    id: r.id,
    target: r.target,
    reason: r.reason,
    status: r.status,
    createdAt: r.created_at,
    handledAt: r.handled_at ?? null,
    reporter: { displayName: r.reporter_name },
    handledBy: r.handler_name ? { displayName: r.handler_name } : null,
    page: r.project_title
      ? {
          title: r.project_title,
          path: r.share_token && r.visibility !== 'private' ? sharePath(r.share_token) : null,
          ownerDisplayName: r.owner_name,
          hidden: Boolean(r.showcase_hidden_at),
        }
      : null,
    comment: r.comment_id && r.comment_body !== null ? { id: r.comment_id, body: r.comment_body, authorDisplayName: r.comment_author_name, hidden: Boolean(r.comment_hidden_at) } : null,
    openReportsOnTarget: Number(r.open_on_target),
  };
}

const reportQuery = (db: Knex) =>
  db('reports as r')
    .join('users as rep', 'rep.id', 'r.reporter_id')
    .leftJoin('users as h', 'h.id', 'r.handled_by')
    .leftJoin('projects as p', 'p.id', 'r.project_id')
    .leftJoin('users as o', 'o.id', 'p.owner_id')
    .leftJoin('comments as c', 'c.id', 'r.comment_id')
    .leftJoin('users as ca', 'ca.id', 'c.author_id')
    .select(
      'r.*',
      'rep.display_name as reporter_name',
      'h.display_name as handler_name',
      'p.title as project_title',
      'p.share_token',
      'p.visibility',
      'p.showcase_hidden_at',
      'o.display_name as owner_name',
      'c.body as comment_body',
      'c.hidden_at as comment_hidden_at',
      'ca.display_name as comment_author_name',
    )
    .select(
      db.raw(
        `(select count(*) from reports r2 where r2.status = 'open' and r2.target = r.target and r2.project_id = r.project_id
          and (r2.comment_id = r.comment_id or (r2.comment_id is null and r.comment_id is null))) as open_on_target`,
      ),
    );

export async function listReports(db: Knex, status: 'open' | 'handled' | 'all') {
  const rows: Row[] = await reportQuery(db)
    .modify((q) => {
      if (status === 'open') q.where('r.status', 'open');
      if (status === 'handled') q.whereNot('r.status', 'open');
    })
    .orderBy([{ column: 'r.created_at', order: status === 'open' ? 'asc' : 'desc' }, { column: 'r.id' }])
    .limit(200);
  return rows.map(toReport);
}

/** Hiding takes the comment or page down for everyone and closes every open report about it. */
export async function resolveReport(db: Knex, admin: User, reportId: number, action: 'hide' | 'dismiss') {
  await db.transaction(async (trx) => {
    const report = await trx('reports').where({ id: reportId }).first();
    if (!report) throw notFound('That report');
    if (report.status !== 'open') throw new HttpError(409, 'That report was already handled. Reload the list to see where it stands.');
    const now = new Date().toISOString();
    const handled = { handled_by: admin.id, handled_at: now };
    if (action === 'dismiss') {
      await trx('reports').where({ id: report.id }).update({ status: 'dismissed', ...handled });
      return;
    }
    if (report.target === 'comment') {
      await trx('comments').where({ id: report.comment_id }).whereNull('hidden_at').update({ hidden_at: now, hidden_by: admin.id });
      // An owner's own hide becomes an admin's, so the owner cannot show a reported comment again.
      await trx('comments').where({ id: report.comment_id }).update({ hidden_by: admin.id });
      await trx('reports').where({ target: 'comment', comment_id: report.comment_id, status: 'open' }).update({ status: 'hidden', ...handled });
    } else {
      await trx('projects').where({ id: report.project_id }).update({ showcase_hidden_at: now, showcase_hidden_by: admin.id });
      await trx('reports').where({ target: 'project', project_id: report.project_id, status: 'open' }).update({ status: 'hidden', ...handled });
    }
  });
  const row = await reportQuery(db).where('r.id', reportId).first();
  return toReport(row);
}
