import type { Knex } from 'knex';
import type { AppContext } from '../context.js';
import { HttpError, notFound } from '../lib/http-error.js';
import type { Role } from '../lib/auth.js';
import type { AdminUserListQuery, AdminUserSort } from '../../src/schemas/auth.js';
import type { UserRow } from './users.js';

export const ADMIN_PAGE_SIZE = 20;

export interface AdminUser {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  emailVerified: boolean;
  disabled: boolean;
  disabledAt: string | null;
  lastSignInAt: string | null;
  createdAt: string;
  projectCount: number;
}

type Row = UserRow & { project_count: number };

const toAdminUser = (r: Row): AdminUser => ({
  id: r.id,
  email: r.email,
  displayName: r.display_name,
  role: r.role,
  emailVerified: Boolean(r.email_verified_at),
  disabled: Boolean(r.disabled_at),
  disabledAt: r.disabled_at,
  lastSignInAt: r.last_sign_in_at,
  createdAt: r.created_at,
  projectCount: Number(r.project_count),
});

// Whitelisted sort columns: the query string never reaches SQL as an identifier.
const SORT_SQL: Record<string, string> = {
  name: 'users.display_name COLLATE NOCASE',
  email: 'users.email',
  projects: 'project_count',
  lastSignIn: 'users.last_sign_in_at',
  created: 'users.created_at',
};

function withProjectCount(db: Knex) {
  return db('users').select(
    'users.*',
    db('projects').count('*').where('projects.owner_id', db.ref('users.id')).as('project_count'),
  );
}

const likePattern = (text: string) => `%${text.toLowerCase().replace(/[\\%_]/g, (c) => `\\${c}`)}%`;

export async function listUsers(db: Knex, { query, page, sort }: AdminUserListQuery) {
  const desc = sort.startsWith('-');
  const column = SORT_SQL[(desc ? sort.slice(1) : sort) as Exclude<AdminUserSort, `-${string}`>]!;
  const filter = (q: Knex.QueryBuilder) => {
    if (query) {
      const pattern = likePattern(query);
      q.where((w) => w.whereRaw("lower(users.display_name) LIKE ? ESCAPE '\\'", [pattern]).orWhereRaw("users.email LIKE ? ESCAPE '\\'", [pattern]));
    }
  };
  const totalRow = (await db('users').modify(filter).count({ n: '*' }).first()) as { n: number } | undefined;
  const total = Number(totalRow?.n ?? 0);
  const rows = (await withProjectCount(db)
    .modify(filter)
    .orderByRaw(`${column} ${desc ? 'DESC' : 'ASC'}, users.id ASC`)
    .limit(ADMIN_PAGE_SIZE)
    .offset((page - 1) * ADMIN_PAGE_SIZE)) as Row[];
  return {
    users: rows.map(toAdminUser),
    page,
    pageSize: ADMIN_PAGE_SIZE,
    total,
    pageCount: Math.max(1, Math.ceil(total / ADMIN_PAGE_SIZE)),
  };
}

async function getAdminUser(db: Knex, id: string) {
  const row = (await withProjectCount(db).where('users.id', id).first()) as Row | undefined;
  if (!row) throw notFound('That member');
  return toAdminUser(row);
}

/**
 * Disabling ends every session in the same transaction, so the member's next request is already signed out
 * (the session middleware also refuses any cookie of a disabled member), and sign-in answers 403 from then on.
 */
export async function setDisabled(ctx: AppContext, adminId: string, id: string, disabled: boolean) {
  if (disabled && id === adminId) throw new HttpError(409, 'You cannot disable your own account. Ask another admin if it really must be done.');
  await ctx.db.transaction(async (trx) => {
    const user = await trx<UserRow>('users').where({ id }).first();
    if (!user) throw notFound('That member');
    const now = new Date().toISOString();
    if (disabled) {
      if (!user.disabled_at) await trx('users').where({ id }).update({ disabled_at: now, updated_at: now });
      await trx('sessions').where({ user_id: id }).delete();
    } else if (user.disabled_at) {
      await trx('users').where({ id }).update({ disabled_at: null, updated_at: now });
    }
  });
  ctx.logger.info({ adminId, userId: id, disabled }, disabled ? 'member disabled' : 'member re-enabled');
  return getAdminUser(ctx.db, id);
}

/**
 * Makes a member an admin or an admin a member again. Nobody changes their own role, so an admin can never lock
 * everyone out of the admin screen (another admin has to do it). Takes effect on the member's next request, since
 * every request reads the role afresh with the session.
 */
export async function setRole(ctx: AppContext, adminId: string, id: string, role: Role) {
  if (id === adminId) throw new HttpError(409, 'You cannot change your own role. Ask another admin if it really must be done.');
  await ctx.db.transaction(async (trx) => {
    const user = await trx<UserRow>('users').where({ id }).first();
    if (!user) throw notFound('That member');
    if (role === 'admin' && user.disabled_at) throw new HttpError(409, 'Re-enable this member before making them an admin.');
    if (user.role !== role) await trx('users').where({ id }).update({ role, updated_at: new Date().toISOString() });
  });
  ctx.logger.info({ adminId, userId: id, role }, 'member role changed');
  return getAdminUser(ctx.db, id);
}
