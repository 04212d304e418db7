import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import request from 'supertest';
import { Router } from 'express';
import { createTestContext, type TestContext } from '../../setup/test-app.js';
import { parseEnv } from '../../../server/env.js';
import { createDb, migrateLatest } from '../../../server/db/knex.js';
import { migrationSource } from '../../../server/db/migration-source.js';

let t: TestContext;
beforeAll(async () => {
  t = await createTestContext();
});
afterAll(() => t.close());

describe('the app shell', () => {
  it('answers GET /api/health with { ok: true }', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ ok: true });
  });

  it('answers unknown /api routes with a JSON 404 in the one error shape', async () => {
    const res = await request(t.app).get('/api/no-such-thing');
    expect(res.status).toBe(404);
    expect(res.type).toMatch(/json/);
    expect(res.body.error).toMatch(/no API route GET \/api\/no-such-thing/i);
  });

  it('answers malformed JSON with 400 and a sentence', async () => {
    const res = await request(t.app).post('/api/auth/signin').set('Content-Type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body).toEqual({ error: 'The request body is not valid JSON.' });
  });

  it('answers an unexpected failure with 500 and no internals', async () => {
    const app = (await import('express')).default();
    const { errorHandler } = await import('../../../server/middleware/error-handler.js');
    const r = Router();
    r.get('/boom', () => {
      throw new Error('SQLITE_CONSTRAINT secret detail at /home/x');
    });
    app.use(r);
    app.use(errorHandler(t.logger));
    const res = await request(app).get('/boom');
    expect(res.status).toBe(500);
    expect(JSON.stringify(res.body)).not.toMatch(/SQLITE|secret|home/);
    expect(res.body.error).toMatch(/went wrong on our side/);
  });

  it('sends helmet security headers with a same-origin content policy', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.headers['x-content-type-options']).toBe('nosniff');
    const csp = res.headers['content-security-policy'];
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).not.toMatch(/https:/);
    expect(res.headers['x-powered-by']).toBeUndefined();
  });

  it('serves the single-page app for client routes', async () => {
    const res = await request(t.app).get('/projects/12');
    expect(res.status).toBe(200);
    expect(res.text).toContain('<div id="root"></div>');
  });
});

describe('configuration', () => {
  it('fails fast listing every bad setting', () => {
    expect(() => parseEnv({ PORT: 'abc', APP_ORIGIN: 'not a url' })).toThrow(/PORT[\s\S]*APP_ORIGIN/);
  });

  it('has defaults for the documented variables', () => {
    const env = parseEnv({});
    expect(env.PORT).toBe(3000);
    expect(env.DATA_DIR).toBe('./data');
    expect(env.UPLOADS_DIR).toBe('./uploads');
    expect(env.SMTP_URL).toBeUndefined();
  });
});

describe('the database', () => {
  it('runs with foreign keys on and WAL journal mode on a file database', async () => {
    const fs = await import('node:fs');
    const os = await import('node:os');
    const path = await import('node:path');
    const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'wb-db-'));
    const db = createDb(path.join(dir, 'x.sqlite'));
    try {
      await migrateLatest(db);
      const [{ foreign_keys }] = await db.raw('PRAGMA foreign_keys');
      const [{ journal_mode }] = await db.raw('PRAGMA journal_mode');
      const [{ timeout }] = await db.raw('PRAGMA busy_timeout');
      expect(foreign_keys).toBe(1);
      expect(journal_mode).toBe('wal');
      expect(timeout).toBeGreaterThan(0);
    } finally {
      await db.destroy();
      fs.rmSync(dir, { recursive: true, force: true });
    }
  });

  it('migrates every migration down and up again', async () => {
    const db = createDb(':memory:');
    try {
      await migrateLatest(db);
      const names = await migrationSource.getMigrations([]);
      expect(names.length).toBeGreaterThan(5);
      await db.migrate.rollback({ migrationSource }, true);
      expect(await db.schema.hasTable('users')).toBe(false);
      await migrateLatest(db);
      expect(await db.schema.hasTable('users')).toBe(true);
    } finally {
      await db.destroy();
    }
  });
});
