/**
 * Password reset by e-mail: a request mails a single-use link valid for one hour (only its hash
 * is stored); using it sets the new password and raises the token version, ending every session.
 * The request answers the same whether or not the address has an account.
 */
import bcrypt from 'bcryptjs';
import { hashToken, newEmailToken } from '../auth/tokens.js';
import type { Database } from '../db/client.js';
import {
  claimPasswordReset,
  closeOpenPasswordResets,
  findPasswordResetByHash,
  findUserByEmail,
  findUserById,
  insertPasswordReset,
  setPasswordHash,
} from '../db/repositories/users.js';
import { AppError } from '../errors.js';
import type { Mailer } from '../mail/mailer.js';
import { passwordResetMail } from '../mail/templates.js';
import { assertPasswordNotEmail } from './accounts.js';

/** Lifetime of a reset link, milliseconds (one hour). */
export const RESET_LIFETIME_MS = 60 * 60 * 1000;

export const invalidResetLink = () =>
  new AppError(400, 'invalid_token', 'This reset link is not valid any more. Ask for a new one.', {
    token: 'This reset link is not valid any more. Ask for a new one.',
  });

/** Mails a reset link when the address has an enabled account; does nothing visible otherwise. */
export async function requestPasswordReset(
  db: Database,
  mailer: Mailer,
  appOrigin: string,
  email: string,
  now = new Date(),
): Promise<void> {
  const user = await findUserByEmail(db, email);
  if (!user || user.disabled) return;
  const { token, hash } = newEmailToken();
  await insertPasswordReset(db, { userId: user.id, tokenHash: hash, expiresAt: new Date(now.getTime() + RESET_LIFETIME_MS) });
  const link = `${appOrigin}/reset-password?token=${encodeURIComponent(token)}`;
  await mailer.send(passwordResetMail({ to: user.email, name: user.name, link }));
}

/** Sets the new password for a valid, unused, unexpired token; every session of the user ends. */
export async function completePasswordReset(
  db: Database,
  input: { token: string; password: string },
  cost: number,
  now = new Date(),
): Promise<void> {
  const reset = await findPasswordResetByHash(db, hashToken(input.token));
  if (!reset || reset.usedAt || reset.expiresAt.getTime() <= now.getTime()) throw invalidResetLink();
  const user = await findUserById(db, reset.userId);
  if (!user || user.disabled) throw invalidResetLink();
  assertPasswordNotEmail(input.password, user.email);
  const passwordHash = await bcrypt.hash(input.password, cost);
  // One transaction: a crash between the steps must not leave the link used and the password unchanged.
  await db.transaction(async (tx) => {
    if (!(await claimPasswordReset(tx, reset.id, now))) throw invalidResetLink();
    await setPasswordHash(tx, user.id, passwordHash);
    await closeOpenPasswordResets(tx, user.id, now);
  });
}
