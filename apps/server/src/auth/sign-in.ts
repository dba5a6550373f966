import type { SignInRequest } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { inTransaction, type Tx } from '../db/transactions.ts';
import { appendAuditEvent } from '../audit/audit-log.ts';
import type { Services } from '../services.ts';
import { findUserByEmail, updateUser } from './repository.ts';
import { clearThrottle, lockedKeys, recordFailure } from './throttle-repository.ts';

const invalidCredentials = () =>
  new AppError('invalid-credentials', 'The e-mail address or password is not right.');

function lockedError(until: Date): AppError {
  const minutes = Math.max(1, Math.ceil((until.getTime() - Date.now()) / 60_000));
  return new AppError(
    'locked',
    `Too many failed sign-ins. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`,
  );
}

/**
 * Checks an e-mail and password, counting failures per account and per client address; a key
 * that reaches its limit is locked for a while (audited). Unknown e-mails spend the time of a
 * real verification and get the same answer as wrong passwords. Returns the person's id.
 */
export async function signIn(svc: Services, input: SignInRequest, ip: string): Promise<string> {
  const email = input.email.toLowerCase();
  const accountKey = `account:${email}`;
  const ipKey = `ip:${ip}`;
  const { sequelize, passwords, config } = svc;

  const locks = await inTransaction(sequelize, 'system', (tx) =>
    lockedKeys(tx, [accountKey, ipKey], new Date()),
  );
  const lock = locks.sort((a, b) => b.lockedUntil.getTime() - a.lockedUntil.getTime())[0];
  if (lock) throw lockedError(lock.lockedUntil);

  const user = await inTransaction(sequelize, 'system', (tx) => findUserByEmail(tx, email));
  const passwordOk = user ? await passwords.verify(user.passwordHash, input.password) : false;
  if (!user) await passwords.verifyDummy(input.password);

  if (!user || !passwordOk || user.disabled) {
    await inTransaction(sequelize, 'system', async (tx) => {
      const now = new Date();
      const { maxFailures, maxFailuresPerIp, windowMs, lockMs } = config.signInThrottle;
      const account = await recordFailure(tx, accountKey, { maxFailures, windowMs, lockMs }, now);
      const client = await recordFailure(
        tx,
        ipKey,
        { maxFailures: maxFailuresPerIp, windowMs, lockMs },
        now,
      );
      if (account.lockedUntil)
        await auditLock(tx, {
          scope: 'account',
          email,
          userId: user?.id ?? null,
          ip,
          until: account.lockedUntil,
        });
      if (client.lockedUntil)
        await auditLock(tx, { scope: 'ip', email, userId: null, ip, until: client.lockedUntil });
    });
    throw invalidCredentials();
  }

  const rehash = passwords.needsRehash(user.passwordHash)
    ? await passwords.hash(input.password)
    : null;
  await inTransaction(sequelize, 'system', async (tx) => {
    await clearThrottle(tx, accountKey);
    if (rehash) await updateUser(tx, user, { passwordHash: rehash });
    await appendAuditEvent(tx, null, {
      actorUserId: user.id,
      action: 'auth.signed-in',
      targetType: 'user',
      targetId: user.id,
      details: { ip },
    });
  });
  return user.id;
}

async function auditLock(
  tx: Tx,
  lock: { scope: 'account' | 'ip'; email: string; userId: string | null; ip: string; until: Date },
): Promise<void> {
  const target =
    lock.scope === 'ip'
      ? { targetType: 'ip', targetId: lock.ip }
      : lock.userId
        ? { targetType: 'user', targetId: lock.userId }
        : { targetType: 'account', targetId: null };
  await appendAuditEvent(tx, null, {
    actorUserId: null,
    action: 'auth.locked',
    ...target,
    details: { scope: lock.scope, email: lock.email, ip: lock.ip, until: lock.until.toISOString() },
  });
}

export async function auditSignOut(svc: Services, userId: string): Promise<void> {
  await inTransaction(svc.sequelize, 'system', (tx) =>
    appendAuditEvent(tx, null, {
      actorUserId: userId,
      action: 'auth.signed-out',
      targetType: 'user',
      targetId: userId,
    }),
  );
}
