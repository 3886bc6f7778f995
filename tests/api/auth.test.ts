/**
 * Accounts and sessions: sign-up, sign-in, sign-out, "who am I", profile, password change,
 * and the session cookie's defences. Expected behaviour comes from docs/product.md (Accounts) and the standards named beside each check.
 */
import jwt from 'jsonwebtoken';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '../../server/auth/session.js';
import { loadConfig } from '../../server/config.js';
import { createTestApp, type TestApp } from '../helpers/app.js';

const DEMO_PASSWORD = 'byrecast-demo';
const STRONG = 'meadow-lane-2031';

/** The session cookie's `name=value` from a response, or null. */
function sessionCookie(res: request.Response): string | null {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  const line = raw?.find((c) => c.startsWith(`${SESSION_COOKIE}=`) && !c.startsWith(`${SESSION_COOKIE}=;`));
  return line ? line.split(';')[0]! : null;
}

async function signIn(t: TestApp, email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await request(t.app).post('/api/auth/sign-in').send({ email, password });
  expect(res.status).toBe(200);
  const cookie = sessionCookie(res);
  if (!cookie) throw new Error('no session cookie');
  return cookie;
}

function median(values: number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  return sorted[Math.floor(sorted.length / 2)]!;
}

describe('accounts and sessions', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
  });
  afterAll(async () => {
    await t.close();
  });

  it('signs each demo account in with the shared demo password', async () => {
    // docs/product.md (Accounts): five demo accounts, password byrecast-demo; /me gives user and memberships.
    const expected: Record<string, { role: string | null; isAdmin: boolean }> = {
      'owner@byrecast.test': { role: 'owner', isAdmin: false },
      'partner@byrecast.test': { role: 'partner', isAdmin: false },
      'consultant@byrecast.test': { role: 'consultant', isAdmin: false },
      'lender@byrecast.test': { role: 'lender', isAdmin: false },
      'admin@byrecast.test': { role: null, isAdmin: true },
    };
    for (const [email, want] of Object.entries(expected)) {
      const cookie = await signIn(t, email);
      const me = await request(t.app).get('/api/auth/me').set('cookie', cookie);
      expect(me.status).toBe(200);
      expect(Object.keys(me.body.user).sort()).toEqual(['email', 'id', 'isAdmin', 'name']);
      expect(me.body.user.email).toBe(email);
      expect(me.body.user.isAdmin).toBe(want.isAdmin);
      expect(me.body.memberships.map((m: { role: string }) => m.role)).toEqual(want.role ? [want.role] : []);
      expect(me.body.memberships.every((m: { farmId: unknown }) => typeof m.farmId === 'number')).toBe(true);
    }
  });

  it('sets the session as an httpOnly, SameSite=Lax cookie that is not Secure over plain http', async () => {
    // docs/product.md (Accounts): signed JWT in an httpOnly, SameSite=Lax cookie, Secure when served over https (RFC 6265bis attributes).
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'owner@byrecast.test', password: DEMO_PASSWORD });
    const line = (res.headers['set-cookie'] as unknown as string[]).find((c) => c.startsWith(SESSION_COOKIE))!;
    expect(line).toMatch(/HttpOnly/i);
    expect(line).toMatch(/SameSite=Lax/i);
    expect(line).not.toMatch(/Secure/i);
    expect(res.body).not.toHaveProperty('token');
  });

  it('signs a new account up with a normalised e-mail and lets it sign in in any letter case', async () => {
    // docs/product.md (Accounts): e-mail addresses normalised (trimmed, lower case).
    const res = await request(t.app).post('/api/auth/sign-up').send({ name: 'Tamsin Orrel', email: '  Tamsin.Orrel@Example.TEST ', password: STRONG });
    expect(res.status).toBe(201);
    expect(res.body.user.email).toBe('tamsin.orrel@example.test');
    expect(sessionCookie(res)).not.toBeNull();
    await signIn(t, 'TAMSIN.ORREL@example.test', STRONG);
  });

  it('refuses a short password, a password equal to the e-mail and a taken e-mail, naming the field', async () => {
    // docs/product.md (Accounts): password policy length >= 10 and not the e-mail; a clear error naming the field (docs/product.md, Bad input).
    const short = await request(t.app).post('/api/auth/sign-up').send({ name: 'A', email: 'short@example.test', password: 'abc123456' });
    expect(short.status).toBe(400);
    expect(short.body.error.fields.password).toMatch(/at least 10/);

    const same = await request(t.app).post('/api/auth/sign-up').send({ name: 'A', email: 'same.as.mail@example.test', password: 'Same.As.Mail@example.test' });
    expect(same.status).toBe(400);
    expect(same.body.error.fields.password).toMatch(/e-mail/);

    const taken = await request(t.app).post('/api/auth/sign-up').send({ name: 'A', email: 'OWNER@byrecast.test', password: STRONG });
    expect(taken.status).toBe(409);
    expect(taken.body.error.fields.email).toMatch(/already exists/);
  });

  it('answers a wrong password and an unknown e-mail with the same status and body', async () => {
    // docs/product.md (Accounts): wrong password and unknown e-mail give the same answer (no account enumeration).
    const wrong = await request(t.app).post('/api/auth/sign-in').send({ email: 'owner@byrecast.test', password: 'not-the-password' });
    const unknown = await request(t.app).post('/api/auth/sign-in').send({ email: 'nobody-here@byrecast.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    expect(unknown.status).toBe(wrong.status);
    expect(unknown.body).toEqual(wrong.body);
    expect(sessionCookie(wrong)).toBeNull();
  });

  it('refuses a disabled account with the same answer as a wrong password', async () => {
    // docs/product.md: the administrator manages accounts; a disabled account must not sign in.
    const admin = await signIn(t, 'admin@byrecast.test');
    await request(t.app).post('/api/auth/sign-up').send({ name: 'Leaving Soon', email: 'leaving@example.test', password: STRONG });
    const list = await request(t.app).get('/api/admin/users').set('cookie', admin);
    const target = list.body.find((u: { email: string }) => u.email === 'leaving@example.test');
    const off = await request(t.app).patch(`/api/admin/users/${target.id}`).set('cookie', admin).send({ disabled: true });
    expect(off.status).toBe(200);
    const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'leaving@example.test', password: STRONG });
    expect(res.status).toBe(401);
    expect(res.body.error.code).toBe('invalid_credentials');
  });

  it('ends the session on sign-out so the old cookie no longer works', async () => {
    // docs/product.md (Accounts): sign-out then old cookie refused.
    const cookie = await signIn(t, 'partner@byrecast.test');
    const me = await request(t.app).get('/api/auth/me').set('cookie', cookie);
    expect(me.status).toBe(200);
    // A scenario read checks the session in the same query as the scenario: it must end too.
    const farmId = (me.body as { memberships: { farmId: number }[] }).memberships[0]!.farmId;
    const [first] = (await request(t.app).get(`/api/farms/${farmId}/scenarios`).set('cookie', cookie)).body as { id: number }[];
    const scenarioPath = `/api/farms/${farmId}/scenarios/${first!.id}`;
    expect((await request(t.app).get(scenarioPath).set('cookie', cookie)).status).toBe(200);
    expect((await request(t.app).post('/api/auth/sign-out').set('cookie', cookie)).status).toBe(204);
    expect((await request(t.app).get(scenarioPath).set('cookie', cookie)).status).toBe(401);
    expect((await request(t.app).get(`${scenarioPath}/results/detail`).set('cookie', cookie)).status).toBe(401);
    // Signed out is an answer: 200 with null, never the user.
    const after = await request(t.app).get('/api/auth/me').set('cookie', cookie);
    expect(after.status).toBe(200);
    expect(after.body).toBeNull();
    expect((await request(t.app).get('/api/farms').set('cookie', cookie)).status).toBe(401);
  });

  it('refuses a token signed with another key, an altered token, an unsigned one and an expired one', async () => {
    // docs/product.md (Accounts): a JWT signed with another key or altered is refused (RFC 7519 / RFC 7515 signature check).
    const good = (await signIn(t, 'consultant@byrecast.test')).split('=')[1]!;
    const claims = jwt.decode(good) as { sub: string; ver: number };
    const foreign = jwt.sign({ ver: claims.ver }, 'another-key-another-key-another-key-0000', { subject: claims.sub, expiresIn: 3600 });
    const [header, payload, signature] = good.split('.') as [string, string, string];
    const tampered = JSON.parse(Buffer.from(payload, 'base64url').toString()) as Record<string, unknown>;
    tampered.sub = '1';
    const altered = `${header}.${Buffer.from(JSON.stringify(tampered)).toString('base64url')}.${signature}`;
    const unsigned = `${Buffer.from(JSON.stringify({ alg: 'none', typ: 'JWT' })).toString('base64url')}.${payload}.`;
    const expired = jwt.sign({ ver: claims.ver, exp: Math.floor(Date.now() / 1000) - 60 }, t.config.jwtSecret, { subject: claims.sub });
    for (const token of [foreign, altered, unsigned, expired, 'not-a-jwt']) {
      const res = await request(t.app).get('/api/farms').set('cookie', `${SESSION_COOKIE}=${token}`);
      expect(res.status, token.slice(0, 20)).toBe(401);
      expect((await request(t.app).get('/api/auth/me').set('cookie', `${SESSION_COOKIE}=${token}`)).body, token.slice(0, 20)).toBeNull();
    }
    // The genuine token still works, so the refusals above come from the changes.
    expect((await request(t.app).get('/api/auth/me').set('cookie', `${SESSION_COOKIE}=${good}`)).status).toBe(200);
  });

  it('refuses a state-changing request from another origin and lets the app origin through', async () => {
    // docs/product.md (Accounts): Origin of another site gets 403; the app's own origin passes.
    const cookie = await signIn(t, 'owner@byrecast.test');
    const evil = await request(t.app).post('/api/farms').set('cookie', cookie).set('origin', 'https://evil.example').send({ name: 'Forged Farm' });
    expect(evil.status).toBe(403);
    expect(evil.body.error.code).toBe('cross_site');
    // Fetch Metadata (W3C): browsers mark cross-site requests with Sec-Fetch-Site.
    const marked = await request(t.app).post('/api/auth/sign-out').set('cookie', cookie).set('sec-fetch-site', 'cross-site');
    expect(marked.status).toBe(403);
    const own = await request(t.app).post('/api/farms').set('cookie', cookie).set('origin', t.config.appOrigin).send({ name: 'Own Farm' });
    expect(own.status).toBe(201);
    const farms = await request(t.app).get('/api/farms').set('cookie', cookie);
    expect(farms.body.map((f: { name: string }) => f.name)).not.toContain('Forged Farm');
  });

  it('changes the name shown in the profile', async () => {
    // docs/product.md (Accounts): profile (name).
    const cookie = await signIn(t, 'lender@byrecast.test');
    const res = await request(t.app).patch('/api/auth/me').set('cookie', cookie).send({ name: '  Oren V.  ' });
    expect(res.status).toBe(200);
    expect(res.body.user.name).toBe('Oren V.');
    const empty = await request(t.app).patch('/api/auth/me').set('cookie', cookie).send({ name: '   ' });
    expect(empty.status).toBe(400);
    expect(empty.body.error.fields.name).toBe('Name is required');
  });

  it('changes the password, ending every other session while this one continues', async () => {
    // docs/product.md (Accounts): a password change invalidates earlier sessions (token version per user).
    await request(t.app).post('/api/auth/sign-up').send({ name: 'Pella Wrenn', email: 'pella@example.test', password: STRONG });
    const here = await signIn(t, 'pella@example.test', STRONG);
    const elsewhere = await signIn(t, 'pella@example.test', STRONG);

    const wrong = await request(t.app).post('/api/auth/me/password').set('cookie', here).send({ currentPassword: 'nope-nope-nope', newPassword: 'hayloft-window-77' });
    expect(wrong.status).toBe(400);
    expect(wrong.body.error.fields.currentPassword).toMatch(/not right/);

    const res = await request(t.app).post('/api/auth/me/password').set('cookie', here).send({ currentPassword: STRONG, newPassword: 'hayloft-window-77' });
    expect(res.status).toBe(204);
    const renewed = sessionCookie(res);
    expect(renewed).not.toBeNull();
    expect((await request(t.app).get('/api/auth/me').set('cookie', elsewhere)).body).toBeNull();
    expect((await request(t.app).get('/api/auth/me').set('cookie', here)).body).toBeNull();
    expect((await request(t.app).get('/api/auth/me').set('cookie', renewed!)).status).toBe(200);
    expect((await request(t.app).post('/api/auth/sign-in').send({ email: 'pella@example.test', password: STRONG })).status).toBe(401);
    await signIn(t, 'pella@example.test', 'hayloft-window-77');
  });

  it('keeps the administrator out of farm data unless a member', async () => {
    // docs/product.md: the administrator sees no farm data unless also a member.
    const admin = await signIn(t, 'admin@byrecast.test');
    const farms = await request(t.app).get('/api/farms').set('cookie', admin);
    expect(farms.body).toEqual([]);
    const owner = await signIn(t, 'owner@byrecast.test');
    const ownerMe = await request(t.app).get('/api/auth/me').set('cookie', owner);
    const farmId = ownerMe.body.memberships[0].farmId as number;
    expect((await request(t.app).get(`/api/farms/${farmId}`).set('cookie', admin)).status).toBe(404);
    const users = await request(t.app).get('/api/admin/users').set('cookie', admin);
    expect(users.status).toBe(200);
    expect(JSON.stringify(users.body)).not.toContain('Cairnbrook');
    expect((await request(t.app).get('/api/admin/users').set('cookie', owner)).status).toBe(403);
  });
});

