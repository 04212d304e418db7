import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { signedInAgent } from '../../factories/users.js';
import { mailTo, waitForMail } from './helpers.js';

// OWASP Authentication Cheat Sheet ("Require re-authentication for sensitive features": the current password is
// asked again) and NIST SP 800-63B §5.1.1 for the new one.
let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

describe('POST /api/auth/password', () => {
  it('changes the password, keeps this session and ends the others', async () => {
    const { agent: phone, user } = await signedInAgent(t.app, t.db);
    const laptop = request.agent(t.app);
    await laptop.post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);

    const res = await phone.post('/api/auth/password').send({ current: user.password, next: 'my new long passphrase' });
    expect(res.status).toBe(200);
    expect(res.body.message).toMatch(/Other devices were signed out/);
    await phone.get('/api/auth/me').expect(200);
    await laptop.get('/api/auth/me').expect(401);
    expect(await t.db('sessions').where({ user_id: user.id })).toHaveLength(1);

    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(401);
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: 'my new long passphrase' }).expect(200);
    await waitForMail(t, mailTo(user.email, /password was changed/));
  });

  it('refuses a wrong current password with 403 and an issue on "current", changing nothing', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const res = await agent.post('/api/auth/password').send({ current: 'not my password', next: 'my new long passphrase' });
    expect(res.status).toBe(403);
    expect(res.body).toEqual({ error: 'That is not your current password.', issues: [{ path: 'current', message: 'That is not your current password.' }] });
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);
  });

  it('answers 422 for a short new password, or one equal to the current', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const short = await agent.post('/api/auth/password').send({ current: user.password, next: 'short' });
    expect(short.status).toBe(422);
    expect(short.body.issues[0].path).toBe('next');
    const same = await agent.post('/api/auth/password').send({ current: user.password, next: user.password });
    expect(same.status).toBe(422);
    expect(same.body.issues[0].message).toMatch(/differs from the current/);
  });

  it('needs a signed-in member', async () => {
    await request(t.app).post('/api/auth/password').send({ current: 'whatever-current', next: 'my new long passphrase' }).expect(401);
  });

  it('refuses a change sent from another site', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    await agent.post('/api/auth/password').set('Origin', 'https://evil.example').send({ current: user.password, next: 'my new long passphrase' }).expect(403);
  });

  it('locks after 10 wrong current passwords in 15 minutes (429), so a borrowed session cannot guess it', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    for (let i = 0; i < 10; i++) await agent.post('/api/auth/password').send({ current: `wrong guess ${i}`, next: 'my new long passphrase' }).expect(403);
    const res = await agent.post('/api/auth/password').send({ current: user.password, next: 'my new long passphrase' });
    expect(res.status).toBe(429);
    expect(res.headers['retry-after']).toBeDefined();
    expect(res.body.error).toMatch(/Too many wrong current passwords/);
  });
});
