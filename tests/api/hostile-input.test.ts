/**
 * Hostile input in every text field of the account, farm and member routes: SQL metacharacters
 * are stored and shown back as plain text, 10 kB strings are refused with a message naming the
 * field, and nothing answers 500. Expected behaviour: docs/product.md (Accounts) (SQL metacharacters
 * and 10 kB strings in every text field, oversized JSON refused with 413) and docs/product.md
 * (Bad input).
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '../../server/auth/session.js';
import { createTestApp, type TestApp } from '../helpers/app.js';
import { addOption } from '../../shared/option-operations.js';
import type { Scenario } from '../../shared/schema/index.js';

const DEMO_PASSWORD = 'byrecast-demo';

/** Classic injection strings (OWASP Testing Guide, SQL injection examples, from memory). */
const SQL_STRINGS = [
  "Robert'); DROP TABLE users;--",
  "' OR '1'='1",
  '" OR ""="',
  "\\'; SELECT SLEEP(5); --",
  '%_\\% 1; DELETE FROM farms',
  '<script>alert("x")</script>',
];
const TEN_KB = 'x'.repeat(10 * 1024);

function sessionCookie(res: request.Response): string {
  const raw = res.headers['set-cookie'] as unknown as string[];
  return raw.find((c) => c.startsWith(`${SESSION_COOKIE}=`))!.split(';')[0]!;
}

