import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { buildUser, signedInAgent } from '../../factories/users.js';
import { hashToken, TOKEN_TTL_MS } from '../../../server/services/accounts.js';
import { mailTo, tokenFrom, waitForMail } from './helpers.js';

// OWASP Forgot Password Cheat Sheet (token handling applies to verification links too): random, single-use,
// stored hashed, expiring.
let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

async function signUpAndGetToken() {
  const input = buildUser();
  const a = request.agent(t.app);
  await a.post('/api/auth/signup').send(input).expect(201);
  const token = tokenFrom(await waitForMail(t, mailTo(input.email, /Confirm your e-mail/)), '/verify-email');
  return { input, a, token };
}

describe('POST /api/auth/verify-email', () => {
  it('confirms the address with the mailed token, signed in or not, and /me then says so', async () => {
    const { input, a, token } = await signUpAndGetToken();
    const res = await request(t.app).post('/api/auth/verify-email').send({ token }); // another device, signed out
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true, email: input.email });
    expect((await a.get('/api/auth/me')).body.user.emailVerified).toBe(true);
  });

  it('stores only the SHA-256 of the token, with a 48-hour expiry', async () => {
    const before = Date.now();
    const { input, token } = await signUpAndGetToken();
    const user = await t.db('users').where({ email: input.email }).first();
    const rows = await t.db('auth_tokens').where({ user_id: user.id });
    expect(rows).toHaveLength(1);
    expect(rows[0].token_hash).toBe(hashToken(token));
    expect(rows[0].token_hash).toMatch(/^[0-9a-f]{64}$/);
    expect(JSON.stringify(rows)).not.toContain(token);
    expect(rows[0].purpose).toBe('verify_email');
    expect(TOKEN_TTL_MS.verify_email).toBe(48 * 3600 * 1000);
    const expires = Number(rows[0].expires_at);
    expect(expires).toBeGreaterThanOrEqual(before + TOKEN_TTL_MS.verify_email);
    expect(expires).toBeLessThanOrEqual(Date.now() + TOKEN_TTL_MS.verify_email);
  });

  it('refuses a token used before (single-use)', async () => {
    const { token } = await signUpAndGetToken();
    await request(t.app).post('/api/auth/verify-email').send({ token }).expect(200);
    const again = await request(t.app).post('/api/auth/verify-email').send({ token });
    expect(again.status).toBe(400);
    expect(again.body.error).toMatch(/already used/);
  });

  it('refuses an expired token and leaves the address unconfirmed', async () => {
    const { input, token } = await signUpAndGetToken();
    await t.db('auth_tokens').where({ token_hash: hashToken(token) }).update({ expires_at: Date.now() - 1000 });
    const res = await request(t.app).post('/api/auth/verify-email').send({ token });
    expect(res.status).toBe(400);
    expect(res.body.error).toMatch(/expired/);
    expect((await t.db('users').where({ email: input.email }).first()).email_verified_at).toBeNull();
  });

  it('refuses an unknown token, and a reset token used as a verification token', async () => {
    const unknown = await request(t.app).post('/api/auth/verify-email').send({ token: 'A'.repeat(43) });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error).toMatch(/not valid/);
    const { input } = await signUpAndGetToken();
    await request(t.app).post('/api/auth/password-reset/request').send({ email: input.email }).expect(202);
    const reset = tokenFrom(await waitForMail(t, mailTo(input.email, /new Whorlbook password/)), '/reset-password');
    await request(t.app).post('/api/auth/verify-email').send({ token: reset }).expect(400);
  });

  it('answers 422 for a missing or malformed token, before any lookup', async () => {
    const missing = await request(t.app).post('/api/auth/verify-email').send({});
    expect(missing.status).toBe(422);
    expect(missing.body.issues[0].path).toBe('token');
    await request(t.app).post('/api/auth/verify-email').send({ token: "x' OR 1=1 --" }).expect(422);
  });

  it('refuses a request from another site', async () => {
    const { token } = await signUpAndGetToken();
    await request(t.app).post('/api/auth/verify-email').set('Origin', 'https://evil.example').send({ token }).expect(403);
  });
});

describe('POST /api/auth/verify-email/resend', () => {
  it('mails a new link, and that link confirms the address', async () => {
    const { input, a } = await signUpAndGetToken();
    const res = await a.post('/api/auth/verify-email/resend');
    expect(res.status).toBe(202);
    expect(res.body.message).toContain(input.email);
    const mails = (await t.mailer.outbox!()).filter(mailTo(input.email, /Confirm your e-mail/));
    expect(mails).toHaveLength(2);
    const newest = tokenFrom(mails[1]!, '/verify-email');
    await request(t.app).post('/api/auth/verify-email').send({ token: newest }).expect(200);
  });

  it('needs a signed-in member (401), and says so when the address is already confirmed (409)', async () => {
    await request(t.app).post('/api/auth/verify-email/resend').expect(401);
    const { agent } = await signedInAgent(t.app, t.db, { emailVerified: true });
    const res = await agent.post('/api/auth/verify-email/resend');
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/already confirmed/);
  });

  it('is rate limited per member: the 6th within an hour is 429 with Retry-After and a sentence', async () => {
    const { agent } = await signedInAgent(t.app, t.db, { emailVerified: false });
    for (let i = 0; i < 5; i++) await agent.post('/api/auth/verify-email/resend').expect(202);
    const res = await agent.post('/api/auth/verify-email/resend');
    expect(res.status).toBe(429);
    expect(Number(res.headers['retry-after'])).toBeGreaterThan(3000);
    expect(Number(res.headers['retry-after'])).toBeLessThanOrEqual(3600);
    expect(res.body.error).toMatch(/already sent several confirmation e-mails.*wait (59|60) minutes/);
    // Another member is not affected.
    const other = await signedInAgent(t.app, t.db, { emailVerified: false });
    await other.agent.post('/api/auth/verify-email/resend').expect(202);
  });
});
