/**
 * Session checks asked together are answered by one query (server/db/repositories/users.ts,
 * `findUserWithScenario`), and each caller gets exactly what it would have got asking alone:
 * members and non-members, a scenario of the farm, one of another farm, one that does not
 * exist, a user that does not exist. Checked against the one-key query on the demo farm.
 */
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { findUserWithScenario } from '../../server/db/repositories/users.js';
import { createTestApp, type TestApp } from '../helpers/app.js';

type Row = { id: number };

describe('session checks asked together', () => {
  let t: TestApp;
  beforeAll(async () => {
    t = await createTestApp({ seedDemo: true });
  });
  afterAll(async () => {
    await t?.close();
  });

  async function ids(sql: string): Promise<number[]> {
    const [rows] = (await t.database.pool.query(sql)) as unknown as [Row[]];
    return rows.map((r) => Number(r.id));
  }

  it('are one query, and each answer is the one the key gets alone', async () => {
    const users = await ids('SELECT id FROM users ORDER BY id');
    const farms = await ids('SELECT id FROM farms ORDER BY id');
    const scenarios = await ids('SELECT id FROM scenarios ORDER BY id');
    expect(users.length).toBeGreaterThanOrEqual(4);
    const missingUser = Math.max(...users) + 100;
    const missingFarm = Math.max(...farms) + 100;
    const missingScenario = Math.max(...scenarios) + 100;
    const keys: [number, number, number][] = [];
    for (const user of [...users, missingUser]) {
      for (const farm of [...farms, missingFarm]) {
        for (const scenario of [0, ...scenarios, missingScenario]) keys.push([user, farm, scenario]);
      }
    }
    const db = t.deps.db;
    const alone = [];
    for (const key of keys) alone.push(await findUserWithScenario(db, ...key));

    // Every kind of answer is among them: a member with the scenario, a member without it, not a member, no user.
    expect(alone.some((a) => a?.role && a.scenario)).toBe(true);
    expect(alone.some((a) => a?.role && !a.scenario)).toBe(true);
    expect(alone.some((a) => a && !a.role && !a.scenario)).toBe(true);
    expect(alone.some((a) => a === null)).toBe(true);

    // Asked in the same turn, each key three times over (the same session asked twice is common):
    // one query per hundred asks, every answer as alone and in its place.
    const asks = [...keys, ...keys, ...keys];
    const query = vi.spyOn(t.database.pool, 'query');
    const together = await Promise.all(asks.map((key) => findUserWithScenario(db, ...key)));
    expect(query).toHaveBeenCalledTimes(Math.ceil(asks.length / 100));
    query.mockRestore();
    expect(together).toEqual([...alone, ...alone, ...alone]);
  });
});
