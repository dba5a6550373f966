import { Op, QueryTypes } from 'sequelize';
import type { Tx } from '../db/transactions.ts';
import type { UserRow } from '../db/models/user.ts';

export async function findUserByEmail(tx: Tx, email: string): Promise<UserRow | null> {
  return tx.models.User.findOne({
    where: tx.sequelize.where(
      tx.sequelize.fn('lower', tx.sequelize.col('email')),
      email.toLowerCase(),
    ),
    transaction: tx.transaction,
  });
}

export async function findUserById(
  tx: Tx,
  id: string,
  options: { lock?: boolean } = {},
): Promise<UserRow | null> {
  return tx.models.User.findByPk(id, { transaction: tx.transaction, lock: options.lock ?? false });
}

export async function createUser(
  tx: Tx,
  user: { email: string; name: string; passwordHash: string },
): Promise<UserRow> {
  return tx.models.User.create(
    { ...user, email: user.email.toLowerCase() },
    { transaction: tx.transaction },
  );
}

export async function updateUser(
  tx: Tx,
  user: UserRow,
  changes: Partial<Pick<UserRow, 'name' | 'passwordHash'>>,
): Promise<void> {
  await user.update(changes, { transaction: tx.transaction });
}

/** Deletes the stored sessions of one person (all of them, or all but `exceptSid`); returns how many. */
export async function endSessionsOfUser(
  tx: Tx,
  userId: string,
  exceptSid?: string,
): Promise<number> {
  const ended = await tx.sequelize.query<{ sid: string }>(
    `DELETE FROM "session" WHERE sess ->> 'userId' = $1 AND ($2::text IS NULL OR sid <> $2) RETURNING sid`,
    { bind: [userId, exceptSid ?? null], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return ended.length;
}

export async function createPasswordReset(
  tx: Tx,
  reset: { userId: string; tokenHash: string; expiresAt: Date },
): Promise<void> {
  await tx.models.PasswordReset.create(reset, { transaction: tx.transaction });
}

export async function findPasswordResetForUpdate(tx: Tx, tokenHash: string) {
  return tx.models.PasswordReset.findOne({
    where: { tokenHash },
    transaction: tx.transaction,
    lock: true,
  });
}

/** Marks every unused reset of a person used, so one successful reset voids the older links. */
export async function closeOpenResets(tx: Tx, userId: string, at: Date): Promise<void> {
  await tx.models.PasswordReset.update(
    { usedAt: at },
    { where: { userId, usedAt: { [Op.is]: null } }, transaction: tx.transaction },
  );
}
