/** What a signed-in caller is told about themselves: the account (no secrets) and its memberships. */
import type { Session, SessionUser } from '../../shared/responses.js';
import type { Database } from '../db/client.js';
import { findUserById, listMemberships } from '../db/repositories/users.js';

export function publicUser(user: SessionUser): SessionUser {
  return { id: user.id, email: user.email, name: user.name, isAdmin: user.isAdmin };
}

export async function sessionOf(db: Database, user: SessionUser): Promise<Session> {
  return { user: publicUser(user), memberships: await listMemberships(db, user.id) };
}

/** The session of a signed-in user id (the account must still exist). */
export async function sessionOfUser(db: Database, userId: number): Promise<Session> {
  const user = await findUserById(db, userId);
  if (!user) throw new Error('signed-in user missing');
  return sessionOf(db, user);
}
