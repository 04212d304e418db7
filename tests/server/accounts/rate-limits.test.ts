import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { buildUser, createTestUser } from '../../factories/users.js';
import { rateLimitSettings } from '../../../server/lib/rate-limit.js';

// OWASP Authentication Cheat Sheet ("Protect against automated attacks": per-account and per-source limits) and
// NIST SP 800-63B §5.2.2 (limit consecutive failed attempts on an account). The figures are our own defaults.
let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

const signIn = (app: TestContext['app'], email: string, password: string) => request(app).post('/api/auth/signin').send({ email, password });

describe('failed sign-ins', () => {
  it('lock the account after 10 failures in 15 minutes: 429 with Retry-After and a sentence, even for the right password', async () => {
    const user = await createTestUser(t.db);
    for (let i = 0; i < 10; i++) await signIn(t.app, user.email, `wrong password ${i}`).expect(401);
    const locked = await signIn(t.app, user.email, user.password);
    expect(locked.status).toBe(429);
    const retry = Number(locked.headers['retry-after']);
    expect(retry).toBeGreaterThan(14 * 60);
    expect(retry).toBeLessThanOrEqual(15 * 60);
    expect(locked.body).toEqual({ error: expect.stringMatching(/^Too many wrong passwords for this account\. Wait 1[45] minutes/) });
    expect(locked.headers['set-cookie']).toBeUndefined();
    // Another account from the same address is still fine.
    const other = await createTestUser(t.db);
    await signIn(t.app, other.email, other.password).expect(200);
  });

  it('count failures only: many successful sign-ins never lock anyone out', async () => {
    const user = await createTestUser(t.db);
    for (let i = 0; i < 9; i++) await signIn(t.app, user.email, 'not the password').expect(401);
    for (let i = 0; i < 12; i++) await signIn(t.app, user.email, user.password).expect(200);
    // The 9 failures still count: one more is allowed, the 11th failure is not.
    await signIn(t.app, user.email, 'not the password').expect(401);
    await signIn(t.app, user.email, 'not the password').expect(429);
  });

  it('are also limited per address across accounts (30 in 15 minutes), against credential stuffing', async () => {
    const fresh = await createTestContext();
    try {
      for (let i = 0; i < 30; i++) await signIn(fresh.app, `nobody${i}@example.com`, 'guessed password').expect(401);
      const res = await signIn(fresh.app, 'nobody-else@example.com', 'guessed password');
      expect(res.status).toBe(429);
      expect(res.body.error).toMatch(/from this network/);
      expect(res.headers['retry-after']).toBeDefined();
    } finally {
      await fresh.close();
    }
  });

  it('keep their counts per app instance, so one test never locks out another', async () => {
    const fresh = await createTestContext();
    try {
      const user = await createTestUser(fresh.db);
      for (let i = 0; i < 10; i++) await signIn(fresh.app, user.email, 'wrong password x').expect(401);
      const locked = await signIn(fresh.app, user.email, user.password).expect(429);
      expect(locked.body.error).toMatch(/for this account/);
      const { createApp } = await import('../../../server/app.js');
      await signIn(createApp(fresh), user.email, user.password).expect(200);
    } finally {
      await fresh.close();
    }
  });
});

describe('sign-ups and reset requests', () => {
  it('allow 20 sign-ups per address per hour, then 429', async () => {
    const fresh = await createTestContext();
    try {
      for (let i = 0; i < 20; i++) await request(fresh.app).post('/api/auth/signup').send(buildUser()).expect(201);
      const res = await request(fresh.app).post('/api/auth/signup').send(buildUser());
      expect(res.status).toBe(429);
      expect(res.body.error).toMatch(/Too many new accounts.*Wait (59|60) minutes/);
      expect(Number(res.headers['retry-after'])).toBeGreaterThan(3500);
    } finally {
      await fresh.close();
    }
  });

  it('allow 5 reset requests per e-mail address per hour (whether or not it has an account), 20 per network', async () => {
    const fresh = await createTestContext();
    try {
      const ask = (email: string) => request(fresh.app).post('/api/auth/password-reset/request').send({ email });
      for (let i = 0; i < 5; i++) await ask('Someone@example.com').expect(202);
      const res = await ask('someone@example.com');
      expect(res.status).toBe(429);
      expect(res.body.error).toMatch(/already sent several reset links/);
      for (let i = 0; i < 14; i++) await ask(`other${i}@example.com`).expect(202);
      // 5 + 1 refused + 14 = 20 requests counted for the address; the 21st from it is refused whatever the e-mail.
      const net = await ask('fresh-address@example.com');
      expect(net.status).toBe(429);
      expect(net.body.error).toMatch(/from this network/);
    } finally {
      await fresh.close();
    }
  });
});

describe('settings', () => {
  const saved = { ...process.env };
  afterEach(() => {
    process.env = { ...saved };
  });

  it('read RATE_LIMIT_* from the environment, with 0 turning a limit off', async () => {
    process.env.RATE_LIMIT_SIGNIN_PER_ACCOUNT = '2';
    process.env.RATE_LIMIT_SIGNUP_PER_IP = '0';
    const tuned = await createTestContext();
    try {
      const user = await createTestUser(tuned.db);
      await signIn(tuned.app, user.email, 'wrong password a').expect(401);
      await signIn(tuned.app, user.email, 'wrong password b').expect(401);
      await signIn(tuned.app, user.email, user.password).expect(429);
      for (let i = 0; i < 22; i++) await request(tuned.app).post('/api/auth/signup').send(buildUser()).expect(201);
    } finally {
      await tuned.close();
    }
  });

  it('have documented defaults and refuse a bad value with its name', () => {
    expect(rateLimitSettings({})).toEqual({
      RATE_LIMIT_SIGNIN_PER_ACCOUNT: 10,
      RATE_LIMIT_SIGNIN_PER_IP: 30,
      RATE_LIMIT_SIGNUP_PER_IP: 20,
      RATE_LIMIT_RESET_PER_IP: 20,
      RATE_LIMIT_RESET_PER_ACCOUNT: 5,
      RATE_LIMIT_RESEND_PER_ACCOUNT: 5,
      RATE_LIMIT_PASSWORD_CHANGE_PER_ACCOUNT: 10,
    });
    expect(() => rateLimitSettings({ RATE_LIMIT_SIGNUP_PER_IP: 'lots' })).toThrow(/RATE_LIMIT_SIGNUP_PER_IP/);
  });
});
