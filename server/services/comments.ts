import type { Knex } from 'knex';
import type { User } from 'lucia';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../lib/http-error.js';
import { renderMail } from '../lib/mail-template.js';
import { absoluteUrl, sharePath, sharedProjectByToken } from './share.js';
import type { ShowcaseComment as CommentOut } from '../../src/types/showcase.js';

export type { CommentOut };

// Comments on a showcase. A body is kept exactly as typed and goes out only as a JSON string; the client renders
// it as a text node, so markup in a comment stays inert everywhere it appears.

type Row = Record<string, any>;


const COMMENT = 'That comment';
export const COMMENT_MAIL_INTERVAL_MS = 60 * 60 * 1000;
/** The e-mail quotes the start of the comment; the rest is on the page. */
const MAIL_QUOTE_MAX = 500;

function toComment(r: Row, viewerId: string | null, ownerId: string): CommentOut {
  const isOwner = viewerId === ownerId;
  return {
    id: r.id,
    body: r.body,
    author: { displayName: r.author_display_name },
    createdAt: r.created_at,
    hidden: Boolean(r.hidden_at),
    hiddenByAdmin: Boolean(r.hidden_at) && r.hidden_by !== ownerId,
    mine: viewerId === r.author_id,
    canDelete: viewerId === r.author_id || isOwner,
    canHide: isOwner,
  };
}

const commentQuery = (db: Knex) =>
  db('comments as c').join('users as u', 'u.id', 'c.author_id').select('c.*', 'u.display_name as author_display_name');

/** Visitors and members see the comments nobody hid; the page owner also sees hidden ones, marked as such. */
export async function listComments(db: Knex, token: string, viewer: User | null) {
  const project = await sharedProjectByToken(db, token);
  const isOwner = viewer?.id === project.owner_id;
  const rows: Row[] = await commentQuery(db)
    .where('c.project_id', project.id)
    .modify((q) => {
      if (!isOwner) q.whereNull('c.hidden_at');
    })
    .orderBy([{ column: 'c.created_at' }, { column: 'c.id' }]);
  return rows.map((r) => toComment(r, viewer?.id ?? null, project.owner_id));
}

export async function addComment(ctx: AppContext, token: string, author: User, body: string, origin: string) {
  const { db } = ctx;
  const project = await sharedProjectByToken(db, token);
  const [{ id }] = await db('comments').insert({ project_id: project.id, author_id: author.id, body }).returning('id');
  const row = await commentQuery(db).where('c.id', id).first();
  if (author.id !== project.owner_id) await notifyOwner(ctx, project, author, body, origin);
  return toComment(row, author.id, project.owner_id);
}

/**
 * One e-mail per project per hour at most. The hour is claimed with a single conditional UPDATE, so two comments
 * arriving together cannot both send; if the send fails, the claim is given back so the next comment tries again.
 * A failed e-mail never loses the comment.
 */
async function notifyOwner(ctx: AppContext, project: Row, author: User, body: string, origin: string) {
  const { db, logger } = ctx;
  if (!project.owner_notify_comments) return;
  const now = new Date();
  const cutoff = new Date(now.getTime() - COMMENT_MAIL_INTERVAL_MS).toISOString();
  const claimed = await db('projects')
    .where({ id: project.id })
    .andWhere((q) => q.whereNull('last_comment_mail_at').orWhere('last_comment_mail_at', '<=', cutoff))
    .update({ last_comment_mail_at: now.toISOString() });
  if (!claimed) return;

  const link = `${absoluteUrl(origin, sharePath(project.share_token))}#comments`;
  const chars = [...body];
  const quote = chars.length > MAIL_QUOTE_MAX ? `${chars.slice(0, MAIL_QUOTE_MAX).join('')}…` : body;
  const subject = `${author.displayName} commented on “${project.title}”`;
  const message = renderMail({
    greeting: `Hello ${project.owner_display_name},`,
    paragraphs: [
      `${author.displayName} left a comment on your showcase “${project.title}”:`,
      quote,
      'You will get at most one of these e-mails an hour for this project. To stop them, open the project, go to Sharing and turn off comment e-mails.',
    ],
    action: { label: 'Read it on your page', url: link },
  });
  try {
    await ctx.mailer.send({ to: project.owner_email, subject, ...message });
  } catch (err) {
    logger.warn({ err, projectId: project.id }, 'could not send the comment e-mail');
    await db('projects').where({ id: project.id, last_comment_mail_at: now.toISOString() }).update({ last_comment_mail_at: project.last_comment_mail_at ?? null });
  }
}

/**
 * The comment, found only through the page it is on: the link must open a page this visitor may see, and the
 * comment must belong to that page's project. An unknown id, a comment on another page (unlisted ones included) and
 * a hidden comment the member is not involved in all get the same 404, so stepping through ids reveals nothing.
 */
async function commentOnPage(db: Knex, token: string, commentId: number, userId: string) {
  const project = await sharedProjectByToken(db, token);
  const row = await db('comments').where({ id: commentId, project_id: project.id }).first();
  if (!row) throw notFound(COMMENT);
  const ownerId: string = project.owner_id;
  const involved = row.author_id === userId || ownerId === userId;
  // Someone who can read the comment on this page learns why they cannot change it; a hidden one they cannot read.
  if (!involved && row.hidden_at) throw notFound(COMMENT);
  return { row, ownerId };
}

export async function deleteComment(db: Knex, token: string, commentId: number, user: User) {
  const { row, ownerId } = await commentOnPage(db, token, commentId, user.id);
  if (row.author_id !== user.id && ownerId !== user.id) {
    throw new HttpError(403, 'Only the person who wrote a comment, or the owner of the page, can delete it. Use "Report" if something is wrong with it.');
  }
  await db('comments').where({ id: row.id }).delete();
}

/**
 * `DELETE /api/comments/:id` (the API's published shape): the author or the page's owner deletes it, whether or not
 * the page is still shared. To anyone else an existing comment and a missing one are the same 404.
 */
export async function deleteCommentById(db: Knex, commentId: number, user: User) {
  const row = await db('comments as c').join('projects as p', 'p.id', 'c.project_id').where('c.id', commentId).first('c.id', 'c.author_id', 'p.owner_id');
  if (!row || (row.author_id !== user.id && row.owner_id !== user.id)) throw notFound(COMMENT);
  await db('comments').where({ id: row.id }).delete();
}

export async function setCommentHidden(db: Knex, token: string, commentId: number, user: User, hidden: boolean) {
  const { row, ownerId } = await commentOnPage(db, token, commentId, user.id);
  if (ownerId !== user.id) {
    throw new HttpError(403, 'Only the owner of the page can hide a comment. Use "Report" if something is wrong with it.');
  }
  if (!hidden && row.hidden_at && row.hidden_by !== user.id) {
    throw new HttpError(409, 'An admin hid this comment after a report, so it stays hidden.');
  }
  await db('comments')
    .where({ id: row.id })
    .update(hidden ? { hidden_at: row.hidden_at ?? new Date().toISOString(), hidden_by: row.hidden_by ?? user.id } : { hidden_at: null, hidden_by: null });
  const updated = await commentQuery(db).where('c.id', row.id).first();
  return toComment(updated, user.id, ownerId);
}
