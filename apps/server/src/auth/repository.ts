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

export interface MailPreferenceRow {
  delivery: 'immediate' | 'daily-digest';
  digest_hour_utc: number;
}

export async function findMailPreference(
  tx: Tx,
  userId: string,
  options: { lock?: boolean } = {},
): Promise<MailPreferenceRow | null> {
  const [row] = await tx.sequelize.query<MailPreferenceRow>(
    `SELECT delivery, digest_hour_utc FROM mail_preferences WHERE user_id = $1${options.lock ? ' FOR UPDATE' : ''}`,
    { bind: [userId], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return row ?? null;
}

export async function saveMailPreference(
  tx: Tx,
  userId: string,
  preference: MailPreferenceRow,
): Promise<void> {
  await tx.sequelize.query(
    `INSERT INTO mail_preferences (user_id, delivery, digest_hour_utc) VALUES ($1, $2, $3)
     ON CONFLICT (user_id) DO UPDATE
       SET delivery = EXCLUDED.delivery, digest_hour_utc = EXCLUDED.digest_hour_utc, updated_at = now()`,
    {
      bind: [userId, preference.delivery, preference.digest_hour_utc],
      transaction: tx.transaction,
    },
  );
}
