import { and, eq } from 'drizzle-orm';
import type { Database } from '../client.js';
import { farmsTable, membershipsTable, usersTable, type FarmRole } from '../schema/index.js';

export interface User {
  id: number;
  email: string;
  name: string;
  isAdmin: boolean;
  tokenVersion: number;
  disabled: boolean;
  createdAt: Date;
}

const publicColumns = {
  id: usersTable.id,
  email: usersTable.email,
  name: usersTable.name,
  isAdmin: usersTable.isAdmin,
  tokenVersion: usersTable.tokenVersion,
  disabled: usersTable.disabled,
  createdAt: usersTable.createdAt,
};

export async function findUserById(db: Database, id: number): Promise<User | null> {
  const [row] = await db.select(publicColumns).from(usersTable).where(eq(usersTable.id, id));
  return row ?? null;
}

export async function findUserByEmail(db: Database, email: string): Promise<(User & { passwordHash: string }) | null> {
  const [row] = await db
    .select({ ...publicColumns, passwordHash: usersTable.passwordHash })
    .from(usersTable)
    .where(eq(usersTable.email, email));
  return row ?? null;
}

export async function insertUser(
  db: Database,
  user: { email: string; name: string; passwordHash: string; isAdmin?: boolean },
): Promise<number> {
  const [result] = await db.insert(usersTable).values(user);
  return result.insertId;
}

export async function findMembership(db: Database, farmId: number, userId: number): Promise<FarmRole | null> {
  const [row] = await db
    .select({ role: membershipsTable.role })
    .from(membershipsTable)
    .innerJoin(farmsTable, eq(farmsTable.id, membershipsTable.farmId))
    .where(and(eq(membershipsTable.farmId, farmId), eq(membershipsTable.userId, userId)));
  return row?.role ?? null;
}

export async function listMemberships(db: Database, userId: number): Promise<{ farmId: number; role: FarmRole }[]> {
  return db
    .select({ farmId: membershipsTable.farmId, role: membershipsTable.role })
    .from(membershipsTable)
    .where(eq(membershipsTable.userId, userId));
}
