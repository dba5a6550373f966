// Creating organizations and their first people is an operator's job (the demo seed, tests,
// a future admin console), not an API route. Each function is idempotent: it finds what
// exists by its natural key (slug, e-mail, membership) and creates only what is missing,
// with an audit event for everything it creates.
import type { Sequelize } from 'sequelize';
import type { Role } from '@biasproof/shared';
import { inTransaction } from '../db/transactions.ts';
import { appendAuditEvent, lockOrgChain } from '../audit/audit-log.ts';
import { createAccount, findAccountByEmail } from '../auth/accounts.ts';
import type { PasswordHasher } from '../auth/passwords.ts';
import { addMembership } from '../members/repository.ts';
import { createOrganization, findOrganizationBySlug } from './repository.ts';
import { toOrgTx } from './org-scope.ts';

export interface Provisioned {
  id: string;
  created: boolean;
}

export async function ensureOrganization(
  sequelize: Sequelize,
  org: { slug: string; name: string; timezone?: string },
): Promise<Provisioned> {
  return inTransaction(sequelize, 'system', async (tx) => {
    const existing = await findOrganizationBySlug(tx, org.slug);
    if (existing) return { id: existing.id, created: false };
    const row = await createOrganization(tx, org);
    await appendAuditEvent(tx, row.id, {
      actorUserId: null,
      action: 'organization.created',
      targetType: 'organization',
      targetId: row.id,
      details: { slug: row.slug, name: row.name, timezone: row.timezone },
    });
    return { id: row.id, created: true };
  });
}

export async function ensureAccount(
  sequelize: Sequelize,
  passwords: PasswordHasher,
  account: { email: string; name: string; password: string },
): Promise<Provisioned> {
  const email = account.email.toLowerCase();
  const existing = await inTransaction(sequelize, 'system', (tx) => findAccountByEmail(tx, email));
  if (existing) return { id: existing.id, created: false };
  const passwordHash = await passwords.hash(account.password);
  return inTransaction(sequelize, 'system', async (tx) => {
    const user = await createAccount(tx, { email, name: account.name, passwordHash });
    await appendAuditEvent(tx, null, {
      actorUserId: null,
      action: 'account.created',
      targetType: 'user',
      targetId: user.id,
      details: { email },
    });
    return { id: user.id, created: true };
  });
}

export async function ensureMembership(
  sequelize: Sequelize,
  orgId: string,
  userId: string,
  roles: Role[],
): Promise<Provisioned> {
  return inTransaction(sequelize, { orgId }, async (tx) => {
    await lockOrgChain(tx, orgId);
    const existing = await tx.models.Membership.findOne({
      where: { orgId, userId },
      transaction: tx.transaction,
    });
    if (existing) return { id: existing.id, created: false };
    const orgTx = toOrgTx(tx, orgId, () => null);
    const membership = await addMembership(orgTx, userId, roles);
    await orgTx.audit({
      action: 'member.added',
      targetType: 'user',
      targetId: userId,
      details: { roles },
    });
    return { id: membership.id, created: true };
  });
}
