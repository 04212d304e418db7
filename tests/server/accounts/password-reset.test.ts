import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser } from '../../factories/users.js';
import { hashToken, TOKEN_TTL_MS } from '../../../server/services/accounts.js';
import { countMail, mailTo, sleep, tokenFrom, waitForMail } from './helpers.js';

// Follows the OWASP Forgot Password Cheat Sheet: the same answer whether or not the account exists, a random
// single-use token stored hashed and valid for a short time (1 hour), every session ended after the reset, no
// automatic sign-in, and a notice e-mail afterwards. New passwords follow NIST SP 800-63B §5.1.1.
let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

async function requestToken(email: string) {
  const match = mailTo(email, /Choose a new Whorlbook password/);
  const skip = await countMail(t, match);
  await request(t.app).post('/api/auth/password-reset/request').send({ email }).expect(202);
  return tokenFrom(await waitForMail(t, match, { skip }), '/reset-password');
}

describe('POST /api/auth/password-reset/request', () => {
  it('answers 202 with the same body whether or not an account exists, and mails only a real account', async () => {
    const user = await createTestUser(t.db);
    const known = await request(t.app).post('/api/auth/password-reset/request').send({ email: user.email.toUpperCase() });
    const unknown = await request(t.app).post('/api/auth/password-reset/request').send({ email: 'nobody-here@example.com' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(202);
    expect(known.body).toEqual(unknown.body);
    expect(known.body.message).toMatch(/If an account uses that e-mail address/);

    const mail = await waitForMail(t, mailTo(user.email, /Choose a new Whorlbook password/));
    expect(mail.text).toMatch(/\/reset-password\?token=[A-Za-z0-9_-]{43}/);
    expect(mail.text).toContain('1 hour');
    await sleep(100);
    expect((await t.mailer.outbox!()).some((m) => m.to === 'nobody-here@example.com')).toBe(false);
  });

  it('stores the token hashed with a 1-hour expiry', async () => {
    const user = await createTestUser(t.db);
    const before = Date.now();
    const token = await requestToken(user.email);
    const row = await t.db('auth_tokens').where({ user_id: user.id, purpose: 'reset_password' }).first();
    expect(row.token_hash).toBe(hashToken(token));
    expect(JSON.stringify(row)).not.toContain(token);
    expect(TOKEN_TTL_MS.reset_password).toBe(3600 * 1000);
    expect(Number(row.expires_at) - before).toBeGreaterThanOrEqual(3600 * 1000);
    expect(Number(row.expires_at) - Date.now()).toBeLessThanOrEqual(3600 * 1000);
  });

  it('sends nothing to a disabled account, with the same 202', async () => {
    const user = await createTestUser(t.db);
    await t.db('users').where({ id: user.id }).update({ disabled_at: new Date().toISOString() });
    const res = await request(t.app).post('/api/auth/password-reset/request').send({ email: user.email });
    expect(res.status).toBe(202);
    await sleep(100);
    expect((await t.mailer.outbox!()).some((m) => m.to === user.email)).toBe(false);
  });

  it('answers 422 for an address that is not an e-mail', async () => {
    const res = await request(t.app).post('/api/auth/password-reset/request').send({ email: 'nope' });
    expect(res.status).toBe(422);
    expect(res.body.issues[0].path).toBe('email');
  });
});

describe('POST /api/auth/password-reset/confirm', () => {
  it('sets the new password, ends every session, and the old password stops working', async () => {
    const user = await createTestUser(t.db);
    const phone = request.agent(t.app);
    const laptop = request.agent(t.app);
    await phone.post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);
    await laptop.post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);
    const token = await requestToken(user.email);

    const res = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'a brand new passphrase' });
    expect(res.status).toBe(200);
    expect(res.body.message).toMatch(/Sign in with the new password/);
    expect(res.headers['set-cookie']).toBeUndefined(); // no automatic sign-in
    await phone.get('/api/auth/me').expect(401);
    await laptop.get('/api/auth/me').expect(401);
    expect(await t.db('sessions').where({ user_id: user.id })).toHaveLength(0);

    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(401);
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: 'a brand new passphrase' }).expect(200);
    const notice = await waitForMail(t, mailTo(user.email, /password was changed/));
    expect(notice.text).toMatch(/Forgot your password/);
  });

  it('is single-use, and using one link retires every other outstanding link', async () => {
    const user = await createTestUser(t.db);
    const first = await requestToken(user.email);
    const second = await requestToken(user.email);
    expect(first).not.toBe(second);
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token: second, password: 'another new passphrase' }).expect(200);
    const reuse = await request(t.app).post('/api/auth/password-reset/confirm').send({ token: second, password: 'yet another passphrase' });
    expect(reuse.status).toBe(400);
    expect(reuse.body.error).toMatch(/already used/);
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token: first, password: 'yet another passphrase' }).expect(400);
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: 'another new passphrase' }).expect(200);
  });

  it('refuses an expired token and keeps the old password', async () => {
    const user = await createTestUser(t.db);
    const token = await requestToken(user.email);
    await t.db('auth_tokens').where({ token_hash: hashToken(token) }).update({ expires_at: Date.now() - 1 });
    const res = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'too late passphrase' });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/expired/);
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);
  });

  it('refuses a verification token used as a reset token', async () => {
    const user = await createTestUser(t.db, { emailVerified: false });
    const { issueToken } = await import('../../../server/services/accounts.js');
    const verify = await issueToken(t.db, user.row, 'verify_email');
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token: verify, password: 'sneaky new passphrase' }).expect(400);
  });

  it('answers 422 for a short new password and leaves the token usable', async () => {
    const user = await createTestUser(t.db);
    const token = await requestToken(user.email);
    const res = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'short' });
    expect(res.status).toBe(422);
    expect(res.body.issues[0].path).toBe('password');
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'long enough passphrase' }).expect(200);
  });

  it('counts the reset as confirming an unconfirmed address (the link reached it)', async () => {
    const user = await createTestUser(t.db, { emailVerified: false });
    const token = await requestToken(user.email);
    await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'long enough passphrase' }).expect(200);
    expect((await t.db('users').where({ id: user.id }).first()).email_verified_at).not.toBeNull();
  });

  it('refuses a disabled account even with a valid link', async () => {
    const user = await createTestUser(t.db);
    const token = await requestToken(user.email);
    await t.db('users').where({ id: user.id }).update({ disabled_at: new Date().toISOString() });
    const res = await request(t.app).post('/api/auth/password-reset/confirm').send({ token, password: 'long enough passphrase' });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/disabled/);
  });

  it('refuses a confirm sent from another site', async () => {
    const user = await createTestUser(t.db);
    const token = await requestToken(user.email);
    await request(t.app).post('/api/auth/password-reset/confirm').set('Origin', 'https://evil.example').send({ token, password: 'long enough passphrase' }).expect(403);
  });
});
