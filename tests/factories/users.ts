import type { Knex } from 'knex';
import request from 'supertest';
import type { Express } from 'express';
import { createUser } from '../../server/services/users.js';

let n = 0;

export function buildUser(overrides: Partial<{ email: string; password: string; displayName: string; role: 'member' | 'admin' }> = {}) {
  n += 1;
  return {
    email: `maker${n}-${Date.now()}@example.com`,
    password: 'a-long-test-password',
    displayName: `Test maker ${n}`,
    ...overrides,
  };
}

export async function createTestUser(db: Knex, overrides: Parameters<typeof buildUser>[0] & { emailVerified?: boolean } = {}) {
  const input = buildUser(overrides);
  const row = await createUser(db, { ...input, emailVerified: overrides.emailVerified ?? true });
  return { ...input, id: row.id, row };
}

/** Creates a member and returns a cookie-keeping agent signed in as them. */
export async function signedInAgent(app: Express, db: Knex, overrides: Parameters<typeof createTestUser>[1] = {}) {
  const user = await createTestUser(db, overrides);
  const a = request.agent(app);
  const res = await a.post('/api/auth/signin').send({ email: user.email, password: user.password });
  if (res.status !== 200) throw new Error(`sign-in failed in test set-up: ${res.status} ${JSON.stringify(res.body)}`);
  return { agent: a, user };
}
