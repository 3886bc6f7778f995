/**
 * MariaDB killed under a running server: the real server (server/serve.ts, over real HTTP) on a
 * private MariaDB of its own. While the database is gone every API route answers 503
 * `database_unavailable` within 3 s and the health check says `database: "down"`; once MariaDB
 * is started again on the same port and data the server carries on by itself. A frozen MariaDB
 * (SIGSTOP) answers 503 after the query deadline. The 3 s bound is the product's own promise
 * (DEVELOPERS.md, "Faults and backups"), no outside source.
 */
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { farmRouteRegistry } from '../../server/auth/middleware.js';
import { SESSION_COOKIE } from '../../server/auth/session.js';
import { findFreePort, startLocalMariadb, type LocalMariadb } from '../../server/db/local-server.js';
import { QUERY_DEADLINE_MS, startServer, type RunningServer } from '../../server/serve.js';
import { testConfig } from '../helpers/app.js';
import { eventually, processGone, signIn } from '../helpers/processes.js';

const DATABASE = 'byrecast_outage';

describe('MariaDB stopped under a running server', () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'byrecast-outage-'));
  let port: number;
  let mariadb: LocalMariadb | null = null;
  let server: RunningServer | null = null;
  let owner: string;
  let ids: Record<string, string>;

  beforeAll(async () => {
    port = await findFreePort();
    mariadb = await startLocalMariadb({ dataDir, port, database: DATABASE, quiet: true });
    server = await startServer({ databaseUrl: `${mariadb.serverUrl}/${DATABASE}`, config: testConfig({ port: 0 }), seedDemo: true });
    owner = await signIn(server.url, 'owner@byrecast.test');
    const me = (await (await fetch(`${server.url}/api/auth/me`, { headers: { cookie: owner } })).json()) as { memberships: { farmId: number }[] };
    const farmId = me.memberships[0]!.farmId;
    const list = (await (await fetch(`${server.url}/api/farms/${farmId}/scenarios`, { headers: { cookie: owner } })).json()) as { id: number }[];
    ids = { farmId: String(farmId), scenarioId: String(list[0]!.id), optionId: 'current', version: '1', userId: '1', documentId: '1' };
  }, 90_000);

  afterAll(async () => {
    await server?.close();
    await mariadb?.stop();
    rmSync(dataDir, { recursive: true, force: true });
  });

  /** Every API route the app declares: the farm routes from their registry, the rest by hand (server/routes/index.ts). */
  function everyRoute(): { method: string; path: string }[] {
    const farm = farmRouteRegistry.map((r) => ({ method: r.method, path: r.path.replace(/:(\w+)/g, (_m, name: string) => ids[name] ?? '1') }));
    return [
      ...farm,
      { method: 'get', path: '/api/farms' },
      { method: 'post', path: '/api/farms' },
      { method: 'get', path: '/api/auth/me' },
      { method: 'patch', path: '/api/auth/me' },
      { method: 'post', path: '/api/auth/me/password' },
      { method: 'post', path: '/api/auth/sign-in' },
      { method: 'post', path: '/api/auth/sign-up' },
      { method: 'post', path: '/api/auth/sign-out' },
      { method: 'post', path: '/api/auth/password-reset/request' },
      { method: 'post', path: '/api/auth/password-reset/complete' },
      { method: 'get', path: '/api/invitations/a-token-of-thirty-two-characters' },
      { method: 'post', path: '/api/invitations/a-token-of-thirty-two-characters/accept' },
      { method: 'get', path: '/api/lender-shares/a-token-of-thirty-two-characters' },
      { method: 'post', path: '/api/lender-shares/a-token-of-thirty-two-characters/accept' },
      { method: 'get', path: '/api/admin/users' },
      { method: 'patch', path: '/api/admin/users/1' },
      { method: 'get', path: '/api/dev/outbox' },
    ];
  }

  async function call(method: string, path: string, cookie?: string): Promise<{ status: number; body: { error?: { code?: string }; database?: string }; ms: number }> {
    const started = Date.now();
    const res = await fetch(`${server!.url}${path}`, {
      method: method.toUpperCase(),
      headers: { 'content-type': 'application/json', ...(cookie ? { cookie } : {}) },
      body: method === 'get' || method === 'delete' ? undefined : JSON.stringify({ email: 'owner@byrecast.test', password: 'byrecast-demo', version: 1, name: 'x' }),
      // A hung request fails here instead of at the test timeout.
      signal: AbortSignal.timeout(20_000),
    });
    const text = await res.text();
    return { status: res.status, body: text.startsWith('{') ? JSON.parse(text) : {}, ms: Date.now() - started };
  }

  it('answers 200 before the fault (the routes are real and reachable)', async () => {
    expect((await call('get', `/api/farms/${ids.farmId}/scenarios/${ids.scenarioId}`, owner)).status).toBe(200);
    expect((await call('get', '/api/health')).body).toEqual({ status: 'ok', database: 'up' });
  });

  it('answers 503 while MariaDB is frozen (SIGSTOP: no reset, TCP would wait), and 200 once it runs again', async () => {
    const scenarios = `/api/farms/${ids.farmId}/scenarios`;
    // Several open connections in the pool, idle: the ones a frozen server leaves hanging.
    await Promise.all(Array.from({ length: 12 }, () => call('get', scenarios, owner)));
    const pid = mariadb!.pid()!;
    process.kill(pid, 'SIGSTOP');
    try {
      const answers = await Promise.all([...Array.from({ length: 12 }, () => call('get', scenarios, owner)), call('get', '/api/health')]);
      for (const res of answers) {
        expect(res.status).toBe(503);
        // The query deadline, then at most a queue wait and one 2 s connect attempt.
        expect(res.ms).toBeLessThan(QUERY_DEADLINE_MS + 4_000);
      }
      expect(answers.at(-1)!.body).toEqual({ status: 'degraded', database: 'down' });
    } finally {
      process.kill(pid, 'SIGCONT');
    }
    expect(await eventually(async () => (await call('get', '/api/health')).status === 200, 10_000)).toBe(true);
    const again = await Promise.all(Array.from({ length: 12 }, () => call('get', scenarios, owner)));
    expect(again.map((r) => r.status)).toEqual(again.map(() => 200));
  }, 60_000);

  it('answers every API route 503 database_unavailable within 3 s once MariaDB is killed, and recovers when it is back', async () => {
    const pid = mariadb!.pid()!;
    process.kill(pid, 'SIGKILL');
    await processGone(pid);

    const routes = everyRoute();
    expect(routes.length).toBeGreaterThan(50);
    for (const { method, path } of routes) {
      const res = await call(method, path, owner);
      const where = `${method} ${path}`;
      expect(res.status, where).toBe(503);
      expect(res.body.error?.code, where).toBe('database_unavailable');
      expect(res.ms, where).toBeLessThan(3_000);
    }
    // Without a session the routes that read the database fail the same way; the reset request
    // alone answers 202 before any lookup (by design: the same reply whether an account exists).
    for (const path of ['/api/auth/sign-in', '/api/auth/sign-up', '/api/invitations/a-token-of-thirty-two-characters', '/api/lender-shares/a-token-of-thirty-two-characters']) {
      const res = await call(path.endsWith('-characters') ? 'get' : 'post', path);
      expect(res.status, path).toBe(503);
      expect(res.body.error?.code, path).toBe('database_unavailable');
    }
    expect((await call('post', '/api/auth/password-reset/request')).status).toBe(202);

    // Many at once (more than the pool's 10 connections): none waits past 3 s.
    const burst = await Promise.all(Array.from({ length: 40 }, () => call('get', `/api/farms/${ids.farmId}/scenarios`, owner)));
    for (const res of burst) {
      expect(res.status).toBe(503);
      expect(res.ms).toBeLessThan(3_000);
    }
    const health = await call('get', '/api/health');
    expect(health.status).toBe(503);
    expect(health.body).toEqual({ status: 'degraded', database: 'down' });
    expect(health.ms).toBeLessThan(3_000);

    // Back on the same port and data: the very next requests succeed, nothing restarted by hand.
    mariadb = await startLocalMariadb({ dataDir, port, quiet: true });
    expect((await call('get', '/api/health')).body).toEqual({ status: 'ok', database: 'up' });
    const again = await call('get', `/api/farms/${ids.farmId}/scenarios/${ids.scenarioId}`, owner);
    expect(again.status).toBe(200);
    const burstAfter = await Promise.all(Array.from({ length: 20 }, () => call('get', `/api/farms/${ids.farmId}/scenarios`, owner)));
    expect(burstAfter.map((r) => r.status)).toEqual(burstAfter.map(() => 200));
    // The session from before the outage still counts.
    expect(owner).toContain(`${SESSION_COOKIE}=`);
    expect(((await call('get', '/api/auth/me', owner)).body as { user?: { email: string } }).user?.email).toBe('owner@byrecast.test');
  }, 120_000);
});
