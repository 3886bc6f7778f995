/**
 * Loads the invented demo farm from scenarios/ into an empty database: one account per role,
 * the farm, and its scenarios. Does nothing when any user exists, so restarts keep real data.
 */
import { readFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import bcrypt from 'bcryptjs';
import { count } from 'drizzle-orm';
import type { Database } from './client.js';
import { farmsTable, membershipsTable, usersTable, type FarmRole } from './schema/index.js';

const demoDir = fileURLToPath(new URL('../../scenarios/', import.meta.url));

export interface DemoAccount {
  email: string;
  name: string;
  role?: FarmRole;
  isAdmin?: boolean;
}

export interface DemoFarmFile {
  farm: { name: string; location: string; currency: string; locale: string; units: 'metric' | 'us' };
  password: string;
  accounts: DemoAccount[];
  scenarios: string[];
}

export function readDemoFarm(): DemoFarmFile {
  return JSON.parse(readFileSync(`${demoDir}demo-farm.json`, 'utf8')) as DemoFarmFile;
}

export interface SeedResult {
  seeded: boolean;
  farmId: number | null;
  accounts: DemoAccount[];
  password: string;
}

export async function seedDemoData(db: Database, options: { bcryptCost?: number } = {}): Promise<SeedResult> {
  const demo = readDemoFarm();
  const [existing] = await db.select({ n: count() }).from(usersTable);
  if ((existing?.n ?? 0) > 0) return { seeded: false, farmId: null, accounts: demo.accounts, password: demo.password };

  const passwordHash = await bcrypt.hash(demo.password, options.bcryptCost ?? 12);
  const farmId = await db.transaction(async (tx) => {
    const [farm] = await tx.insert(farmsTable).values(demo.farm);
    for (const account of demo.accounts) {
      const [user] = await tx
        .insert(usersTable)
        .values({ email: account.email, name: account.name, passwordHash, isAdmin: account.isAdmin ?? false });
      if (account.role) await tx.insert(membershipsTable).values({ farmId: farm.insertId, userId: user.insertId, role: account.role });
    }
    return farm.insertId;
  });
  return { seeded: true, farmId, accounts: demo.accounts, password: demo.password };
}
