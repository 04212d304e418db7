import fs from 'node:fs';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { createTestUser, signedInAgent } from '../../factories/users.js';
import { createProject } from '../../factories/journal.js';
import { newStorageKey, photoFilePath, writePhotoFiles } from '../../../server/lib/storage.js';
import { mailTo, waitForMail } from './helpers.js';

// OWASP Authentication Cheat Sheet: re-authenticate before a sensitive change, so the password is asked again.
let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

const bytes = { display: new Uint8Array([1, 2, 3]), thumb: new Uint8Array([4, 5]) };

describe('DELETE /api/auth/account', () => {
  it('deletes the member, their rows and their photo files, signs them out, and leaves other members alone', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    const other = await createTestUser(t.db);
    const mine = await createProject(t.db, user.id);
    const theirs = await createProject(t.db, other.id, { visibility: 'link' });
    const myKey = newStorageKey();
    const theirKey = newStorageKey();
    await writePhotoFiles(t.env.uploadsDir, mine.id, myKey, bytes);
    await writePhotoFiles(t.env.uploadsDir, theirs.id, theirKey, bytes);
    await t.db('comments').insert([
      { project_id: theirs.id, author_id: user.id, body: 'Lovely ears!' },
      { project_id: theirs.id, author_id: other.id, body: 'Thank you' },
    ]);
    await t.db('patterns').insert({ owner_id: user.id, title: 'My pattern', terms: 'us' });

    const res = await agent.delete('/api/auth/account').send({ password: user.password });
    expect(res.status).toBe(200);
    expect(res.body.message).toBe('Your account and everything in it are deleted.');
    expect(String(res.headers['set-cookie'])).toMatch(/Max-Age=0/);

    await agent.get('/api/auth/me').expect(401);
    expect(await t.db('users').where({ id: user.id })).toHaveLength(0);
    expect(await t.db('sessions').where({ user_id: user.id })).toHaveLength(0);
    expect(await t.db('projects').where({ owner_id: user.id })).toHaveLength(0);
    expect(await t.db('project_pieces').where({ project_id: mine.id })).toHaveLength(0);
    expect(await t.db('patterns').where({ owner_id: user.id })).toHaveLength(0);
    expect((await t.db('comments').where({ project_id: theirs.id })).map((c) => c.body)).toEqual(['Thank you']);
    expect(fs.existsSync(photoFilePath(t.env.uploadsDir, mine.id, myKey, 'display'))).toBe(false);
    // Someone else's project, photos and sign-in are untouched.
    expect(fs.existsSync(photoFilePath(t.env.uploadsDir, theirs.id, theirKey, 'display'))).toBe(true);
    expect(await t.db('projects').where({ id: theirs.id })).toHaveLength(1);
    await request(t.app).post('/api/auth/signin').send({ email: other.email, password: other.password }).expect(200);
    // The address is free again, and a notice went to it.
    await request(t.app).post('/api/auth/signin').send({ email: user.email, password: user.password }).expect(401);
    await waitForMail(t, mailTo(user.email, /account is deleted/));
  });

  it('refuses a wrong password with 403 on the password field, deleting nothing', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db);
    await createProject(t.db, user.id);
    const res = await agent.delete('/api/auth/account').send({ password: 'not my password' });
    expect(res.status).toBe(403);
    expect(res.body).toEqual({ error: 'That is not your password.', issues: [{ path: 'password', message: 'That is not your password.' }] });
    expect(await t.db('projects').where({ owner_id: user.id })).toHaveLength(1);
    await agent.get('/api/auth/me').expect(200);
  });

  it('asks for the password (400/422 with an issue), needs a signed-in member, and refuses another origin', async () => {
    const { agent } = await signedInAgent(t.app, t.db);
    const empty = await agent.delete('/api/auth/account').send({});
    expect([400, 422]).toContain(empty.status);
    expect(empty.body.issues).toEqual([expect.objectContaining({ path: 'password' })]);
    await request(t.app).delete('/api/auth/account').send({ password: 'whatever it is' }).expect(401);
    const cross = await agent.delete('/api/auth/account').set('Origin', 'https://elsewhere.example').send({ password: 'x' });
    expect(cross.status).toBe(403);
    await agent.get('/api/auth/me').expect(200);
  });

  it('keeps the only admin, who is told what to do first, and lets an admin go once another admin exists', async () => {
    const { agent, user } = await signedInAgent(t.app, t.db, { role: 'admin' });
    const res = await agent.delete('/api/auth/account').send({ password: user.password });
    expect(res.status).toBe(409);
    expect(res.body.error).toMatch(/only admin/);
    expect(await t.db('users').where({ id: user.id })).toHaveLength(1);

    await createTestUser(t.db, { role: 'admin' });
    await agent.delete('/api/auth/account').send({ password: user.password }).expect(200);
    expect(await t.db('users').where({ id: user.id })).toHaveLength(0);
  });
});
