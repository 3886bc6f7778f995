import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createTestApp, type TestApp } from '../helpers/app.js';

describe('GET /api/health', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(async () => {
    await t.close();
  });

  it('reports the database as up', async () => {
    const res = await request(t.app).get('/api/health');
    expect(res.status).toBe(200);
    expect(res.body).toEqual({ status: 'ok', database: 'up' });
  });

  it('reports the database as down when it cannot be reached', async () => {
    const broken = await createTestApp();
    await broken.database.pool.end();
    const res = await request(broken.app).get('/api/health');
    expect(res.status).toBe(503);
    expect(res.body.database).toBe('down');
  });

  it('answers unknown API routes with the error shape, not HTML', async () => {
    const res = await request(t.app).get('/api/nope');
    expect(res.status).toBe(404);
    expect(res.body.error.code).toBe('not_found');
  });

  it('refuses an oversized JSON body with 413 and no stack trace', async () => {
    const res = await request(t.app)
      .post('/api/auth/sign-in')
      .set('content-type', 'application/json')
      .send(JSON.stringify({ email: 'a@b.test', password: 'x'.repeat(2 * 1024 * 1024) }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload_too_large');
    expect(JSON.stringify(res.body)).not.toMatch(/at .*\.ts/);
  });

  it('refuses malformed JSON with 400', async () => {
    const res = await request(t.app).post('/api/auth/sign-in').set('content-type', 'application/json').send('{"email":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('invalid_json');
  });
});
