/**
 * Farm members: listing, changing roles, removing, and the rule that a farm always keeps an
 * owner. Expected behaviour: docs/product.md (Accounts) ("A farm has at least one owner at all times"; owners
 * change or remove members) and docs/product.md (who may manage members).
 */
import request from 'supertest';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { SESSION_COOKIE } from '../../server/auth/session.js';
import { createTestApp, type TestApp } from '../helpers/app.js';

const DEMO_PASSWORD = 'byrecast-demo';
const STRONG = 'silage-clamp-2032';

function sessionCookie(res: request.Response): string {
  const raw = res.headers['set-cookie'] as unknown as string[] | undefined;
  const line = raw?.find((c) => c.startsWith(`${SESSION_COOKIE}=`) && !c.startsWith(`${SESSION_COOKIE}=;`));
  if (!line) throw new Error('no session cookie');
  return line.split(';')[0]!;
}

async function signIn(t: TestApp, email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await request(t.app).post('/api/auth/sign-in').send({ email, password });
  expect(res.status).toBe(200);
  return sessionCookie(res);
}

describe('farm members', () => {
  let t: TestApp;
  let owner: string;
  let farmId: number;
  const ids: Record<string, number> = {};

  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
    owner = await signIn(t, 'owner@byrecast.test');
    farmId = (await request(t.app).get('/api/auth/me').set('cookie', owner)).body.memberships[0].farmId;
    const members = await request(t.app).get(`/api/farms/${farmId}/members`).set('cookie', owner);
    for (const m of members.body as { email: string; userId: number }[]) ids[m.email] = m.userId;
  });
  afterAll(async () => {
    await t.close();
  });

  it('lists the members with their roles to owner, partner and consultant, not to the lender', async () => {
    // docs/product.md: the lender is read-only on shared scenarios "and nothing else".
    const res = await request(t.app).get(`/api/farms/${farmId}/members`).set('cookie', owner);
    expect(res.status).toBe(200);
    const roles = Object.fromEntries((res.body as { email: string; role: string }[]).map((m) => [m.email, m.role]));
    expect(roles).toEqual({
      'owner@byrecast.test': 'owner',
      'partner@byrecast.test': 'partner',
      'consultant@byrecast.test': 'consultant',
      'lender@byrecast.test': 'lender',
    });
    expect((await request(t.app).get(`/api/farms/${farmId}/members`).set('cookie', await signIn(t, 'partner@byrecast.test'))).status).toBe(200);
    expect((await request(t.app).get(`/api/farms/${farmId}/members`).set('cookie', await signIn(t, 'lender@byrecast.test'))).status).toBe(403);
  });

  it('refuses to demote or remove the only owner', async () => {
    // docs/product.md (Accounts): a farm has at least one owner at all times.
    const demote = await request(t.app).patch(`/api/farms/${farmId}/members/${ids['owner@byrecast.test']}`).set('cookie', owner).send({ role: 'partner' });
    expect(demote.status).toBe(409);
    expect(demote.body.error.code).toBe('last_owner');
    expect(demote.body.error.message).toMatch(/at least one owner/);
    const remove = await request(t.app).delete(`/api/farms/${farmId}/members/${ids['owner@byrecast.test']}`).set('cookie', owner);
    expect(remove.status).toBe(409);
    const me = await request(t.app).get('/api/auth/me').set('cookie', owner);
    expect(me.body.memberships).toEqual([{ farmId, role: 'owner' }]);
  });

  it('changes a role, and refuses an unknown role naming the field', async () => {
    // docs/product.md (Accounts): owners change members' roles.
    const res = await request(t.app).patch(`/api/farms/${farmId}/members/${ids['consultant@byrecast.test']}`).set('cookie', owner).send({ role: 'partner' });
    expect(res.status).toBe(200);
    const consultant = await signIn(t, 'consultant@byrecast.test');
    expect((await request(t.app).get('/api/auth/me').set('cookie', consultant)).body.memberships).toEqual([{ farmId, role: 'partner' }]);
    await request(t.app).patch(`/api/farms/${farmId}/members/${ids['consultant@byrecast.test']}`).set('cookie', owner).send({ role: 'consultant' });
    const bad = await request(t.app).patch(`/api/farms/${farmId}/members/${ids['consultant@byrecast.test']}`).set('cookie', owner).send({ role: 'admin' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('role');
    const nobody = await request(t.app).patch(`/api/farms/${farmId}/members/999999`).set('cookie', owner).send({ role: 'partner' });
    expect(nobody.status).toBe(404);
  });

  it('lets the partner see but not change roles', async () => {
    // docs/product.md: a family partner cannot manage members.
    const partner = await signIn(t, 'partner@byrecast.test');
    const res = await request(t.app).patch(`/api/farms/${farmId}/members/${ids['lender@byrecast.test']}`).set('cookie', partner).send({ role: 'owner' });
    expect(res.status).toBe(403);
  });

  it('with two owners lets one step down, then keeps the last', async () => {
    // docs/product.md (Accounts): at least one owner at all times.
    await request(t.app).patch(`/api/farms/${farmId}/members/${ids['partner@byrecast.test']}`).set('cookie', owner).send({ role: 'owner' });
    const second = await signIn(t, 'partner@byrecast.test');
    expect((await request(t.app).patch(`/api/farms/${farmId}/members/${ids['owner@byrecast.test']}`).set('cookie', second).send({ role: 'partner' })).status).toBe(200);
    const self = await request(t.app).patch(`/api/farms/${farmId}/members/${ids['partner@byrecast.test']}`).set('cookie', second).send({ role: 'partner' });
    expect(self.status).toBe(409);
    // Put the demo roles back.
    await request(t.app).patch(`/api/farms/${farmId}/members/${ids['owner@byrecast.test']}`).set('cookie', second).send({ role: 'owner' });
    await request(t.app).patch(`/api/farms/${farmId}/members/${ids['partner@byrecast.test']}`).set('cookie', owner).send({ role: 'partner' });
  });

  it('never leaves a farm without an owner when two owners demote each other at once', async () => {
    // docs/product.md (Accounts): at least one owner at all times, also under concurrent requests.
    const a = await signIn(t, 'owner@byrecast.test');
    await request(t.app).post('/api/auth/sign-up').send({ name: 'Bryn Calder', email: 'bryn@example.test', password: STRONG });
    const b = await signIn(t, 'bryn@example.test', STRONG);
    const farm = await request(t.app).post('/api/farms').set('cookie', a).send({ name: 'Twin Owner Farm' });
    const twinId = farm.body.id as number;
    const bId = (await request(t.app).get('/api/auth/me').set('cookie', b)).body.user.id as number;
    await t.database.pool.query('INSERT INTO memberships (farm_id, user_id, role) VALUES (?, ?, ?)', [twinId, bId, 'owner']);
    const aId = ids['owner@byrecast.test']!;
    const results = await Promise.all([
      request(t.app).patch(`/api/farms/${twinId}/members/${bId}`).set('cookie', a).send({ role: 'partner' }),
      request(t.app).patch(`/api/farms/${twinId}/members/${aId}`).set('cookie', b).send({ role: 'partner' }),
    ]);
    const statuses = results.map((r) => r.status).sort();
    // Exactly one wins; the other is refused (409 last owner, or 403 if it ran after losing ownership).
    expect(statuses[0]).toBe(200);
    expect([403, 409]).toContain(statuses[1]);
    const [owners] = await t.database.pool.query("SELECT COUNT(*) AS n FROM memberships WHERE farm_id = ? AND role = 'owner'", [twinId]);
    expect(Number((owners as { n: number }[])[0]!.n)).toBe(1);
  });

  it('removes a member, who then cannot find the farm', async () => {
    // docs/product.md (Accounts): owners remove members; the farm then answers 404 to them (DEVELOPERS.md: non-member → 404).
    const lender = await signIn(t, 'lender@byrecast.test');
    expect((await request(t.app).get(`/api/farms/${farmId}`).set('cookie', lender)).status).toBe(200);
    // The scenario shared with the lender (the demo shares one): read with the membership in one query.
    const [shared] = (await request(t.app).get(`/api/farms/${farmId}/scenarios`).set('cookie', lender)).body as { id: number }[];
    const sharedPath = `/api/farms/${farmId}/scenarios/${shared!.id}`;
    expect((await request(t.app).get(sharedPath).set('cookie', lender)).status).toBe(200);
    expect((await request(t.app).delete(`/api/farms/${farmId}/members/${ids['lender@byrecast.test']}`).set('cookie', owner)).status).toBe(204);
    expect((await request(t.app).get(`/api/farms/${farmId}`).set('cookie', lender)).status).toBe(404);
    expect((await request(t.app).get(sharedPath).set('cookie', lender)).status).toBe(404);
    expect((await request(t.app).get(`${sharedPath}/results/detail`).set('cookie', lender)).status).toBe(404);
    expect((await request(t.app).get('/api/farms').set('cookie', lender)).body).toEqual([]);
  });
});
