import DataLoader from 'dataloader';
import { and, count, eq, isNull, sql } from 'drizzle-orm';
import type { SelectedFields } from 'drizzle-orm/mysql-core';
import type { Database } from '../client.js';
import type { Executor } from './farms.js';
import { farmsTable, membershipsTable, passwordResetsTable, scenariosTable, usersTable, type FarmRole } from '../schema/index.js';
import { scenarioCreator, scenarioHeadColumns, scenarioUpdater, toScenarioHead, type ScenarioHead, type ScenarioHeadRow } from './scenarios.js';

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

/** Built once per pool: a session check runs on every request, so its SQL is not rebuilt each time. */
const preparedScenarioSessionQueries = new WeakMap<Database, ReturnType<typeof prepareScenarioSessionQuery>>();

/** The user with their membership of one farm (the placeholder `farmId`), and any more columns a query wants. */
function withMembership<Extra extends SelectedFields>(db: Database, extra: Extra) {
  return db
    .select({ ...publicColumns, role: membershipsTable.role, farmId: farmsTable.id, ...extra })
    .from(usersTable)
    .leftJoin(membershipsTable, and(eq(membershipsTable.userId, usersTable.id), eq(membershipsTable.farmId, sql.placeholder('farmId'))))
    .leftJoin(farmsTable, eq(farmsTable.id, membershipsTable.farmId));
}

/** The session query with one scenario's head, joined only through the membership: never a farm the user is not on. */
function prepareScenarioSessionQuery(db: Database) {
  return withMembership(db, { scenario: scenarioHeadColumns })
    .leftJoin(scenariosTable, and(eq(scenariosTable.farmId, farmsTable.id), eq(scenariosTable.id, sql.placeholder('scenarioId'))))
    .leftJoin(scenarioCreator, eq(scenarioCreator.id, scenariosTable.createdBy))
    .leftJoin(scenarioUpdater, eq(scenarioUpdater.id, scenariosTable.updatedBy))
    .where(eq(usersTable.id, sql.placeholder('userId')))
    .prepare();
}

function preparedIn<T>(cache: WeakMap<Database, T>, db: Database, prepare: (db: Database) => T): T {
  let prepared = cache.get(db);
  if (!prepared) {
    prepared = prepare(db);
    cache.set(db, prepared);
  }
  return prepared;
}

/** What a session check asks: a user, one farm and (0: none) one scenario of it. */
type SessionKey = {
  userId: number;
  farmId: number;
  scenarioId: number;
};

type SessionRow = Awaited<ReturnType<ReturnType<typeof prepareScenarioSessionQuery>['execute']>>[number];

/**
 * The session query for `count` keys at once: a derived table of the keys (placeholders u0, f0,
 * s0, ...) joined as the one-key query joins one. `k.i` gives each row back to its key.
 */
function prepareBatchSessionQuery(db: Database, count: number) {
  const askedKeys = sql.join(
    Array.from({ length: count }, (_, i) => sql`SELECT ${sql.raw(String(i))} AS i, ${sql.placeholder(`u${i}`)} AS u, ${sql.placeholder(`f${i}`)} AS f, ${sql.placeholder(`s${i}`)} AS s`),
    sql` UNION ALL `,
  );
  return db
    .select({ asked: sql<number>`k.i`.mapWith(Number), ...publicColumns, role: membershipsTable.role, farmId: farmsTable.id, scenario: scenarioHeadColumns })
    .from(sql`(${askedKeys}) AS k`)
    .innerJoin(usersTable, eq(usersTable.id, sql`k.u`))
    .leftJoin(membershipsTable, and(eq(membershipsTable.userId, usersTable.id), eq(membershipsTable.farmId, sql`k.f`)))
    .leftJoin(farmsTable, eq(farmsTable.id, membershipsTable.farmId))
    .leftJoin(scenariosTable, and(eq(scenariosTable.farmId, farmsTable.id), eq(scenariosTable.id, sql`k.s`)))
    .leftJoin(scenarioCreator, eq(scenarioCreator.id, scenariosTable.createdBy))
    .leftJoin(scenarioUpdater, eq(scenarioUpdater.id, scenariosTable.updatedBy))
    .prepare();
}

/** Per pool, by number of keys: built once each, as a busy server asks the same sizes again and again. */
const preparedBatchSessionQueries = new WeakMap<Database, Map<number, ReturnType<typeof prepareBatchSessionQuery>>>();

async function sessionRowsOf(db: Database, keys: readonly SessionKey[]): Promise<(SessionRow | null)[]> {
  if (keys.length === 1) {
    const [row] = await preparedIn(preparedScenarioSessionQueries, db, prepareScenarioSessionQuery).execute(keys[0]!);
    return [row ?? null];
  }
  const bySize = preparedIn(preparedBatchSessionQueries, db, () => new Map<number, ReturnType<typeof prepareBatchSessionQuery>>());
  let query = bySize.get(keys.length);
  if (!query) {
    query = prepareBatchSessionQuery(db, keys.length);
    bySize.set(keys.length, query);
  }
  const placeholders: Record<string, number> = {};
  keys.forEach((key, i) => {
    placeholders[`u${i}`] = key.userId;
    placeholders[`f${i}`] = key.farmId;
    placeholders[`s${i}`] = key.scenarioId;
  });
  const byKey: (SessionRow | null)[] = keys.map(() => null);
  for (const { asked, ...row } of await query.execute(placeholders)) byKey[asked] = row;
  return byKey;
}

