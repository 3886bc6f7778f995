/** Sign-up, sign-in, profile and account administration: the account rules, independent of HTTP. */
import bcrypt from 'bcryptjs';
import { eq, sql } from 'drizzle-orm';
import { PASSWORD_IS_EMAIL, passwordIsEmail, type SignUpInput } from '../../shared/schema/accounts.js';
import type { Database } from '../db/client.js';
import {
  findPasswordHash,
  findUserByEmail,
  findUserById,
  insertUser,
  listUsersWithFarmCount,
  setPasswordHash,
  setUserDisabled,
  updateUserName,
  type User,
  type UserListing,
} from '../db/repositories/users.js';
import { usersTable } from '../db/schema/index.js';
import { AppError, notFound } from '../errors.js';

const dummyHashes = new Map<number, string>();

/**
 * A hash of a random password at the configured cost, compared when the e-mail is unknown so
 * that answer takes as long as a wrong password for a real account.
 */
function dummyHash(cost: number): string {
  let hash = dummyHashes.get(cost);
  if (!hash) {
    hash = bcrypt.hashSync('no-such-account-placeholder', cost);
    dummyHashes.set(cost, hash);
  }
  return hash;
}

/** Fails with the same field message the sign-up form shows when the password is the e-mail. */
export function assertPasswordNotEmail(password: string, email: string, field = 'password'): void {
  if (passwordIsEmail(password, email)) throw new AppError(400, 'invalid_input', PASSWORD_IS_EMAIL, { [field]: PASSWORD_IS_EMAIL });
}

/** Creates an account; 409 with a field message when the e-mail is taken. */
export async function signUp(db: Database, input: SignUpInput, cost: number): Promise<User> {
  assertPasswordNotEmail(input.password, input.email);
  if (await findUserByEmail(db, input.email)) {
    throw new AppError(409, 'email_taken', 'An account with this e-mail already exists', {
      email: 'An account with this e-mail already exists',
    });
  }
  const passwordHash = await bcrypt.hash(input.password, cost);
  const id = await insertUser(db, { email: input.email, name: input.name, passwordHash });
  const user = await findUserById(db, id);
  if (!user) throw new Error('user vanished after insert');
  return user;
}

/** The user for these credentials, or a 401 that does not say which part was wrong. */
export async function verifyCredentials(db: Database, email: string, password: string, cost: number): Promise<User> {
  const found = await findUserByEmail(db, email);
  const ok = await bcrypt.compare(password, found?.passwordHash ?? dummyHash(cost));
  if (!found || !ok || found.disabled) {
    throw new AppError(401, 'invalid_credentials', 'E-mail or password is not right');
  }
  const { passwordHash: _hash, ...user } = found;
  return user;
}

/** Ends every session of the user by raising the token version. */
export async function endAllSessions(db: Database, userId: number): Promise<void> {
  await db
    .update(usersTable)
    .set({ tokenVersion: sql`${usersTable.tokenVersion} + 1` })
    .where(eq(usersTable.id, userId));
}

export async function updateProfile(db: Database, userId: number, name: string): Promise<User> {
  await updateUserName(db, userId, name);
  const user = await findUserById(db, userId);
  if (!user) throw notFound('Account not found');
  return user;
}

/**
 * Changes the password after checking the current one; raises the token version, so every
 * other session ends. Returns the user with the new version for a fresh cookie.
 */
export async function changePassword(
  db: Database,
  user: User,
  input: { currentPassword: string; newPassword: string },
  cost: number,
): Promise<User> {
  const hash = await findPasswordHash(db, user.id);
  if (!hash || !(await bcrypt.compare(input.currentPassword, hash))) {
    throw new AppError(400, 'invalid_input', 'Current password is not right', { currentPassword: 'Current password is not right' });
  }
  assertPasswordNotEmail(input.newPassword, user.email, 'newPassword');
  await setPasswordHash(db, user.id, await bcrypt.hash(input.newPassword, cost));
  const updated = await findUserById(db, user.id);
  if (!updated) throw notFound('Account not found');
  return updated;
}

export async function listAccounts(db: Database): Promise<UserListing[]> {
  return listUsersWithFarmCount(db);
}

/** Disables or re-enables another account (an administrator cannot lock themselves out). */
export async function setAccountDisabled(db: Database, admin: User, userId: number, disabled: boolean): Promise<User> {
  if (admin.id === userId) throw new AppError(400, 'invalid_input', 'You cannot disable your own account', { disabled: 'You cannot disable your own account' });
  const target = await findUserById(db, userId);
  if (!target) throw notFound('Account not found');
  await setUserDisabled(db, userId, disabled);
  return { ...target, disabled };
}
