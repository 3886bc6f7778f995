/**
 * `kill -9` of the server in the middle of a burst of scenario saves: the real start command
 * (server/start.ts) as a child process on a test database, several clients saving whole
 * documents (PUT, each based on the version the last answer gave), SIGKILL while saves are in
 * flight, then the server started again. Every save that was answered 200 must be there with
 * the document it answered; nothing half-written: the versions of each scenario run 1…n without
 * a gap, the scenario row holds exactly its latest version's document, and every document
 * validates. Durability of acknowledged commits is the transaction's "D" (ACID, Haerder and
 * Reuter 1983, recalled from memory); InnoDB provides it with its redo log.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { findFreePort } from '../../server/db/local-server.js';
import { scenarioSchema, type Scenario } from '../../shared/schema/index.js';
import { createTestDatabase, type TestDatabase } from '../helpers/database.js';
import { signIn, startChild, type ChildServer } from '../helpers/processes.js';

const CLIENTS = 6;
/** SIGKILL once this many saves have been answered, with the other clients' saves in flight. */
const KILL_AFTER = 24;

interface Acked {
  version: number;
  scenario: Scenario;
}

describe('kill -9 of the server during a burst of saves', () => {
  let database: TestDatabase;
  let server: ChildServer | null = null;
  let env: NodeJS.ProcessEnv;

  async function startApp(): Promise<string> {
    server = startChild('server/start.ts', env);
    return (await server.waitFor(/Byrecast is running at (\S+)/, 120_000))[1]!;
  }

  beforeAll(async () => {
    database = await createTestDatabase();
    env = {
      ...process.env,
      NODE_ENV: 'production',
      DATABASE_URL: database.url,
      PORT: String(await findFreePort()),
      DIST_DIR: process.env.BYRECAST_DIST,
      BCRYPT_COST: '4',
      LOG_LEVEL: 'warn',
      // A fixed secret, so the session from before the crash still counts after it.
      JWT_SECRET: 'crash-test-secret-of-at-least-thirty-two-characters',
    };
  }, 60_000);

  afterAll(async () => {
    await server?.kill('SIGKILL');
    await database?.drop();
  });

  it('keeps every answered save and writes no half of one', async () => {
    let url = await startApp();
    const cookie = await signIn(url, 'owner@byrecast.test');
    const get = async <T>(path: string): Promise<T> => {
      const res = await fetch(`${url}${path}`, { headers: { cookie } });
      expect(res.status, path).toBe(200);
      return (await res.json()) as T;
    };
    const farmId = (await get<{ memberships: { farmId: number }[] }>('/api/auth/me')).memberships[0]!.farmId;
    const base = `/api/farms/${farmId}/scenarios`;
    // One scenario per client, so no save waits for another's lock or loses a version race.
    const first = (await get<{ id: number }[]>(base))[0]!.id;
    const ids: number[] = [];
    for (let i = 0; i < CLIENTS; i++) {
      const res = await fetch(`${url}${base}/${first}/duplicate`, {
        method: 'POST',
        headers: { cookie, 'content-type': 'application/json' },
        body: JSON.stringify({ name: `Burst ${i}` }),
      });
      expect(res.status).toBe(201);
      ids.push(((await res.json()) as { id: number }).id);
    }

    const acked = new Map<number, Acked[]>(ids.map((id) => [id, []]));
    let answered = 0;
    let killed = false;
    let inFlight = 0;
    let inFlightAtKill = 0;
    const pid = server!.child.pid!;
    const client = async (id: number) => {
      let { version, scenario } = await get<Acked>(`${base}/${id}`);
      for (let k = 1; ; k++) {
        // Each save changes the name and a figure, so every version is told apart by its content.
        const next: Scenario = { ...scenario, name: `Burst ${id} save ${k}`, herd: { ...scenario.herd, cows: scenario.herd.cows + 1 } };
        let status: number;
        let text: string;
        inFlight++;
        try {
          const res = await fetch(`${url}${base}/${id}`, {
            method: 'PUT',
            headers: { cookie, 'content-type': 'application/json' },
            body: JSON.stringify({ version, scenario: next, note: `save ${k}` }),
          });
          status = res.status;
          text = await res.text();
        } catch {
          return; // the server is gone: this save was never (wholly) answered
        } finally {
          inFlight--;
        }
        if (status !== 200) throw new Error(`save ${k} of ${id} answered ${status}: ${text}`);
        const body = JSON.parse(text) as Acked;
        acked.get(id)!.push({ version: body.version, scenario: body.scenario });
        ({ version, scenario } = body);
        if (++answered >= KILL_AFTER && !killed) {
          killed = true;
          inFlightAtKill = inFlight;
          process.kill(pid, 'SIGKILL');
        }
      }
    };
    await Promise.all(ids.map(client));
    expect(killed).toBe(true);
    expect(answered).toBeGreaterThanOrEqual(KILL_AFTER);
    // The other clients had saves on the wire when the server died.
    expect(inFlightAtKill).toBeGreaterThan(0);

    url = await startApp();
    for (const id of ids) {
      const saves = acked.get(id)!;
      const latest = await get<Acked>(`${base}/${id}`);
      const lastAcked = saves.at(-1)?.version ?? 1;
      // At most one save may have committed without its answer reaching the client.
      expect(latest.version - lastAcked).toBeGreaterThanOrEqual(0);
      expect(latest.version - lastAcked).toBeLessThanOrEqual(1);
      expect(scenarioSchema.safeParse(latest.scenario).success).toBe(true);
      for (const save of saves) {
        const stored = await get<Acked>(`${base}/${id}/versions/${save.version}`);
        expect(stored.scenario, `scenario ${id} version ${save.version}`).toEqual(save.scenario);
      }
      const versions = await get<{ version: number }[]>(`${base}/${id}/versions`);
      expect(versions.map((v) => v.version).sort((a, b) => a - b)).toEqual(Array.from({ length: latest.version }, (_, i) => i + 1));
    }

    // Straight from the tables: each scenario row is its latest version row, nothing in between.
    const [rows] = (await database.pool.query(
      `SELECT s.id, s.version, s.name, JSON_EQUALS(s.document, v.document) AS same, JSON_VALUE(v.document, '$.name') AS versionName,
              (SELECT MAX(x.version) FROM scenario_versions x WHERE x.scenario_id = s.id) AS maxVersion
         FROM scenarios s JOIN scenario_versions v ON v.scenario_id = s.id AND v.version = s.version
        WHERE s.id IN (?)`,
      [ids],
    )) as unknown as [{ id: number; version: number; name: string; same: number; versionName: string; maxVersion: number }[]];
    expect(rows).toHaveLength(CLIENTS);
    for (const row of rows) {
      expect(row.same, `scenario ${row.id}`).toBe(1);
      expect(row.maxVersion).toBe(row.version);
      expect(row.versionName).toBe(row.name);
    }
  }, 240_000);
});
