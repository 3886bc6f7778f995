/**
 * Loads the invented demo farm from scenarios/ into an empty database: one account per role,
 * the farm, and its scenarios. Does nothing when any user exists, so restarts keep real data.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import bcrypt from 'bcryptjs';
import { count } from 'drizzle-orm';
import { evaluateScenario } from '../../shared/engine/index.js';
import { herdSchema } from '../../shared/schema/index.js';
import { readScenarioDocument } from '../../shared/schema/stored-scenario.js';
import { keepSaved } from '../services/scenario-results.js';
import { summarise } from '../services/scenarios.js';
import type { Database } from '../db/client.js';
import { insertScenario } from '../db/repositories/scenarios.js';
import type { Executor } from '../db/repositories/farms.js';
import { insertShare } from '../db/repositories/lender.js';
import { newEmailToken } from '../auth/tokens.js';
import { utcDatePlusDays } from '../../shared/schema/lender.js';
import { farmsTable, membershipsTable, usersTable, type FarmRole } from '../db/schema/index.js';

const demoDir = fileURLToPath(new URL('../../scenarios/', import.meta.url));

export interface DemoAccount {
  email: string;
  name: string;
  role?: FarmRole;
  isAdmin?: boolean;
}

export interface DemoFarmFile {
  /** `baseline` is the farm's herd and markets (shared/schema herd shape, SI units). */
  farm: { name: string; location: string; currency: string; locale: string; units: 'metric' | 'us'; baseline?: unknown };
  password: string;
  accounts: DemoAccount[];
  scenarios: string[];
}

export function readDemoFarm(): DemoFarmFile {
  return JSON.parse(readFileSync(`${demoDir}demo-farm.json`, 'utf8')) as DemoFarmFile;
}

/** One of the demo farm's scenario files, validated as the CLI validates it (a broken file stops the seed with its field paths). */
export function readDemoScenario(fileName: string) {
  return readScenarioDocument(JSON.parse(readFileSync(`${demoDir}${fileName}`, 'utf8')));
}

export interface SeedResult {
  seeded: boolean;
  farmId: number | null;
  accounts: DemoAccount[];
  password: string;
}

/**
 * The demo lender's accepted, live share of the first demo scenario (its only version), running
 * a year from the seed; the other scenarios are not shared. The link was "used" at seed time, so
 * its token is random and never sent.
 */
async function seedLenderShare(tx: Executor, farmId: number, scenarioId: number | undefined, lenderId: number | null, ownerId: number | null, now: Date): Promise<void> {
  if (scenarioId === undefined || lenderId === null || ownerId === null) return;
  const lender = readDemoFarm().accounts.find((a) => a.role === 'lender');
  if (!lender) return;
  await insertShare(tx, {
    farmId,
    scenarioId,
    version: 1,
    lenderEmail: lender.email,
    lenderUserId: lenderId,
    tokenHash: newEmailToken().hash,
    tokenUsedAt: now,
    expiresOn: utcDatePlusDays(now, 365),
    createdBy: ownerId,
  });
}

export async function seedDemoData(db: Database, options: { bcryptCost?: number } = {}): Promise<SeedResult> {
  const demo = readDemoFarm();
  const [existing] = await db.select({ n: count() }).from(usersTable);
  if ((existing?.n ?? 0) > 0) return { seeded: false, farmId: null, accounts: demo.accounts, password: demo.password };

  const passwordHash = await bcrypt.hash(demo.password, options.bcryptCost ?? 12);
  const baseline = demo.farm.baseline === undefined ? null : herdSchema.parse(demo.farm.baseline);
  const scenarios = demo.scenarios.map(readDemoScenario);
  const farmId = await db.transaction(async (tx) => {
    const [farm] = await tx.insert(farmsTable).values({ ...demo.farm, baseline });
    let ownerId: number | null = null;
    let lenderId: number | null = null;
    for (const account of demo.accounts) {
      const [user] = await tx
        .insert(usersTable)
        .values({ email: account.email, name: account.name, passwordHash, isAdmin: account.isAdmin ?? false });
      if (account.role) await tx.insert(membershipsTable).values({ farmId: farm.insertId, userId: user.insertId, role: account.role });
      if (account.role === 'owner') ownerId ??= user.insertId;
      if (account.role === 'lender') lenderId ??= user.insertId;
    }
    if (ownerId === null && scenarios.length > 0) throw new Error('demo-farm.json: scenarios need an owner account to author them');
    const now = new Date();
    const scenarioIds: number[] = [];
    for (const document of scenarios) {
      const results = evaluateScenario(document);
      const documentText = JSON.stringify(document);
      const id = await insertScenario(tx, {
        farmId: farm.insertId,
        name: document.name,
        documentText,
        summary: summarise(results),
        userId: ownerId as number,
        note: 'Demo scenario',
        now,
      });
      // Kept with the version, so even the first read of a demo scenario evaluates nothing.
      await keepSaved(tx, id, document, documentText, results);
      scenarioIds.push(id);
    }
    await seedLenderShare(tx, farm.insertId, scenarioIds[0], lenderId, ownerId, now);
    return farm.insertId;
  });
  return { seeded: true, farmId, accounts: demo.accounts, password: demo.password };
}
