/**
 * Invitations by e-mail, followed through the captured message as a person would: the owner
 * invites, the link in the e-mail is opened and accepted. Expected behaviour: docs/product.md (Accounts)
 * (expired and reused tokens).
 */
import { createHash } from 'node:crypto';
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '../../server/auth/session.js';
import { createTestApp, type TestApp } from '../helpers/app.js';

const DEMO_PASSWORD = 'byrecast-demo';
const STRONG = 'milking-parlour-19';

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

/** The token in the newest captured e-mail to `to`. */
function tokenFromMail(t: TestApp, to: string): string {
  const mail = t.mailer.outbox!.list().find((m) => m.to === to);
  if (!mail) throw new Error(`no mail to ${to}`);
  const link = mail.links.find((l) => l.includes('/invitations/'));
  if (!link) throw new Error('no invitation link');
  return decodeURIComponent(link.split('/invitations/')[1]!);
}

describe('invitations', () => {
  let t: TestApp;
  let owner: string;
  let farmId: number;

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    owner = await signIn(t, 'owner@byrecast.test');
    farmId = (await request(t.app).get('/api/auth/me').set('cookie', owner)).body.memberships[0].farmId;
  });
  afterAll(async () => {
    await t.close();
  });

  const invite = (email: string, role: string, cookie = owner) =>
    request(t.app).post(`/api/farms/${farmId}/invitations`).set('cookie', cookie).send({ email, role });

  it('mails a link whose token is stored only as its sha-256', async () => {
    // docs/product.md (Accounts): single-use, expiring token stored hashed.
    const res = await invite('Nell.Ashby@Example.test', 'partner');
    expect(res.status).toBe(201);
    expect(res.body.email).toBe('nell.ashby@example.test');
    const mail = t.mailer.outbox!.list()[0]!;
    expect(mail.to).toBe('nell.ashby@example.test');
    expect(mail.subject).toContain('Cairnbrook Farm');
    expect(mail.text).toContain('Maren Holt');
    const token = tokenFromMail(t, 'nell.ashby@example.test');
    expect(mail.links[0]!.startsWith(`${t.config.appOrigin}/invitations/`)).toBe(true);

    const [rows] = await t.database.pool.query('SELECT * FROM invitations WHERE email = ?', ['nell.ashby@example.test']);
    const row = (rows as Record<string, unknown>[])[0]!;
    // FIPS 180-4 sha-256, hex: the stored value is the hash of the mailed token, never the token.
    expect(row.token_hash).toBe(createHash('sha256').update(token).digest('hex'));
    expect(JSON.stringify(rows)).not.toContain(token);
    // Lists it as open for the owner.
    const open = await request(t.app).get(`/api/farms/${farmId}/invitations`).set('cookie', owner);
    expect(open.body.map((i: { email: string }) => i.email)).toContain('nell.ashby@example.test');
  });

  it('lets a new person accept by creating an account, then sees the farm with the invited role', async () => {
    // docs/product.md (Accounts): accepting signs them up or adds the membership.
    const token = tokenFromMail(t, 'nell.ashby@example.test');
    const preview = await request(t.app).get(`/api/invitations/${token}`);
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ farmName: 'Cairnbrook Farm', role: 'partner', email: 'nell.ashby@example.test', accountExists: false });

    const missing = await request(t.app).post(`/api/invitations/${token}/accept`).send({});
    expect(missing.status).toBe(400);
    expect(Object.keys(missing.body.error.fields).sort()).toEqual(['name', 'password']);

    const res = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Nell Ashby', password: STRONG });
    expect(res.status).toBe(201);
    expect(res.body.farmId).toBe(farmId);
    const cookie = sessionCookie(res)!;
    const farms = await request(t.app).get('/api/farms').set('cookie', cookie);
    expect(farms.body).toEqual([expect.objectContaining({ id: farmId, name: 'Cairnbrook Farm', role: 'partner' })]);
    const open = await request(t.app).get(`/api/farms/${farmId}/invitations`).set('cookie', owner);
    expect(open.body.map((i: { email: string }) => i.email)).not.toContain('nell.ashby@example.test');
  });

  it('refuses the same link a second time', async () => {
    // docs/product.md (Accounts): reused tokens refused.
    const token = tokenFromMail(t, 'nell.ashby@example.test');
    const again = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Someone Else', password: STRONG });
    expect(again.status).toBe(400);
    expect(again.body.error).toMatchObject({ code: 'invalid_token', reason: 'used' });
    expect((await request(t.app).get(`/api/invitations/${token}`)).body.error.reason).toBe('used');
  });

  it('refuses an expired link', async () => {
    // docs/product.md (Accounts): expired tokens refused.
    await invite('late.comer@example.test', 'consultant');
    const token = tokenFromMail(t, 'late.comer@example.test');
    await t.database.pool.query('UPDATE invitations SET expires_at = ? WHERE email = ?', [new Date(Date.now() - 1000), 'late.comer@example.test']);
    const res = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Late Comer', password: STRONG });
    expect(res.status).toBe(400);
    expect(res.body.error.reason).toBe('expired');
    expect((await request(t.app).post('/api/auth/sign-in').send({ email: 'late.comer@example.test', password: STRONG })).status).toBe(401);
  });

  it('refuses an unknown or malformed token', async () => {
    // docs/product.md (Accounts): a link is only as good as its token.
    const unknown = await request(t.app).get(`/api/invitations/${'A'.repeat(43)}`);
    expect(unknown.status).toBe(400);
    expect(unknown.body.error.reason).toBe('unknown');
    const malformed = await request(t.app).get(`/api/invitations/${encodeURIComponent("x' OR '1'='1")}`);
    expect(malformed.status).toBe(400);
    expect(malformed.body.error.fields.token).toMatch(/incomplete or damaged/);
  });

  it('withdraws an invitation so its link stops working', async () => {
    // docs/product.md (Accounts): owners revoke invitations.
    const created = await invite('withdrawn@example.test', 'lender');
    const token = tokenFromMail(t, 'withdrawn@example.test');
    expect((await request(t.app).delete(`/api/farms/${farmId}/invitations/${created.body.id}`).set('cookie', owner)).status).toBe(204);
    const res = await request(t.app).get(`/api/invitations/${token}`);
    expect(res.body.error.reason).toBe('revoked');
    expect((await request(t.app).delete(`/api/farms/${farmId}/invitations/${created.body.id}`).set('cookie', owner)).status).toBe(409);
  });

  it('sends an invitation again with a new link, ending the old one', async () => {
    // docs/product.md (Accounts): owners resend invitations.
    const created = await invite('resend.me@example.test', 'consultant');
    const first = tokenFromMail(t, 'resend.me@example.test');
    const res = await request(t.app).post(`/api/farms/${farmId}/invitations/${created.body.id}/resend`).set('cookie', owner);
    expect(res.status).toBe(200);
    const second = tokenFromMail(t, 'resend.me@example.test');
    expect(second).not.toBe(first);
    expect((await request(t.app).get(`/api/invitations/${first}`)).body.error.reason).toBe('unknown');
    expect((await request(t.app).get(`/api/invitations/${second}`)).status).toBe(200);
  });

  it('adds the membership to an existing account once it signs in, and only to that account', async () => {
    // docs/product.md (Accounts): accepting adds the membership to their account.
    await request(t.app).post('/api/auth/sign-up').send({ name: 'Kit Farrow', email: 'kit.farrow@example.test', password: STRONG });
    await invite('kit.farrow@example.test', 'consultant');
    const token = tokenFromMail(t, 'kit.farrow@example.test');
    expect((await request(t.app).get(`/api/invitations/${token}`)).body.accountExists).toBe(true);

    const signedOut = await request(t.app).post(`/api/invitations/${token}/accept`).send({ name: 'Impostor', password: 'impostor-pass-1' });
    expect(signedOut.status).toBe(409);
    expect(signedOut.body.error.code).toBe('sign_in_required');

    const other = await signIn(t, 'lender@byrecast.test');
    const wrongAccount = await request(t.app).post(`/api/invitations/${token}/accept`).set('cookie', other).send({});
    expect(wrongAccount.status).toBe(403);
    expect(wrongAccount.body.error.code).toBe('wrong_account');

    const kit = await signIn(t, 'kit.farrow@example.test', STRONG);
    const res = await request(t.app).post(`/api/invitations/${token}/accept`).set('cookie', kit).send({});
    expect(res.status).toBe(200);
    expect(res.body.memberships).toEqual([{ farmId, role: 'consultant' }]);
  });

  it('refuses to invite someone who is already a member', async () => {
    // docs/product.md (Accounts): clear errors naming the field (docs/product.md, Bad input).
    const res = await invite('partner@byrecast.test', 'lender');
    expect(res.status).toBe(409);
    expect(res.body.error.fields.email).toMatch(/Already a member/);
  });

  it('refuses invitations from a partner and a bad role with a field message', async () => {
    // docs/product.md: a family partner cannot manage members.
    const partner = await signIn(t, 'partner@byrecast.test');
    expect((await invite('x@example.test', 'partner', partner)).status).toBe(403);
    const bad = await invite('x@example.test', 'boss');
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.role).toMatch(/owner, partner, consultant or lender/);
  });
});
