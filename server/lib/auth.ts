import { Lucia, type Adapter, type DatabaseSession, type DatabaseUser } from 'lucia';
import type Database from 'better-sqlite3';
import type { Knex } from 'knex';

export type Role = 'member' | 'admin';

interface UserRow {
  id: string;
  email: string;
  display_name: string;
  role: Role;
  email_verified_at: string | null;
  disabled_at: string | null;
}

type SessionUserRow = UserRow & { session_id: string; user_id: string; expires_at: number };
const sessionStatements = new WeakMap<Database.Database, Database.Statement<[string], SessionUserRow>>();
function sessionStatement(conn: Database.Database) {
  let st = sessionStatements.get(conn);
  if (!st) {
    st = conn.prepare(
      'select s.id as session_id, s.user_id, s.expires_at, u.id, u.email, u.display_name, u.role, u.email_verified_at, u.disabled_at ' +
        'from sessions s join users u on u.id = s.user_id where s.id = ?',
    );
    sessionStatements.set(conn, st);
  }
  return st;
}

// Lucia's published SQLite adapter refuses better-sqlite3 12, so this is our own small one over Knex.
// Lucia 3 is now a learning resource upstream: keep this file small and tested so we can own it outright.
export function knexAdapter(db: Knex): Adapter {
  const toSession = (row: { id: string; user_id: string; expires_at: number }): DatabaseSession => ({
    id: row.id,
    userId: row.user_id,
    expiresAt: new Date(Number(row.expires_at)),
    attributes: {},
  });
  const toUser = (row: UserRow): DatabaseUser => ({
    id: row.id,
    attributes: {
      email: row.email,
      displayName: row.display_name,
      role: row.role,
      emailVerified: Boolean(row.email_verified_at),
      disabled: Boolean(row.disabled_at),
    },
  });
  return {
    // Runs on every signed-in request (every Tally tap among them), so it is one prepared statement over the
    // pool's connection rather than a query built per table.
    async getSessionAndUser(sessionId) {
      const conn = (await db.client.acquireConnection()) as Database.Database;
      let row: SessionUserRow | undefined;
      try {
        row = sessionStatement(conn).get(sessionId);
      } finally {
        await db.client.releaseConnection(conn);
      }
      if (!row) return [null, null];
      return [
        toSession({ id: row.session_id, user_id: row.user_id, expires_at: row.expires_at }),
        toUser(row),
      ];
    },
    async getUserSessions(userId) {
      const rows = await db('sessions').where({ user_id: userId });
      return rows.map(toSession);
    },
    async setSession(session) {
      await db('sessions').insert({
        id: session.id,
        user_id: session.userId,
        expires_at: session.expiresAt.getTime(),
      });
    },
    async updateSessionExpiration(sessionId, expiresAt) {
      await db('sessions').where({ id: sessionId }).update({ expires_at: expiresAt.getTime() });
    },
    async deleteSession(sessionId) {
      await db('sessions').where({ id: sessionId }).delete();
    },
    async deleteUserSessions(userId) {
      await db('sessions').where({ user_id: userId }).delete();
    },
    async deleteExpiredSessions() {
      await db('sessions').where('expires_at', '<=', Date.now()).delete();
    },
  };
}

export function createLucia(db: Knex, secure: boolean) {
  return new Lucia(knexAdapter(db), {
    sessionCookie: { name: 'wb_session', attributes: { secure, sameSite: 'lax' } },
    getUserAttributes: (a) => ({
      email: a.email,
      displayName: a.displayName,
      role: a.role,
      emailVerified: a.emailVerified,
      disabled: a.disabled,
    }),
  });
}

export type AppLucia = ReturnType<typeof createLucia>;

declare module 'lucia' {
  interface Register {
    Lucia: AppLucia;
    DatabaseUserAttributes: {
      email: string;
      displayName: string;
      role: Role;
      emailVerified: boolean;
      disabled: boolean;
    };
  }
}
