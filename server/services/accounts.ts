/** Sign-up and sign-in: the account rules, independent of HTTP. */
import bcrypt from 'bcryptjs';
import { eq, sql } from 'drizzle-orm';
import type { SignUpInput } from '../../shared/schema/accounts.js';
import type { Database } from '../db/client.js';
import { findUserByEmail, insertUser, type User, findUserById } from '../db/repositories/users.js';
import { usersTable } from '../db/schema/index.js';
import { AppError } from '../errors.js';

// A hash of a random password, compared when the e-mail is unknown so both answers take as long.
const DUMMY_HASH = bcrypt.hashSync('no-such-account-placeholder', 12);

export async function signUp(db: Database, input: SignUpInput, cost: number): Promise<User> {
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
export async function verifyCredentials(db: Database, email: string, password: string): Promise<User> {
  const found = await findUserByEmail(db, email);
  const ok = await bcrypt.compare(password, found?.passwordHash ?? DUMMY_HASH);
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
