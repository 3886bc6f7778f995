/**
 * The permission matrix: every farm route in `farmRouteRegistry` (filled as the app registers
 * its routes, so a new route is picked up without touching this file) × every farm role, a
 * signed-in non-member and a signed-out caller. Expected answers come from docs/product.md (Accounts) (
 * allowed ones succeed, the rest get 401/403/404 as designed, no response carries
 * another farm's data) and DEVELOPERS.md ("A farm the caller is not a member of answers 404").
 */
import request from 'supertest';
import { afterAll, describe, expect, it } from 'vitest';
import { farmRouteRegistry, type FarmRouteRecord } from '../../server/auth/middleware.js';
import { permissionTable, roleAllows } from '../../shared/permissions.js';
import { SESSION_COOKIE } from '../../server/auth/session.js';
import { farmRoles, type FarmRole } from '../../server/db/schema/index.js';
import { createTestApp } from '../helpers/app.js';

const DEMO_PASSWORD = 'byrecast-demo';
const OUTSIDER_FARM = 'Outsider Holding Qzx-7731';
/** Stands in for every path parameter other than :farmId: an id no row has. */
const MISSING_ID = '987654321';

const t = await createTestApp({ seedDemo: true });

async function signIn(email: string, password = DEMO_PASSWORD): Promise<string> {
  const res = await request(t.app).post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in of ${email} failed: ${res.status}`);
  const raw = res.headers['set-cookie'] as unknown as string[];
  return raw.find((c) => c.startsWith(`${SESSION_COOKIE}=`))!.split(';')[0]!;
}

const cookies: Record<FarmRole, string> = {
  owner: await signIn('owner@byrecast.test'),
  partner: await signIn('partner@byrecast.test'),
  consultant: await signIn('consultant@byrecast.test'),
  lender: await signIn('lender@byrecast.test'),
};
const userIds: Record<FarmRole, number> = { owner: 0, partner: 0, consultant: 0, lender: 0 };
for (const role of farmRoles) {
  userIds[role] = (await request(t.app).get('/api/auth/me').set('cookie', cookies[role])).body.user.id as number;
}

// The non-member has a farm of their own, whose name must never show up in anyone else's answers.
await request(t.app).post('/api/auth/sign-up').send({ name: 'Outsider', email: 'outsider@example.test', password: 'outsider-pass-99' });
const outsider = await signIn('outsider@example.test', 'outsider-pass-99');
await request(t.app).post('/api/farms').set('cookie', outsider).send({ name: OUTSIDER_FARM });

const routes = [...farmRouteRegistry].sort((a, b) => a.path.localeCompare(b.path) || a.method.localeCompare(b.method));

/** A fresh farm with one member per role, so a destructive route cannot disturb the next one. */
async function farmWithEveryRole(label: string): Promise<{ id: number; name: string }> {
  const name = `Matrix farm ${label}`;
  const res = await request(t.app).post('/api/farms').set('cookie', cookies.owner).send({ name });
  const id = res.body.id as number;
  for (const role of ['partner', 'consultant', 'lender'] as const) {
    await t.database.pool.query('INSERT INTO memberships (farm_id, user_id, role) VALUES (?, ?, ?)', [id, userIds[role], role]);
  }
  return { id, name };
}

function pathFor(route: FarmRouteRecord, farmId: number): string {
  return route.path.replace(/:(\w+)/g, (_m, name: string) => (name === 'farmId' ? String(farmId) : MISSING_ID));
}

function send(route: FarmRouteRecord, path: string, cookie: string | null): request.Test {
  let req = request(t.app)[route.method](path);
  if (cookie) req = req.set('cookie', cookie);
  return route.method === 'get' || route.method === 'delete' ? req : req.send({});
}

afterAll(async () => {
  await t.close();
});

describe('permission matrix', () => {
  it('covers every farm route and names only permissions from the table', () => {
    // docs/product.md (Accounts): the matrix is generated from the permission table, so a new route cannot be forgotten.
    const paths = routes.map((r) => `${r.method} ${r.path}`);
    expect(paths).toContain('get /api/farms/:farmId');
    expect(paths).toContain('post /api/farms/:farmId/invitations');
    expect(paths).toContain('patch /api/farms/:farmId/members/:userId');
    for (const r of routes) expect(Object.keys(permissionTable)).toContain(r.permission);
  });

  for (const route of routes) {
    describe(`${route.method.toUpperCase()} ${route.path} (${route.permission})`, () => {
      // Least privileged first, owner last: an allowed destructive call runs after the others.
      const order: FarmRole[] = ['lender', 'consultant', 'partner', 'owner'];
      it('answers 401 signed out, 404 to a non-member, and per role as the table says', async () => {
        const farm = await farmWithEveryRole(`${route.method} ${route.path}`);
        const path = pathFor(route, farm.id);

        const signedOut = await send(route, path, null);
        expect(signedOut.status, 'signed out').toBe(401);

        const stranger = await send(route, path, outsider);
        expect(stranger.status, 'non-member').toBe(404);
        expect(stranger.text).not.toContain(farm.name);

        for (const role of order) {
          const res = await send(route, path, cookies[role]);
          const label = `${role} on ${route.method} ${path}: ${res.status} ${res.text.slice(0, 200)}`;
          if (roleAllows(role, route.permission)) {
            expect([401, 403], label).not.toContain(res.status);
            // Bad or missing input is the caller's mistake: never a server error.
            expect(res.status, label).toBeLessThan(500);
          } else {
            expect(res.status, label).toBe(403);
          }
          expect(res.text, label).not.toContain(OUTSIDER_FARM);
        }
      });
    });
  }
});

describe('one id-parameter policy', () => {
  // DEVELOPERS.md (Authorization): a path id that is not a positive whole number is bad input,
  // 400 naming the parameter, on every route alike; a well-formed id nobody may see is 404.
  it('answers 400 naming the parameter for a malformed path id on every farm route, :farmId included', async () => {
    const farm = await farmWithEveryRole('id policy');
    for (const route of routes) {
      const names = [...route.path.matchAll(/:(\w+)/g)].map((m) => m[1]!);
      const role = (['owner', 'partner', 'consultant', 'lender'] as const).find((r) => roleAllows(r, route.permission))!;
      for (const name of names) {
        const path = route.path.replace(/:(\w+)/g, (_m, other: string) => (other === name ? 'abc' : other === 'farmId' ? String(farm.id) : MISSING_ID));
        const res = await send(route, path, cookies[role]);
        const label = `${role} on ${route.method} ${path}: ${res.status} ${res.text.slice(0, 200)}`;
        expect(res.status, label).toBe(400);
        expect(res.body.error.code, label).toBe('invalid_input');
        expect(Object.keys(res.body.error.fields), label).toEqual([name]);
      }
    }
  });

  it('answers 404 for a well-formed id of nothing the caller may see, so /scenarios/N and /scenarios/N/quotes agree', async () => {
    const farm = await farmWithEveryRole('missing ids');
    for (const suffix of ['', '/quotes', '/versions', '/results/detail', '/export.json', '/risk-result', '/reviews', '/preferences']) {
      const res = await request(t.app).get(`/api/farms/${farm.id}/scenarios/${MISSING_ID}${suffix}`).set('cookie', cookies.owner);
      expect(res.status, suffix).toBe(404);
    }
  });
});
