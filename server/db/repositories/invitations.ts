/** Farm invitations. Rows keep only the token's sha-256; status is derived from the timestamps. */
import { and, desc, eq, gt, isNull } from 'drizzle-orm';
import type { Database } from '../client.js';
import { farmsTable, invitationsTable, usersTable, type FarmRole } from '../schema/index.js';
import type { Executor } from './farms.js';

export interface Invitation {
  id: number;
  farmId: number;
  email: string;
  role: FarmRole;
  invitedBy: number | null;
  expiresAt: Date;
  acceptedAt: Date | null;
  revokedAt: Date | null;
  createdAt: Date;
}

const columns = {
  id: invitationsTable.id,
  farmId: invitationsTable.farmId,
  email: invitationsTable.email,
  role: invitationsTable.role,
  invitedBy: invitationsTable.invitedBy,
  expiresAt: invitationsTable.expiresAt,
  acceptedAt: invitationsTable.acceptedAt,
  revokedAt: invitationsTable.revokedAt,
  createdAt: invitationsTable.createdAt,
};

export async function insertInvitation(
  db: Database,
  invitation: { farmId: number; email: string; role: FarmRole; tokenHash: string; invitedBy: number; expiresAt: Date },
): Promise<number> {
  const [result] = await db.insert(invitationsTable).values(invitation);
  return result.insertId;
}

export async function findInvitation(db: Database, farmId: number, invitationId: number): Promise<Invitation | null> {
  const [row] = await db
    .select(columns)
    .from(invitationsTable)
    .where(and(eq(invitationsTable.id, invitationId), eq(invitationsTable.farmId, farmId)));
  return row ?? null;
}

/** The invitation for a token hash, with the farm's and the inviter's names for the accept page. */
export async function findInvitationByTokenHash(
  db: Executor,
  tokenHash: string,
): Promise<(Invitation & { farmName: string; inviterName: string | null }) | null> {
  const [row] = await db
    .select({ ...columns, farmName: farmsTable.name, inviterName: usersTable.name })
    .from(invitationsTable)
    .innerJoin(farmsTable, eq(farmsTable.id, invitationsTable.farmId))
    .leftJoin(usersTable, eq(usersTable.id, invitationsTable.invitedBy))
    .where(eq(invitationsTable.tokenHash, tokenHash));
  return row ?? null;
}

/** Open invitations of a farm: not accepted, not revoked, not expired; newest first. */
export async function listOpenInvitations(db: Database, farmId: number, now: Date): Promise<Invitation[]> {
  return db
    .select(columns)
    .from(invitationsTable)
    .where(
      and(
        eq(invitationsTable.farmId, farmId),
        isNull(invitationsTable.acceptedAt),
        isNull(invitationsTable.revokedAt),
        gt(invitationsTable.expiresAt, now),
      ),
    )
    .orderBy(desc(invitationsTable.createdAt));
}

/** Gives an open invitation a new token and expiry (resend); false when it is no longer open. */
export async function renewInvitation(db: Database, invitationId: number, tokenHash: string, expiresAt: Date): Promise<boolean> {
  const [result] = await db
    .update(invitationsTable)
    .set({ tokenHash, expiresAt })
    .where(and(eq(invitationsTable.id, invitationId), isNull(invitationsTable.acceptedAt), isNull(invitationsTable.revokedAt)));
  return result.affectedRows === 1;
}

export async function revokeInvitation(db: Database, invitationId: number, now: Date): Promise<boolean> {
  const [result] = await db
    .update(invitationsTable)
    .set({ revokedAt: now })
    .where(and(eq(invitationsTable.id, invitationId), isNull(invitationsTable.acceptedAt), isNull(invitationsTable.revokedAt)));
  return result.affectedRows === 1;
}

/** Marks an open invitation accepted; true only for the one caller that wins a race. */
export async function claimInvitation(db: Executor, invitationId: number, now: Date): Promise<boolean> {
  const [result] = await db
    .update(invitationsTable)
    .set({ acceptedAt: now })
    .where(and(eq(invitationsTable.id, invitationId), isNull(invitationsTable.acceptedAt), isNull(invitationsTable.revokedAt)));
  return result.affectedRows === 1;
}

/** Revokes the farm's other open invitations to the same address (a new invite replaces them). */
export async function revokeOpenInvitationsTo(db: Database, farmId: number, email: string, now: Date): Promise<void> {
  await db
    .update(invitationsTable)
    .set({ revokedAt: now })
    .where(
      and(
        eq(invitationsTable.farmId, farmId),
        eq(invitationsTable.email, email),
        isNull(invitationsTable.acceptedAt),
        isNull(invitationsTable.revokedAt),
      ),
    );
}
