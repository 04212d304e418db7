import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser, signedInAgent } from '../../factories/users.js';

let t: TestContext;
let admin: Awaited<ReturnType<typeof signedInAgent>>;
beforeAll(async () => {
  t = await createTestContext();
  admin = await signedInAgent(t.app, t.db, { role: 'admin', displayName: 'Head admin', email: 'head-admin@example.com' });
});
afterAll(() => t.close());

async function addProjects(ownerId: string, n: number) {
  for (let i = 0; i < n; i++) await t.db('projects').insert({ owner_id: ownerId, title: `Project ${i}` });
}

describe('who may use /api/admin', () => {
  const routes: Array<['get' | 'post', string]> = [
    ['get', '/api/admin/users'],
    ['post', '/api/admin/users/abc/disable'],
    ['post', '/api/admin/users/abc/enable'],
    ['post', '/api/admin/users/abc/role'],
    ['get', '/api/admin/anything-else'],
  ];

  it.each(routes)('%s %s: 401 signed out', async (method, url) => {
    const res = await request(t.app)[method](url);
    expect(res.status).toBe(401);
    expect(res.body.error).toMatch(/sign in/i);
  });

  it.each(routes)('%s %s: 403 for a member', async (method, url) => {
    const { agent } = await signedInAgent(t.app, t.db);
    const res = await agent[method](url);
    expect(res.status).toBe(403);
    expect(res.body.error).toMatch(/Only an admin/);
  });
});

describe('GET /api/admin/users', () => {
  let people: Awaited<ReturnType<typeof createTestUser>>[];
  beforeAll(async () => {
    people = [];
    for (const [name, projects] of [['Bramble Fenwick', 3], ['Clover Ashby', 0], ['Alder Quince', 7]] as const) {
      const u = await createTestUser(t.db, { displayName: name, email: `${name.split(' ')[0]!.toLowerCase()}@search.example` });
      await addProjects(u.id, projects);
      people.push(u);
    }
    await t.db('users').where({ id: people[0]!.id }).update({ last_sign_in_at: '2026-11-30T10:00:00.000Z' });
    await t.db('users').where({ id: people[2]!.id }).update({ last_sign_in_at: '2026-11-01T10:00:00.000Z' });
  });

  it('lists members with their project count and last sign-in, filtered by text in the name or e-mail', async () => {
    const res = await admin.agent.get('/api/admin/users').query({ query: 'search.example', sort: 'name' });
    expect(res.status).toBe(200);
    expect(res.body).toMatchObject({ page: 1, pageSize: 20, total: 3, pageCount: 1 });
    expect(res.body.users.map((u: { displayName: string }) => u.displayName)).toEqual(['Alder Quince', 'Bramble Fenwick', 'Clover Ashby']);
    expect(res.body.users[0]).toEqual({
      id: people[2]!.id,
      email: 'alder@search.example',
      displayName: 'Alder Quince',
      role: 'member',
      emailVerified: true,
      disabled: false,
      disabledAt: null,
      lastSignInAt: '2026-11-01T10:00:00.000Z',
      createdAt: expect.any(String),
      projectCount: 7,
    });
    const byName = await admin.agent.get('/api/admin/users').query({ query: 'CLOVER' });
    expect(byName.body.users.map((u: { email: string }) => u.email)).toEqual(['clover@search.example']);
  });

  it('sorts on the server by projects, last sign-in, name or e-mail, either way', async () => {
    const names = async (sort: string) =>
      (await admin.agent.get('/api/admin/users').query({ query: 'search.example', sort })).body.users.map((u: { displayName: string }) => u.displayName.split(' ')[0]);
    expect(await names('-projects')).toEqual(['Alder', 'Bramble', 'Clover']);
    expect(await names('projects')).toEqual(['Clover', 'Bramble', 'Alder']);
    expect(await names('-lastSignIn')).toEqual(['Bramble', 'Alder', 'Clover']); // never signed in comes last
    expect(await names('-name')).toEqual(['Clover', 'Bramble', 'Alder']);
    expect(await names('email')).toEqual(['Alder', 'Bramble', 'Clover']);
  });

  it('treats % and _ in the search text as plain characters', async () => {
    const res = await admin.agent.get('/api/admin/users').query({ query: '%' });
    expect(res.body.total).toBe(0);
  });

  it('pages 20 at a time', async () => {
    const fresh = await createTestContext();
    try {
      const boss = await signedInAgent(fresh.app, fresh.db, { role: 'admin' });
      for (let i = 0; i < 44; i++) await fresh.db('users').insert({ id: `pager${String(i).padStart(3, '0')}`, email: `pager${i}@example.com`, display_name: `Pager ${String(i).padStart(2, '0')}`, password_hash: 'x:y' });
      const p1 = await boss.agent.get('/api/admin/users').query({ query: 'pager', sort: 'name', page: 1 });
      const p3 = await boss.agent.get('/api/admin/users').query({ query: 'pager', sort: 'name', page: 3 });
      expect(p1.body).toMatchObject({ total: 44, pageCount: 3, page: 1 });
      expect(p1.body.users).toHaveLength(20);
      expect(p1.body.users[0].displayName).toBe('Pager 00');
      expect(p3.body.users.map((u: { displayName: string }) => u.displayName)).toEqual(['Pager 40', 'Pager 41', 'Pager 42', 'Pager 43']);
      const beyond = await boss.agent.get('/api/admin/users').query({ query: 'pager', page: 9 });
      expect(beyond.body.users).toEqual([]);
    } finally {
      await fresh.close();
    }
  });

  it('answers 422 for an unknown sort or a bad page', async () => {
    const sort = await admin.agent.get('/api/admin/users').query({ sort: 'password_hash' });
    expect(sort.status).toBe(422);
    expect(sort.body.issues[0].path).toBe('sort');
    await admin.agent.get('/api/admin/users').query({ page: 0 }).expect(422);
    await admin.agent.get('/api/admin/users').query({ page: 'two' }).expect(422);
  });
});

