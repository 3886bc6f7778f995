/**
 * Password reset by e-mail, followed through the captured message. Expected behaviour: docs/product.md (Accounts)
 * ("Password reset by e-mail": single-use token valid 1 hour, stored hashed; all sessions end).
 */
import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '../../server/auth/session.js';
import { createTestApp, type TestApp } from '../helpers/app.js';

const DEMO_PASSWORD = 'byrecast-demo';

function sessionCookie(res: request.Response): string | null {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  const line = raw?.find((c) => c.startsWith(`${SESSION_COOKIE}=`) && !c.startsWith(`${SESSION_COOKIE}=;`));
  return line ? line.split(';')[0]! : null;
}

async function signIn(t: TestApp, email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await request(t.app).post('/api/auth/sign-in').send({ email, password });
  expect(res.status).toBe(200);
  return sessionCookie(res)!;
}

describe('password reset', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
  });
  afterAll(async () => {
    await t.close();
  });

  /** Asks for a reset and returns the token from the e-mail (the mail is sent after the answer). */
  async function requestToken(email: string): Promise<string> {
    const before = t.mailer.outbox!.list().length;
    const res = await request(t.app).post('/api/auth/password-reset/request').send({ email });
    expect(res.status).toBe(202);
    await expect.poll(() => t.mailer.outbox!.list().length).toBe(before + 1);
    const link = t.mailer.outbox!.list()[0]!.links.find((l) => l.includes('/reset-password?token='))!;
    return decodeURIComponent(new URL(link).searchParams.get('token')!);
  }

  it('answers the same for an address with and without an account, mailing only the real one', async () => {
    // docs/product.md (Accounts): repeated failures never reveal whether an e-mail exists.
    const known = await request(t.app).post('/api/auth/password-reset/request').send({ email: 'partner@byrecast.test' });
    const unknown = await request(t.app).post('/api/auth/password-reset/request').send({ email: 'no-account@byrecast.test' });
    expect(known.status).toBe(202);
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    await expect.poll(() => t.mailer.outbox!.list().filter((m) => m.to === 'partner@byrecast.test').length).toBe(1);
    // Give a wrongly sent mail time to show up before checking it did not.
    await new Promise((r) => setTimeout(r, 200));
    expect(t.mailer.outbox!.list().some((m) => m.to === 'no-account@byrecast.test')).toBe(false);
  });

  it('sets a new password from the link and ends every session', async () => {
    // docs/product.md (Accounts): set a new password → all sessions end.
    const session = await signIn(t, 'owner@byrecast.test');
    const token = await requestToken('owner@byrecast.test');
    const [rows] = await t.database.pool.query('SELECT token_hash, expires_at, created_at FROM password_resets ORDER BY id DESC LIMIT 1');
    const row = (rows as { token_hash: string; expires_at: Date; created_at: Date }[])[0]!;
    // FIPS 180-4 sha-256: only the hash is stored.
    expect(row.token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    // docs/product.md (Accounts): valid 1 hour.
    expect(row.expires_at.getTime() - row.created_at.getTime()).toBeGreaterThan(59 * 60 * 1000);
    expect(row.expires_at.getTime() - row.created_at.getTime()).toBeLessThanOrEqual(60 * 60 * 1000 + 1000);

    const res = await request(t.app).post('/api/auth/password-reset/complete').send({ token, password: 'new-hayfield-2040' });
    expect(res.status).toBe(204);
    expect((await request(t.app).get('/api/auth/me').set('cookie', session)).body).toBeNull();
    expect((await request(t.app).post('/api/auth/sign-in').send({ email: 'owner@byrecast.test', password: DEMO_PASSWORD })).status).toBe(401);
    await signIn(t, 'owner@byrecast.test', 'new-hayfield-2040');
  });

  it('refuses a link used once already', async () => {
    // docs/product.md (Accounts): reused tokens refused.
    const token = await requestToken('consultant@byrecast.test');
    expect((await request(t.app).post('/api/auth/password-reset/complete').send({ token, password: 'first-choice-2040' })).status).toBe(204);
    const again = await request(t.app).post('/api/auth/password-reset/complete').send({ token, password: 'second-choice-2040' });
    expect(again.status).toBe(400);
    expect(again.body.error.code).toBe('invalid_token');
    await signIn(t, 'consultant@byrecast.test', 'first-choice-2040');
  });

  it('refuses a link older than an hour', async () => {
    // docs/product.md (Accounts): expired tokens refused (valid 1 hour).
    const token = await requestToken('lender@byrecast.test');
    await t.database.pool.query('UPDATE password_resets SET expires_at = ? WHERE token_hash = ?', [
      new Date(Date.now() - 1000),
      createHash('sha256').update(token).digest('hex'),
    ]);
    const res = await request(t.app).post('/api/auth/password-reset/complete').send({ token, password: 'too-late-for-this' });
    expect(res.status).toBe(400);
    expect(res.body.error.fields.token).toMatch(/not valid any more/);
    await signIn(t, 'lender@byrecast.test');
  });

  it('ends the other open links once one is used', async () => {
    // docs/product.md (Accounts): single-use; an older e-mailed link must not outlive the reset.
    const older = await requestToken('partner@byrecast.test');
    const newer = await requestToken('partner@byrecast.test');
    expect((await request(t.app).post('/api/auth/password-reset/complete').send({ token: newer, password: 'calving-season-9' })).status).toBe(204);
    expect((await request(t.app).post('/api/auth/password-reset/complete').send({ token: older, password: 'another-one-99' })).status).toBe(400);
  });

  it('applies the password policy to the new password, naming the field', async () => {
    // docs/product.md (Accounts): length >= 10, not the e-mail.
    const token = await requestToken('admin@byrecast.test');
    const short = await request(t.app).post('/api/auth/password-reset/complete').send({ token, password: 'short' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/at least 10/);
    const same = await request(t.app).post('/api/auth/password-reset/complete').send({ token, password: 'ADMIN@byrecast.test' });
    expect(same.status).toBe(400);
    expect(same.body.error.fields.password).toMatch(/e-mail/);
    // A refused password does not use the link up.
    expect((await request(t.app).post('/api/auth/password-reset/complete').send({ token, password: 'proper-length-pw' })).status).toBe(204);
  });
});
