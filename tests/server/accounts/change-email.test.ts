import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser, signedInAgent } from '../../factories/users.js';
import { countMail, mailTo, tokenFrom, waitForMail } from './helpers.js';

// OWASP Authentication Cheat Sheet (re-authenticate before changing the sign-in address; confirm the new address
// before using it; tell the old one) and OWASP Forgot Password Cheat Sheet (same answer whether or not an address
// has an account).
let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

let n = 0;
const fresh = () => `new-home-${++n}-${Date.now()}@example.com`;

describe('changing the sign-in e-mail', () => {
  it('sends a link to the new address, changes nothing until it is opened, then switches, confirms and tells the old address', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const next = fresh();
    const res = await agent.post('/api/auth/email').send({ email: `  ${next.toUpperCase()} `, password: user.password });
    expect(res.status).toBe(202);
    expect(res.body.message).toContain(next);
    const mail = await waitForMail(t, mailTo(next, /Confirm your new e-mail/));
    // Until the link is opened the old address still signs in.
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);

    const token = tokenFrom(mail, '/change-email');
    const done = await request(t.app).post('/api/auth/email/confirm').send({ token });
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({ ok: true, email: next });
    const me = await agent.get('/api/auth/me').expect(200);
    expect(me.body.user).toMatchObject({ email: next, emailVerified: true });
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(401);
    await request(t.app).post('/api/auth/signin').send({ email: next, password: user.password }).expect(200);
    await waitForMail(t, mailTo(user.email, /e-mail was changed/));

    // The link works once.
    const again = await request(t.app).post('/api/auth/email/confirm').send({ token });
    expect(again.status).toBe(400);
    expect(again.body.error).toMatch(/already used/);
  });

  it('answers an address that already has an account the same way, changes nothing, and tells that address instead', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const other = await createTestUser(t.db);
    const res = await agent.post('/api/auth/email').send({ email: other.email, password: user.password });
    expect(res.status).toBe(202);
    expect(res.body.message).toContain(other.email);
    await waitForMail(t, mailTo(other.email, /tried to use this address/));
    expect(await countMail(t, mailTo(other.email, /Confirm your new e-mail/))).toBe(0);
    expect(await t.db('auth_tokens').where({ user_id: user.id, purpose: 'change_email' })).toHaveLength(0);
    expect((await t.db('users').where({ id: user.id }).first()).email).toBe(user.email);
  });

  it('refuses a wrong password (403), the same address (422), bad input, signed out, and another origin', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const wrong = await agent.post('/api/auth/email').send({ email: fresh(), password: 'not my password' });
    expect(wrong.status).toBe(403);
    expect(wrong.body.issues).toEqual([{ path: 'password', message: 'That is not your password.' }]);
    const same = await agent.post('/api/auth/email').send({ email: user.email.toUpperCase(), password: user.password });
    expect(same.status).toBe(422);
    expect(same.body.issues).toEqual([{ path: 'email', message: 'That is already your e-mail address.' }]);
    const bad = await agent.post('/api/auth/email').send({ email: 'not an address', password: '' });
    expect([400, 422]).toContain(bad.status);
    expect(bad.body.issues.map((i: { path: string }) => i.path).sort()).toEqual(['email', 'password']);
    await request(t.app).post('/api/auth/email').send({ email: fresh(), password: user.password }).expect(401);
    await agent.post('/api/auth/email').set('Origin', 'https://elsewhere.example').send({ email: fresh(), password: user.password }).expect(403);
    expect(await t.db('auth_tokens').where({ user_id: user.id, purpose: 'change_email' })).toHaveLength(0);
  });

  it('refuses a link whose address was taken meanwhile, and retires older links once an address change lands', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const first = fresh();
    const second = fresh();
    await agent.post('/api/auth/email').send({ email: first, password: user.password }).expect(202);
    await agent.post('/api/auth/email').send({ email: second, password: user.password }).expect(202);
    const firstToken = tokenFrom(await waitForMail(t, mailTo(first, /Confirm your new e-mail/)), '/change-email');
    const secondToken = tokenFrom(await waitForMail(t, mailTo(second, /Confirm your new e-mail/)), '/change-email');

    // Someone signs up with the first address before the link is opened.
    await request(t.app).post('/api/auth/signup').send({ email: first, password: 'a long enough password', displayName: 'Quick' }).expect(201);
    const taken = await request(t.app).post('/api/auth/email/confirm').send({ token: firstToken });
    expect(taken.status).toBe(409);
    expect((await t.db('users').where({ id: user.id }).first()).email).toBe(user.email);

    // A reset link sent to the old address stops working once the address changes.
    await request(t.app).post('/api/auth/password-reset/request').send({ email: user.email }).expect(202);
    const resetToken = tokenFrom(await waitForMail(t, mailTo(user.email, /Choose a new Whorlbook password/)), '/reset-password');
    await request(t.app).post('/api/auth/email/confirm').send({ token: secondToken }).expect(200);
    const reset = await request(t.app).post('/api/auth/password-reset/confirm').send({ token: resetToken, password: 'another long passphrase' });
    expect(reset.status).toBe(400);
  });

  it('refuses an expired or unknown link with a sentence', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const next = fresh();
    await agent.post('/api/auth/email').send({ email: next, password: user.password }).expect(202);
    const token = tokenFrom(await waitForMail(t, mailTo(next, /Confirm your new e-mail/)), '/change-email');
    await t.db('auth_tokens').where({ user_id: user.id, purpose: 'change_email' }).update({ expires_at: Date.now() - 1 });
    const expired = await request(t.app).post('/api/auth/email/confirm').send({ token });
    expect(expired.status).toBe(400);
    expect(expired.body.error).toMatch(/expired \(links last 24 hours\)/);
    const unknown = await request(t.app).post('/api/auth/email/confirm').send({ token: 'A'.repeat(43) });
    expect(unknown.status).toBe(400);
    expect(unknown.body.error).toMatch(/not valid/);
  });
});
