import { Writable } from 'node:stream';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../server/app.js';
import { createLogger } from '../../server/logger.js';
import { createTestApp, type TestApp } from '../helpers/app.js';

/** The app with a real pino logger at `level`, writing its JSON lines into `lines`. */
function loggingApp(t: TestApp, level: string, lines: string[]) {
  const sink = new Writable({
    write(chunk: Buffer, _encoding, done) {
      lines.push(...chunk.toString('utf8').split('\n').filter(Boolean));
      done();
    },
  });
  const logger = createLogger(level, sink);
  return createApp({ ...t.deps, logger, config: { ...t.config, logLevel: level } });
}

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

  it('sends a content security policy that allows no fonts or styles from other sites', async () => {
    const res = await request(t.app).get('/api/health');
    const policy = Object.fromEntries(
      String(res.headers['content-security-policy'])
        .split(';')
        .map((d) => d.trim().split(/\s+/))
        .map(([name = '', ...values]) => [name, values]),
    );
    expect(policy['font-src']).toEqual(["'self'", 'data:']);
    expect(policy['style-src']).toEqual(["'self'", "'unsafe-inline'"]);
    expect(policy['default-src']).toEqual(["'self'"]);
    // No directive lets anything in from an arbitrary https site.
    for (const [name, values] of Object.entries(policy)) expect(values, name).not.toContain('https:');
  });

  it('logs requests at info without their headers, and with them only at debug', async () => {
    const info: string[] = [];
    await request(loggingApp(t, 'info', info)).get('/api/farms').set('cookie', 'byrecast_session=secret-token').set('user-agent', 'field-tablet/1');
    const line = info.map((l) => JSON.parse(l) as { req?: Record<string, unknown>; res?: Record<string, unknown> }).find((l) => l.req);
    expect(line?.req).toEqual({ id: expect.anything(), method: 'GET', url: '/api/farms' });
    expect(line?.res).toEqual({ statusCode: 401 });
    expect(info.join('\n')).not.toMatch(/field-tablet|secret-token/);

    const debug: string[] = [];
    await request(loggingApp(t, 'debug', debug)).get('/api/farms').set('cookie', 'byrecast_session=secret-token').set('user-agent', 'field-tablet/1');
    expect(debug.join('\n')).toContain('field-tablet/1');
    // The session cookie stays redacted even at debug.
    expect(debug.join('\n')).not.toContain('secret-token');
  });
});
