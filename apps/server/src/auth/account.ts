import type { z } from 'zod';
import type {
  changePasswordRequestSchema,
  MeResponse,
  updateProfileRequestSchema,
} from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { inTransaction, type Tx } from '../db/transactions.ts';
import { appendAuditEvent } from '../audit/audit-log.ts';
import { listMembershipsOf } from '../orgs/organizations.ts';
import type { Services } from '../services.ts';
import { endSessionsOfUser, findUserById, updateUser } from './repository.ts';

async function meOf(tx: Tx, userId: string): Promise<MeResponse> {
  const user = await findUserById(tx, userId);
  if (!user) throw new AppError('unauthenticated', 'Please sign in.');
  return {
    user: { id: user.id, email: user.email, name: user.name },
    memberships: await listMembershipsOf(tx, userId),
  };
}

/** `GET /api/auth/me`: the person and the organizations they may use, with their roles in each. */
export async function getMe(svc: Services, userId: string): Promise<MeResponse> {
  return inTransaction(svc.sequelize, 'system', (tx) => meOf(tx, userId));
}

export async function updateProfile(
  svc: Services,
  userId: string,
  input: z.output<typeof updateProfileRequestSchema>,
): Promise<MeResponse> {
  return inTransaction(svc.sequelize, 'system', async (tx) => {
    const user = await findUserById(tx, userId, { lock: true });
    if (!user) throw new AppError('unauthenticated', 'Please sign in.');
    if (user.name !== input.name) {
      const from = user.name;
      await updateUser(tx, user, { name: input.name });
      await appendAuditEvent(tx, null, {
        actorUserId: userId,
        action: 'account.renamed',
        targetType: 'user',
        targetId: userId,
        details: { from, to: input.name },
      });
    }
    return meOf(tx, userId);
  });
}

/** Changes the password after checking the current one; ends the person's other sessions. */
export async function changePassword(
  svc: Services,
  userId: string,
  currentSessionId: string,
  input: z.output<typeof changePasswordRequestSchema>,
): Promise<void> {
  const user = await inTransaction(svc.sequelize, 'system', (tx) => findUserById(tx, userId));
  if (!user) throw new AppError('unauthenticated', 'Please sign in.');
  if (!(await svc.passwords.verify(user.passwordHash, input.currentPassword))) {
    throw new AppError('validation-failed', 'Some fields are not valid', {
      currentPassword: 'This is not your current password.',
    });
  }
  const passwordHash = await svc.passwords.hash(input.newPassword);
  await inTransaction(svc.sequelize, 'system', async (tx) => {
    const locked = await findUserById(tx, userId, { lock: true });
    if (!locked) throw new AppError('unauthenticated', 'Please sign in.');
    await updateUser(tx, locked, { passwordHash });
    const ended = await endSessionsOfUser(tx, userId, currentSessionId);
    await appendAuditEvent(tx, null, {
      actorUserId: userId,
      action: 'auth.password-changed',
      targetType: 'user',
      targetId: userId,
      details: { otherSessionsEnded: ended },
    });
  });
}