describe('rate limits', () => {
  const limited = (rateLimit: { perEmail: number; perIp: number }) => createTestApp({ config: { rateLimit: { windowMinutes: 15, ...rateLimit } } });

  it('stops sign-in attempts for one address after the limit, for known and unknown addresses alike', async () => {
    // docs/product.md (Accounts): rate-limited per address with a "try again in N minutes" message; never reveals whether the e-mail exists.
    const t = await limited({ perEmail: 3, perIp: 1000 });
    try {
      await request(t.app).post('/api/auth/sign-up').send({ name: 'Known', email: 'known@example.test', password: STRONG });
      for (const email of ['known@example.test', 'unknown@example.test']) {
        for (let i = 0; i < 3; i++) {
          expect((await request(t.app).post('/api/auth/sign-in').send({ email, password: 'wrong-password' })).status).toBe(401);
        }
        // Another letter case is the same address after normalisation.
        const res = await request(t.app).post('/api/auth/sign-in').send({ email: email.toUpperCase(), password: 'wrong-password' });
        expect(res.status).toBe(429); // RFC 6585 §4: 429 Too Many Requests
        expect(res.body).toEqual({ error: { code: 'rate_limited', message: 'Too many attempts. Try again in 15 minutes.' } });
        // IETF draft-ietf-httpapi-ratelimit-headers-08: RateLimit-Policy and RateLimit fields.
        expect(res.headers['ratelimit-policy']).toMatch(/q=3/);
        expect(res.headers.ratelimit).toMatch(/r=0/);
      }
      // The right password is refused too while the address is limited: a guesser learns nothing.
      expect((await request(t.app).post('/api/auth/sign-in').send({ email: 'known@example.test', password: STRONG })).status).toBe(429);
      // A different address is not affected.
      expect((await request(t.app).post('/api/auth/sign-in').send({ email: 'other@example.test', password: 'wrong-password' })).status).toBe(401);
    } finally {
      await t.close();
    }
  });

  it('does not count successful sign-ins against the address', async () => {
    // docs/product.md (Accounts): the limit is on failures to guess; a user signing in often is not locked out (common practice, no source).
    const t = await limited({ perEmail: 2, perIp: 1000 });
    try {
      await request(t.app).post('/api/auth/sign-up').send({ name: 'Often', email: 'often@example.test', password: STRONG });
      for (let i = 0; i < 4; i++) {
        expect((await request(t.app).post('/api/auth/sign-in').send({ email: 'often@example.test', password: STRONG })).status).toBe(200);
      }
    } finally {
      await t.close();
    }
  });

  it('stops many addresses tried from one IP', async () => {
    // docs/product.md (Accounts): rate-limited per IP as well as per address.
    const t = await limited({ perEmail: 1000, perIp: 4 });
    try {
      for (let i = 0; i < 4; i++) {
        expect((await request(t.app).post('/api/auth/sign-in').send({ email: `spray-${i}@example.test`, password: 'wrong-password' })).status).toBe(401);
      }
      const res = await request(t.app).post('/api/auth/sign-in').send({ email: 'spray-new@example.test', password: 'wrong-password' });
      expect(res.status).toBe(429);
      expect(res.body.error.code).toBe('rate_limited');
    } finally {
      await t.close();
    }
  });

  it('limits password-reset requests per address with the same message', async () => {
    // docs/product.md (Accounts): reset requests are rate-limited per address and per IP.
    const t = await limited({ perEmail: 2, perIp: 1000 });
    try {
      for (let i = 0; i < 2; i++) {
        expect((await request(t.app).post('/api/auth/password-reset/request').send({ email: 'owner@example.test' })).status).toBe(202);
      }
      const res = await request(t.app).post('/api/auth/password-reset/request').send({ email: 'owner@example.test' });
      expect(res.status).toBe(429);
      expect(res.body.error.message).toBe('Too many attempts. Try again in 15 minutes.');
    } finally {
      await t.close();
    }
  });
});

