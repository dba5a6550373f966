import type { z } from 'zod';
import type { passwordResetConfirmSchema, passwordResetRequestSchema } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { inTransaction } from '../db/transactions.ts';
import { appendAuditEvent } from '../audit/audit-log.ts';
import { passwordResetMail } from '../mail/messages.ts';
import { enqueueAccountMail } from '../outbox/outbox.ts';
import { dispatchSoon } from '../outbox/dispatcher.ts';
import type { Services } from '../services.ts';
import {
  closeOpenResets,
  createPasswordReset,
  endSessionsOfUser,
  findPasswordResetForUpdate,
  findUserByEmail,
  findUserById,
  updateUser,
} from './repository.ts';
import { hashToken, newLinkToken } from './tokens.ts';
import { clearThrottle } from './throttle-repository.ts';

export const PASSWORD_RESET_TTL_MS = 60 * 60 * 1000;

/**
 * Starts a reset for the address when it has an enabled account; does nothing visible
 * otherwise. The e-mail is written to the outbox with the token (a message with no
 * organization: the account is a person's, not an organization's) and sent after the commit
 * without being awaited, so the answer's timing and content do not tell whether the address
 * has an account.
 */
export async function requestPasswordReset(
  svc: Services,
  input: z.output<typeof passwordResetRequestSchema>,
): Promise<void> {
  const { token, tokenHash } = newLinkToken();
  const outboxIds = await inTransaction(svc.sequelize, 'system', async (tx) => {
    const found = await findUserByEmail(tx, input.email);
    if (!found || found.disabled) return [];
    await createPasswordReset(tx, {
      userId: found.id,
      tokenHash,
      expiresAt: new Date(Date.now() + PASSWORD_RESET_TTL_MS),
    });
    await appendAuditEvent(tx, null, {
      actorUserId: null,
      action: 'auth.password-reset-requested',
      targetType: 'user',
      targetId: found.id,
    });
    const link = `${svc.config.appUrl}/reset-password?token=${encodeURIComponent(token)}`;
    return enqueueAccountMail(tx, [
      {
        kind: 'account.password-reset',
        ...passwordResetMail({ to: found.email, name: found.name, link }),
      },
    ]);
  });
  dispatchSoon(svc, outboxIds);
}

/** Sets the new password with a valid, unused, unexpired token; voids the person's other reset links and ends all their sessions. */
export async function confirmPasswordReset(
  svc: Services,
  input: z.output<typeof passwordResetConfirmSchema>,
): Promise<void> {
  const passwordHash = await svc.passwords.hash(input.password);
  await inTransaction(svc.sequelize, 'system', async (tx) => {
    const reset = await findPasswordResetForUpdate(tx, hashToken(input.token));
    if (!reset)
      throw new AppError('reset-token-invalid', 'This reset link is not valid. Ask for a new one.');
    if (reset.usedAt)
      throw new AppError(
        'reset-token-used',
        'This reset link was already used. Ask for a new one.',
      );
    if (reset.expiresAt.getTime() <= Date.now()) {
      throw new AppError('reset-token-expired', 'This reset link has expired. Ask for a new one.');
    }
    const user = await findUserById(tx, reset.userId, { lock: true });
    if (!user || user.disabled)
      throw new AppError('reset-token-invalid', 'This reset link is not valid. Ask for a new one.');
    await updateUser(tx, user, { passwordHash });
    await closeOpenResets(tx, user.id, new Date());
    const ended = await endSessionsOfUser(tx, user.id);
    // Proving control of the mailbox lifts a lock that failed guesses put on the account.
    await clearThrottle(tx, `account:${user.email}`);
    await appendAuditEvent(tx, null, {
      actorUserId: user.id,
      action: 'auth.password-reset',
      targetType: 'user',
      targetId: user.id,
      details: { sessionsEnded: ended },
    });
  });
}
