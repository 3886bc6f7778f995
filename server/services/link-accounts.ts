/**
 * The account side of accepting an e-mailed link (invitation, lender share): signed in, the
 * account must be the addressed one; signed out, a new account for that address is prepared.
 * Claiming the link and joining the farm stay with each feature, because they differ there (the
 * order of claim and insert, the role, the audit entry).
 */
import bcrypt from 'bcryptjs';
import type { AcceptInvitationInput } from '../../shared/schema/accounts.js';
import type { Database } from '../db/client.js';
import { findUserByEmail, findUserById, type User } from '../db/repositories/users.js';
import { AppError } from '../errors.js';
import { assertPasswordNotEmail } from './accounts.js';

/** The 400 `invalid_token` answer for a link that cannot be used; the message also names the `token` field. */
export function invalidLink<R extends string>(messages: Readonly<Record<R, string>>, reason: R): AppError {
  return new AppError(400, 'invalid_token', messages[reason], { token: messages[reason] }, { reason });
}

/** Throws 403 `wrong_account` unless the signed-in caller holds `email`; `what` names the link ("invitation", "share"). */
export function assertAddressee(caller: User, email: string, what: string): void {
  if (caller.email !== email) {
    throw new AppError(403, 'wrong_account', `This ${what} is for ${email}. Sign out and open the link again, or sign in with that address.`);
  }
}

/**
 * For a signed-out visitor: refuses an address that has an account (409 `sign_in_required`),
 * a missing name or password (400 naming each) and a password equal to the address; returns
 * the name and the bcrypt hash (at `cost` rounds) of the account to insert.
 */
export async function prepareLinkAccount(db: Database, email: string, input: AcceptInvitationInput, cost: number): Promise<{ name: string; passwordHash: string }> {
  if (await findUserByEmail(db, email)) {
    throw new AppError(409, 'sign_in_required', `An account for ${email} already exists. Sign in, then open the link again.`);
  }
  const fields: Record<string, string> = {};
  if (!input.name) fields.name = 'Name is required';
  if (!input.password) fields.password = 'Password is required';
  const [firstField] = Object.keys(fields);
  if (firstField) throw new AppError(400, 'invalid_input', `${firstField}: ${fields[firstField]}`, fields);
  const { name, password } = input as Required<AcceptInvitationInput>;
  assertPasswordNotEmail(password, email);
  return { name, passwordHash: await bcrypt.hash(password, cost) };
}

/** The account the accept transaction inserted, read back. */
export async function insertedUser(db: Database, userId: number): Promise<User> {
  const user = await findUserById(db, userId);
  if (!user) throw new Error('user vanished after insert');
  return user;
}