describe('sign-in timing', () => {
  let t: TestApp;
  beforeAll(async () => {
    // Cost 8 makes bcrypt (not the database) the bulk of a sign-in, as it is at cost 12.
    t = await createTestApp({ config: { bcryptCost: 8, rateLimit: { windowMinutes: 15, perEmail: 1000, perIp: 1000 } } });
    await request(t.app).post('/api/auth/sign-up').send({ name: 'Timing Person', email: 'timing@example.test', password: STRONG });
  });
  afterAll(async () => {
    await t.close();
  });

  it('takes about as long for an unknown e-mail as for a wrong password', async () => {
    // docs/product.md (Accounts): unknown e-mail and wrong password answered in similar time
    // (OWASP Authentication Cheat Sheet, from memory: compare against a dummy hash).
    const time = async (email: string) => {
      const start = performance.now();
      await request(t.app).post('/api/auth/sign-in').send({ email, password: 'not-the-password' });
      return performance.now() - start;
    };
    const wrong: number[] = [];
    const unknown: number[] = [];
    for (let i = 0; i < 15; i++) {
      wrong.push(await time('timing@example.test'));
      unknown.push(await time(`nobody-${i}@example.test`));
    }
    // Wide bounds because these machines are shared; skipping the hash for unknown addresses
    // would give a ratio near 0.05, and a dummy hash at another cost one near 16 or 1/16.
    const ratio = median(unknown) / median(wrong);
    expect(ratio).toBeGreaterThan(0.5);
    expect(ratio).toBeLessThan(2);
  });
});

describe('production configuration', () => {
  it('hashes passwords at bcrypt cost 12 or more by default', () => {
    // docs/product.md (Accounts): bcrypt cost >= 12 (OWASP Password Storage Cheat Sheet asks for at least 10, from memory).
    const config = loadConfig({ NODE_ENV: 'production' });
    expect(config.bcryptCost).toBeGreaterThanOrEqual(12);
  });

  it('limits sign-in attempts per address by default', () => {
    // docs/product.md (Accounts): sign-in rate-limited per address and per IP; a limit above a few dozen per window
    // would let a guesser try too much (common practice, no source).
    const config = loadConfig({ NODE_ENV: 'production' });
    expect(config.rateLimit.perEmail).toBeLessThanOrEqual(20);
    expect(config.rateLimit.perIp).toBeGreaterThanOrEqual(config.rateLimit.perEmail);
  });
});