describe('hostile input', () => {
  let t: TestApp;
  let owner: string;
  let admin: string;
  let farmId: number;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true, config: { rateLimit: { windowMinutes: 15, perEmail: 10_000, perIp: 10_000 } } });
    owner = sessionCookie(await request(t.app).post('/api/auth/sign-in').send({ email: 'owner@byrecast.test', password: DEMO_PASSWORD }));
    admin = sessionCookie(await request(t.app).post('/api/auth/sign-in').send({ email: 'admin@byrecast.test', password: DEMO_PASSWORD }));
    farmId = (await request(t.app).get('/api/auth/me').set('cookie', owner)).body.memberships[0].farmId;
  });
  afterAll(async () => {
    await t.close();
  });

  async function tablesIntact(): Promise<void> {
    const [users] = await t.database.pool.query('SELECT COUNT(*) AS n FROM users');
    const [farms] = await t.database.pool.query('SELECT COUNT(*) AS n FROM farms');
    expect(Number((users as { n: number }[])[0]!.n)).toBeGreaterThanOrEqual(5);
    expect(Number((farms as { n: number }[])[0]!.n)).toBeGreaterThanOrEqual(1);
  }

  /** Each text field of each route, with a body builder putting `value` into it. */
  const fields: { route: string; field: string; send: (value: string) => request.Test }[] = [
    { route: 'sign-up', field: 'name', send: (v) => request(t.app).post('/api/auth/sign-up').send({ name: v, email: `n${Math.random()}@example.test`, password: 'long-enough-pw' }) },
    { route: 'sign-up', field: 'email', send: (v) => request(t.app).post('/api/auth/sign-up').send({ name: 'A', email: v, password: 'long-enough-pw' }) },
    { route: 'sign-up', field: 'password', send: (v) => request(t.app).post('/api/auth/sign-up').send({ name: 'A', email: `p${Math.random()}@example.test`, password: v }) },
    { route: 'sign-in', field: 'email', send: (v) => request(t.app).post('/api/auth/sign-in').send({ email: v, password: 'whatever-pw' }) },
    { route: 'sign-in', field: 'password', send: (v) => request(t.app).post('/api/auth/sign-in').send({ email: 'owner@byrecast.test', password: v }) },
    { route: 'profile', field: 'name', send: (v) => request(t.app).patch('/api/auth/me').set('cookie', owner).send({ name: v }) },
    { route: 'password change', field: 'currentPassword', send: (v) => request(t.app).post('/api/auth/me/password').set('cookie', owner).send({ currentPassword: v, newPassword: 'long-enough-pw' }) },
    { route: 'password change', field: 'newPassword', send: (v) => request(t.app).post('/api/auth/me/password').set('cookie', owner).send({ currentPassword: 'wrong-current', newPassword: v }) },
    { route: 'reset request', field: 'email', send: (v) => request(t.app).post('/api/auth/password-reset/request').send({ email: v }) },
    { route: 'reset complete', field: 'token', send: (v) => request(t.app).post('/api/auth/password-reset/complete').send({ token: v, password: 'long-enough-pw' }) },
    { route: 'reset complete', field: 'password', send: (v) => request(t.app).post('/api/auth/password-reset/complete').send({ token: 'A'.repeat(43), password: v }) },
    { route: 'create farm', field: 'name', send: (v) => request(t.app).post('/api/farms').set('cookie', owner).send({ name: v }) },
    { route: 'create farm', field: 'location', send: (v) => request(t.app).post('/api/farms').set('cookie', owner).send({ name: 'F', location: v }) },
    { route: 'create farm', field: 'currency', send: (v) => request(t.app).post('/api/farms').set('cookie', owner).send({ name: 'F', currency: v }) },
    { route: 'create farm', field: 'locale', send: (v) => request(t.app).post('/api/farms').set('cookie', owner).send({ name: 'F', locale: v }) },
    { route: 'invite', field: 'email', send: (v) => request(t.app).post(`/api/farms/${farmId}/invitations`).set('cookie', owner).send({ email: v, role: 'partner' }) },
    { route: 'invite', field: 'role', send: (v) => request(t.app).post(`/api/farms/${farmId}/invitations`).set('cookie', owner).send({ email: 'someone@example.test', role: v }) },
    { route: 'change role', field: 'role', send: (v) => request(t.app).patch(`/api/farms/${farmId}/members/1`).set('cookie', owner).send({ role: v }) },
    { route: 'accept invitation', field: 'name', send: (v) => request(t.app).post(`/api/invitations/${'B'.repeat(43)}/accept`).send({ name: v, password: 'long-enough-pw' }) },
    { route: 'accept invitation', field: 'password', send: (v) => request(t.app).post(`/api/invitations/${'B'.repeat(43)}/accept`).send({ name: 'A', password: v }) },
  ];

  for (const { route, field, send } of fields) {
    it(`never fails with a 500 on SQL metacharacters in ${route} ${field}`, async () => {
      for (const value of SQL_STRINGS) {
        const res = await send(value);
        expect(res.status, `${value} → ${res.text.slice(0, 200)}`).toBeLessThan(500);
        if (res.status === 400 && res.body.error.code === 'invalid_input') expect(Object.keys(res.body.error.fields ?? {}).length).toBeGreaterThan(0);
      }
      await tablesIntact();
    });

    it(`refuses a 10 kB string in ${route} ${field} naming the field`, async () => {
      const res = await send(TEN_KB);
      expect(res.status).toBeLessThan(500);
      // docs/product.md (Accounts) (Bad input): refused with a message naming the field.
      expect(res.status).toBe(400);
      expect(res.body.error.fields, res.text.slice(0, 200)).toHaveProperty(field);
    });
  }

  it('refuses a lone UTF-16 surrogate with 400 naming the field, in an option name, an option id and a scenario copy name', async () => {
    // "\ud800" alone is no character (Unicode 15, section 3.9 "Unicode Encoding Forms": ill-formed UTF-16).
    const list = await request(t.app).get(`/api/farms/${farmId}/scenarios`).set('cookie', owner);
    const base = `/api/farms/${farmId}/scenarios/${list.body[0].id as number}`;
    const read = await request(t.app).get(base).set('cookie', owner);
    const version = read.body.version as number;
    const scenario = read.body.scenario as Scenario;
    const withFirstOption = (change: Partial<Scenario['options'][number]>) => ({ ...scenario, options: [{ ...scenario.options[0]!, ...change }, ...scenario.options.slice(1)] });
    const attempts: [request.Test, string][] = [
      [request(t.app).put(base).set('cookie', owner).send({ version, scenario: withFirstOption({ name: 'a\ud800' }) }), 'scenario.options.0.name'],
      [request(t.app).put(base).set('cookie', owner).send({ version, scenario: withFirstOption({ id: '\udc00x' }) }), 'scenario.options.0.id'],
      [request(t.app).post(`${base}/duplicate`).set('cookie', owner).send({ name: 'Copy \ud800' }), 'name'],
    ];
    for (const [attempt, field] of attempts) {
      const res = await attempt;
      expect(res.status, field).toBe(400);
      expect(Object.keys(res.body.error.fields), field).toEqual([field]);
    }
    // A well-formed pair (an emoji) is text like any other.
    const emoji = await request(t.app).put(base).set('cookie', owner).send({ version, scenario: addOption(scenario, 'sand-freestall', 'Sand \ud83d\udc04').scenario });
    expect(emoji.status).toBe(200);
    expect(emoji.body.scenario.options.at(-1).name).toBe('Sand 🐄');
  });

  it('stores SQL metacharacters in a name and a farm name and shows them back as the same text', async () => {
    // docs/product.md (Accounts): stored and shown back as text, never executed.
    for (const value of SQL_STRINGS) {
      const me = await request(t.app).patch('/api/auth/me').set('cookie', owner).send({ name: value });
      expect(me.status).toBe(200);
      expect(me.body.user.name).toBe(value.trim());
      const farm = await request(t.app).post('/api/farms').set('cookie', owner).send({ name: value, location: value });
      expect(farm.status).toBe(201);
      const shown = await request(t.app).get(`/api/farms/${farm.body.id}`).set('cookie', owner);
      expect(shown.body.name).toBe(value.trim());
      expect(shown.body.location).toBe(value.trim());
    }
    const users = await request(t.app).get('/api/admin/users').set('cookie', admin);
    expect(users.body.map((u: { name: string }) => u.name)).toContain(SQL_STRINGS.at(-1));
    await tablesIntact();
  });

  it('keeps SQL metacharacters in path parameters from reaching the database as SQL', async () => {
    // docs/product.md (Accounts): never executed; an id that is not a positive whole number, the farm
    // id too, is bad input naming the parameter (Bad input; DEVELOPERS.md, Authorization).
    // Only plain digits are an id: '1e3', '0x10', ' 7' and '1.0' would coerce to a number but name no row.
    for (const value of ["1' OR '1'='1", '1;DROP TABLE farms', '-1', '1e3', '0x10', ' 7', '1.0', '0', '99999999999999999999']) {
      const res = await request(t.app).get(`/api/farms/${encodeURIComponent(value)}/members`).set('cookie', owner);
      expect(res.status, value).toBe(400);
      expect(Object.keys(res.body.error.fields), value).toEqual(['farmId']);
      const member = await request(t.app).delete(`/api/farms/${farmId}/members/${encodeURIComponent(value)}`).set('cookie', owner);
      expect(member.status, value).toBe(400);
      expect(Object.keys(member.body.error.fields), value).toEqual(['userId']);
    }
    await tablesIntact();
  });

  it('refuses an oversized JSON body with 413 on the routes that take a body', async () => {
    // docs/product.md (Accounts): oversized JSON body refused with 413 (RFC 9110 §15.5.14 Content Too Large).
    const big = JSON.stringify({ name: 'y'.repeat(2 * 1024 * 1024) });
    for (const path of ['/api/auth/sign-up', '/api/auth/password-reset/request', `/api/farms/${farmId}/invitations`, '/api/farms']) {
      const res = await request(t.app).post(path).set('cookie', owner).set('content-type', 'application/json').send(big);
      expect(res.status, path).toBe(413);
      expect(res.body.error.code).toBe('payload_too_large');
    }
  });

  it('escapes a hostile farm name in the invitation e-mail', async () => {
    // OWASP XSS Prevention Cheat Sheet rule 1 (HTML-escape untrusted data in element content), from memory.
    const farm = await request(t.app).post('/api/farms').set('cookie', owner).send({ name: '<img src=x onerror=alert(1)> & Co' });
    await request(t.app).post(`/api/farms/${farm.body.id}/invitations`).set('cookie', owner).send({ email: 'html@example.test', role: 'partner' });
    const mail = t.mailer.outbox!.list().find((m) => m.to === 'html@example.test')!;
    expect(mail.html).toContain('&#60;img src=x onerror=alert(1)&#62; &#38; Co');
    expect(mail.html).not.toContain('<img');
    expect(mail.subject).toContain('<img src=x onerror=alert(1)> & Co');
  });
});
