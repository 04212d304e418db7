import type { Knex } from 'knex';
import type { User } from 'lucia';
import { generateIdFromEntropySize } from 'lucia';
import { hashPassword } from '../lib/password.js';
import type { Role } from '../lib/auth.js';
import { HttpError } from '../lib/http-error.js';

export interface UserRow {
  id: string;
  email: string;
  display_name: string;
  password_hash: string;
  role: Role;
  email_verified_at: string | null;
  disabled_at: string | null;
  last_sign_in_at: string | null;
  created_at: string;
  updated_at: string;
}

export interface PublicUser {
  id: string;
  email: string;
  displayName: string;
  role: Role;
  emailVerified: boolean;
}

export function toPublicUser(u: User | UserRow): PublicUser {
  if ('display_name' in u) {
    return { id: u.id, email: u.email, displayName: u.display_name, role: u.role, emailVerified: Boolean(u.email_verified_at) };
  }
  return { id: u.id, email: u.email, displayName: u.displayName, role: u.role, emailVerified: u.emailVerified };
}

export const normalizeEmail = (email: string) => email.trim().toLowerCase();

export async function findUserByEmail(db: Knex, email: string) {
  return db<UserRow>('users').where({ email: normalizeEmail(email) }).first();
}

export async function createUser(
  db: Knex,
  input: { email: string; password: string; displayName: string; role?: Role; emailVerified?: boolean },
): Promise<UserRow> {
  const email = normalizeEmail(input.email);
  if (await findUserByEmail(db, email)) throw new HttpError(409, 'An account with that e-mail already exists. Try signing in instead.');
  const row = {
    id: generateIdFromEntropySize(10),
    email,
    display_name: input.displayName.trim(),
    password_hash: await hashPassword(input.password),
    role: input.role ?? 'member',
    email_verified_at: input.emailVerified ? new Date().toISOString() : null,
  };
  await db('users').insert(row);
  return (await db<UserRow>('users').where({ id: row.id }).first())!;
}
