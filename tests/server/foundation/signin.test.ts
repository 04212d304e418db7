import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Scrypt } from 'lucia';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser } from '../../factories/users.js';
import { hashPassword, verifyPassword } from '../../../server/lib/password.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

describe('password hashes', () => {
  it("are in the format Lucia's Scrypt.verify accepts, and verify back", async () => {
    const hash = await hashPassword('correct horse battery');
    expect(await new Scrypt().verify(hash, 'correct horse battery')).toBe(true);
    expect(await verifyPassword(hash, 'correct horse battery')).toBe(true);
    expect(await verifyPassword(hash, 'wrong horse battery')).toBe(false);
    // and the other way round: a hash Lucia made verifies with ours
    expect(await verifyPassword(await new Scrypt().hash('ünïcode pass'), 'ünïcode pass')).toBe(true);
  });
});

describe('POST /api/auth/signin', () => {
  it('signs in with the right password, sets an HttpOnly SameSite=Lax cookie, and /me knows the member', async () => {
    const user = await createTestUser(t.db, { email: 'Mixed.Case@Example.com' });
    const agent = request.agent(t.app);
    const res = await agent.post('/api/auth/signin').send({ email: 'mixed.case@example.com', password: user.password });
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ email: 'mixed.case@example.com', displayName: user.displayName, role: 'member' });
    const cookie = String(res.headers['set-cookie']);
    expect(cookie).toMatch(/wb_session=/);
    expect(cookie).toMatch(/HttpOnly/i);
    expect(cookie).toMatch(/SameSite=Lax/i);
    expect(cookie).not.toMatch(/Secure/i); // APP_ORIGIN is not https here

    const me = await agent.get('/api/auth/me');
    expect(me.status).toBe(200);
    expect(me.body.user).toEqual({ id: user.id, email: 'mixed.case@example.com', displayName: user.displayName, role: 'member', emailVerified: true });
  });

  it('refuses a wrong password and an unknown e-mail with the same 401 message', async () => {
    const user = await createTestUser(t.db);
    const wrong = await request(t.app).post('/api/auth/signin').send({ email: user.email, password: 'not-the-password' });
    const unknown = await request(t.app).post('/api/auth/signin').send({ email: 'nobody@example.com', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(401);
    expect(wrong.body.error).toBe(unknown.body.error);
    expect(wrong.headers['set-cookie']).toBeUndefined();
  });

  it('answers bad input with 422 and the zod issues', async () => {
    const res = await request(t.app).post('/api/auth/signin').send({ email: 'not-an-email' });
    expect(res.status).toBe(422);
    expect(res.body.issues.map((i: { path: string }) => i.path)).toEqual(expect.arrayContaining(['email', 'password']));
  });

  it('signs out and the cookie no longer works', async () => {
    const user = await createTestUser(t.db);
    const agent = request.agent(t.app);
    await agent.post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);
    await agent.post('/api/auth/signout').expect(200);
    await agent.get('/api/auth/me').expect(401);
  });

  it('answers /me with 401 when signed out', async () => {
    const res = await request(t.app).get('/api/auth/me');
    expect(res.status).toBe(401);
    expect(res.body.error).toMatch(/sign in/i);
  });

  it('sets the Secure flag when APP_ORIGIN is https', async () => {
    const secure = await createTestContext({ APP_ORIGIN: 'https://whorlbook.example' });
    try {
      secure.lucia = (await import('../../../server/lib/auth.js')).createLucia(secure.db, true);
      const { createApp } = await import('../../../server/app.js');
      const app = createApp(secure);
      const user = await createTestUser(secure.db);
      const res = await request(app).post('/api/auth/signin').send({ email: user.email, password: user.password });
      expect(String(res.headers['set-cookie'])).toMatch(/Secure/);
    } finally {
      await secure.close();
    }
  });
});

describe('the same-origin guard', () => {
  it('refuses a state-changing request from another origin with 403', async () => {
    const user = await createTestUser(t.db);
    const res = await request(t.app)
      .post('/api/auth/signin')
      .set('Origin', 'https://evil.example')
      .send({ email: user.email, password: user.password });
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/another site/);
  });

  it('refuses a foreign Referer when there is no Origin, and an opaque "null" origin', async () => {
    await request(t.app).post('/api/auth/signout').set('Referer', 'https://evil.example/page').expect(403);
    await request(t.app).post('/api/auth/signout').set('Origin', 'null').expect(403);
  });

  it("accepts the request's own host, and APP_ORIGIN when set", async () => {
    const res = await request(t.app).post('/api/auth/signout').set('Host', 'localhost:3999').set('Origin', 'http://localhost:3999');
    expect(res.status).toBe(200);
    const withOrigin = await createTestContext({ APP_ORIGIN: 'https://whorlbook.example' });
    try {
      await request(withOrigin.app).post('/api/auth/signout').set('Origin', 'https://whorlbook.example').expect(200);
      await request(withOrigin.app).post('/api/auth/signout').set('Origin', 'https://other.example').expect(403);
    } finally {
      await withOrigin.close();
    }
  });

  it('lets safe methods through from anywhere', async () => {
    await request(t.app).get('/api/health').set('Origin', 'https://evil.example').expect(200);
  });
});