/**
 * Session checks asked in the same turn of the event loop go to MariaDB as one query: a busy
 * server reads many sessions at once, and each query of its own costs a round trip and a wake-up
 * of a MariaDB thread. Nothing is kept between turns, so every request still reads the database.
 */
const sessionLoaders = new WeakMap<Database, DataLoader<SessionKey, SessionRow | null>>();

function sessionRow(db: Database, key: SessionKey): Promise<SessionRow | null> {
  const loader = preparedIn(sessionLoaders, db, () => new DataLoader((keys: readonly SessionKey[]) => sessionRowsOf(db, keys), { cache: false, maxBatchSize: 100, batchScheduleFn: (run) => setImmediate(run) }));
  return loader.load(key);
}

/**
 * A user and their role on one farm (null when not a member) and, when `scenarioId` is one, the
 * head of that scenario of the farm (null when the user is not a member or the farm has no such
 * scenario), in one round trip: a request to a farm route needs the first two, a read of a
 * scenario all three, and this is most of what a read of kept results costs.
 */
export async function findUserWithScenario(
  db: Database,
  userId: number,
  farmId: number,
  scenarioId = 0,
): Promise<{ user: User; role: FarmRole | null; scenario: ScenarioHead | null } | null> {
  const row = await sessionRow(db, { userId, farmId, scenarioId });
  if (!row) return null;
  const { role, farmId: foundFarm, scenario, ...user } = row;
  const member = foundFarm !== null;
  return { user, role: member ? role : null, scenario: member && scenario?.id != null ? toScenarioHead(scenario as ScenarioHeadRow) : null };
}

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
  db: Executor,
  user: { email: string; name: string; passwordHash: string; isAdmin?: boolean },
): Promise<number> {
  const [result] = await db.insert(usersTable).values(user);
  return result.insertId;
}

export async function findMembership(db: Executor, farmId: number, userId: number): Promise<FarmRole | null> {
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

/** Replaces the password hash and raises the token version, so every earlier session ends. */
export async function setPasswordHash(db: Executor, userId: number, passwordHash: string): Promise<void> {
  await db
    .update(usersTable)
    .set({ passwordHash, tokenVersion: sql`${usersTable.tokenVersion} + 1` })
    .where(eq(usersTable.id, userId));
}

export async function findPasswordHash(db: Database, userId: number): Promise<string | null> {
  const [row] = await db.select({ hash: usersTable.passwordHash }).from(usersTable).where(eq(usersTable.id, userId));
  return row?.hash ?? null;
}

export async function updateUserName(db: Database, userId: number, name: string): Promise<void> {
  await db.update(usersTable).set({ name }).where(eq(usersTable.id, userId));
}

/** Disables or re-enables an account; disabling also ends its sessions. */
export async function setUserDisabled(db: Database, userId: number, disabled: boolean): Promise<void> {
  await db
    .update(usersTable)
    .set(disabled ? { disabled, tokenVersion: sql`${usersTable.tokenVersion} + 1` } : { disabled })
    .where(eq(usersTable.id, userId));
}

export interface UserListing extends User {
  farmCount: number;
}

/** Every account with how many farms it belongs to (no farm names: the administrator sees no farm data). */
export async function listUsersWithFarmCount(db: Database): Promise<UserListing[]> {
  const rows = await db
    .select({ ...publicColumns, farmCount: count(membershipsTable.farmId) })
    .from(usersTable)
    .leftJoin(membershipsTable, eq(membershipsTable.userId, usersTable.id))
    .groupBy(usersTable.id)
    .orderBy(usersTable.email);
  return rows.map((r) => ({ ...r, farmCount: Number(r.farmCount) }));
}

export async function insertPasswordReset(db: Database, reset: { userId: number; tokenHash: string; expiresAt: Date }): Promise<void> {
  await db.insert(passwordResetsTable).values(reset);
}

export async function findPasswordResetByHash(
  db: Database,
  tokenHash: string,
): Promise<{ id: number; userId: number; expiresAt: Date; usedAt: Date | null } | null> {
  const [row] = await db
    .select({ id: passwordResetsTable.id, userId: passwordResetsTable.userId, expiresAt: passwordResetsTable.expiresAt, usedAt: passwordResetsTable.usedAt })
    .from(passwordResetsTable)
    .where(eq(passwordResetsTable.tokenHash, tokenHash));
  return row ?? null;
}

/**
 * Marks a reset used, only if it was still unused: true for the one caller that wins, so two
 * requests racing with the same link cannot both set a password.
 */
export async function claimPasswordReset(db: Executor, resetId: number, now: Date): Promise<boolean> {
  const [result] = await db
    .update(passwordResetsTable)
    .set({ usedAt: now })
    .where(and(eq(passwordResetsTable.id, resetId), isNull(passwordResetsTable.usedAt)));
  return result.affectedRows === 1;
}

/** Ends every other open reset link of the user (after one is used). */
export async function closeOpenPasswordResets(db: Executor, userId: number, now: Date): Promise<void> {
  await db
    .update(passwordResetsTable)
    .set({ usedAt: now })
    .where(and(eq(passwordResetsTable.userId, userId), isNull(passwordResetsTable.usedAt)));
}