describe('disabling and re-enabling a member', () => {
  it('ends every session at once and blocks sign-in; re-enabling lets them back in', async () => {
    const { agent: memberPhone, user } = await signedInAgent(t.app, t.db);
    const memberLaptop = request.agent(t.app);
    await memberLaptop.post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);
    await addProjects(user.id, 2);

    const res = await admin.agent.post(`/api/admin/users/${user.id}/disable`);
    expect(res.status).toBe(200);
    expect(res.body.user).toMatchObject({ id: user.id, disabled: true, projectCount: 2, disabledAt: expect.any(String) });
    expect(await t.db('sessions').where({ user_id: user.id })).toHaveLength(0);
    await memberPhone.get('/api/auth/me').expect(401);
    await memberLaptop.get('/api/projects').expect(401);

    const signIn = await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password });
    expect(signIn.status).toBe(403);
    expect(signIn.body.error).toMatch(/disabled/);

    const back = await admin.agent.post(`/api/admin/users/${user.id}/enable`);
    expect(back.body.user).toMatchObject({ disabled: false, disabledAt: null });
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(200);
  });

  it('shows the disabled state in the list', async () => {
    const user = await createTestUser(t.db, { displayName: 'Quiet Teasel', email: 'teasel@list.example' });
    await admin.agent.post(`/api/admin/users/${user.id}/disable`).expect(200);
    const res = await admin.agent.get('/api/admin/users').query({ query: 'teasel' });
    expect(res.body.users[0]).toMatchObject({ disabled: true });
  });

  it('will not let an admin disable themselves (409), and answers 404 for an unknown member', async () => {
    const self = await admin.agent.post(`/api/admin/users/${admin.user.id}/disable`);
    expect(self.status).toBe(409);
    expect(self.body.error).toMatch(/your own account/);
    await admin.agent.post('/api/admin/users/nosuchmember/disable').expect(404);
    await admin.agent.post('/api/admin/users/NOT..valid/disable').expect(422);
  });

  it('refuses a disable sent from another site', async () => {
    const user = await createTestUser(t.db);
    await admin.agent.post(`/api/admin/users/${user.id}/disable`).set('Origin', 'https://evil.example').expect(403);
    expect((await t.db('users').where({ id: user.id }).first()).disabled_at).toBeNull();
  });
});

describe('changing a member’s role', () => {
  it('makes a member an admin, who can use the admin screen on their next request, and makes them a member again', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    await agent.get('/api/admin/users').expect(403);
    const up = await admin.agent.post(`/api/admin/users/${user.id}/role`).send({ role: 'admin' });
    expect(up.status).toBe(200);
    expect(up.body.user).toMatchObject({ id: user.id, role: 'admin' });
    // The same session, no new sign-in: the role is read with the session on every request.
    await agent.get('/api/admin/users').expect(200);
    expect((await agent.get('/api/auth/me')).body.user.role).toBe('admin');

    const down = await admin.agent.post(`/api/admin/users/${user.id}/role`).send({ role: 'member' });
    expect(down.body.user).toMatchObject({ role: 'member' });
    await agent.get('/api/admin/users').expect(403);
  });

  it('will not let an admin change their own role (409), nor make a disabled member an admin, and checks the body', async () => {
    const self = await admin.agent.post(`/api/admin/users/${admin.user.id}/role`).send({ role: 'member' });
    expect(self.status).toBe(409);
    expect(self.body.error).toMatch(/your own role/);
    expect((await t.db('users').where({ id: admin.user.id }).first()).role).toBe('admin');

    const off = await createTestUser(t.db);
    await admin.agent.post(`/api/admin/users/${off.id}/disable`).expect(200);
    const promote = await admin.agent.post(`/api/admin/users/${off.id}/role`).send({ role: 'admin' });
    expect(promote.status).toBe(409);
    expect(promote.body.error).toMatch(/Re-enable/);

    const bad = await admin.agent.post(`/api/admin/users/${off.id}/role`).send({ role: 'owner' });
    expect([400, 422]).toContain(bad.status);
    expect(bad.body.issues).toEqual([expect.objectContaining({ path: 'role' })]);
    await admin.agent.post('/api/admin/users/nosuchmember/role').send({ role: 'admin' }).expect(404);
    await admin.agent.post(`/api/admin/users/${off.id}/role`).set('Origin', 'https://evil.example').send({ role: 'admin' }).expect(403);
  });
});
