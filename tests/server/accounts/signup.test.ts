import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { buildUser, createTestUser } from '../../factories/users.js';
import { mailTo, tokenFrom, waitForMail } from './helpers.js';

// Password rules follow NIST SP 800-63B §5.1.1 (length, no composition rules, common-password check);
// the rest follows the OWASP Authentication Cheat Sheet.
let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

describe('POST /api/auth/signup', () => {
  it('creates the member, answers 201 { user }, signs in and mails a verification link', async () => {
    const input = buildUser({ email: 'New.Maker@Example.com', displayName: '  Ada Loop  ' });
    const a = request.agent(t.app);
    const res = await a.post('/api/auth/signup').set('Host', 'localhost:5173').send(input);
    expect(res.status).toBe(201);
    expect(res.body).toEqual({ user: { id: expect.any(String), email: 'new.maker@example.com', displayName: 'Ada Loop', role: 'member', emailVerified: false } });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/wb_session=[^;]+;/);
    expect(cookie).toMatch(/HttpOnly/i);

    const me = await a.get('/api/auth/me').expect(200);
    expect(me.body.user.email).toBe('new.maker@example.com');

    const mail = await waitForMail(t, mailTo('new.maker@example.com', /Confirm your e-mail/));
    expect(mail.text).toContain('Hello Ada Loop,');
    expect(mail.html).toContain('Confirm my e-mail');
    // Without APP_ORIGIN the link uses the origin the request came to (the fake keeps mail on this machine).
    expect(mail.text).toMatch(/http:\/\/localhost:5173\/verify-email\?token=[A-Za-z0-9_-]{43}\b/);
    expect(tokenFrom(mail, '/verify-email')).toHaveLength(43);

    const row = await t.db('users').where({ email: 'new.maker@example.com' }).first();
    expect(row.password_hash).not.toContain(input.password);
    expect(row.email_verified_at).toBeNull();
  });

  it('builds links from APP_ORIGIN when it is set, whatever Host the request names', async () => {
    const o = await createTestContext({ APP_ORIGIN: 'https://whorlbook.example' });
    try {
      const input = buildUser();
      await request(o.app).post('/api/auth/signup').set('Host', 'evil.example').send(input).expect(201);
      const mail = await waitForMail(o, mailTo(input.email, /Confirm/));
      expect(mail.text).toMatch(/https:\/\/whorlbook\.example\/verify-email\?token=/);
      expect(mail.text).not.toContain('evil.example');
    } finally {
      await o.close();
    }
  });

  it('answers 409 for an e-mail that already has an account, in any letter case', async () => {
    const existing = await createTestUser(t.db, { email: 'taken@example.com' });
    const res = await request(t.app).post('/api/auth/signup').send(buildUser({ email: 'TAKEN@example.com' }));
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/already exists/);
    expect(res.headers['set-cookie']).toBeUndefined();
    expect(await t.db('users').where({ email: existing.email }).count({ n: '*' }).first()).toEqual({ n: 1 });
  });

  it.each([
    ['not an e-mail', { email: 'not-an-email' }, 'email'],
    ['a password under 10 characters', { password: 'short-pw1' }, 'password'],
    ['a password over 256 characters', { password: 'x'.repeat(100) + 'y'.repeat(100) + 'z'.repeat(57) }, 'password'],
    ['a missing name', { displayName: '   ' }, 'displayName'],
    ['a very common password', { password: 'password123' }, 'password'],
  ])('answers 422 with the zod issues for %s', async (_label, change, path) => {
    const res = await request(t.app).post('/api/auth/signup').send({ ...buildUser(), ...change });
    expect(res.status).toBe(422);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toContain(path);
    expect(res.body.error).toMatch(/Please check the form/);
  });

  it('accepts exactly 10 and exactly 256 characters (NIST SP 800-63B: at least 8; we ask 10, and allow long passphrases)', async () => {
    await request(t.app).post('/api/auth/signup').send(buildUser({ password: 'ten-chars!' })).expect(201);
    await request(t.app).post('/api/auth/signup').send(buildUser({ password: 'ab cd '.repeat(42) + 'efgh' })).expect(201);
  });

  it('refuses a sign-up sent from another site (same-origin guard)', async () => {
    const res = await request(t.app).post('/api/auth/signup').set('Origin', 'https://evil.example').send(buildUser());
    expect(res.status).toBe(403);
  });

  it('ends a session the browser already had, and the new member is the one signed in', async () => {
    const first = await createTestUser(t.db);
    const a = request.agent(t.app);
    await a.post('/api/auth/signin').send({ email: first.email, password: first.password }).expect(200);
    const oldSessions = await t.db('sessions').where({ user_id: first.id });
    expect(oldSessions).toHaveLength(1);
    const input = buildUser();
    await a.post('/api/auth/signup').send(input).expect(201);
    expect(await t.db('sessions').where({ user_id: first.id })).toHaveLength(0);
    expect((await a.get('/api/auth/me')).body.user.email).toBe(input.email);
  });
});
