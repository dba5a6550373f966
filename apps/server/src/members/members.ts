import type { z } from 'zod';
import { subject, type Member, type updateMemberRequestSchema } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import {
  countActiveAdmins,
  deleteMembership,
  findMembershipForUpdate,
  listMembers as listMemberRows,
  readMember,
  saveMembership,
} from './repository.ts';

const noSuchMember = () => new AppError('not-found', 'No such member in this organization');

export async function listMembers(org: OrgContext): Promise<{ items: Member[]; total: number }> {
  const items = await org.read((tx) => listMemberRows(tx));
  return { items, total: items.length };
}

async function lockedTarget(
  org: OrgContext,
  tx: OrgTx,
  userId: string,
  action: 'update' | 'delete',
) {
  const membership = await findMembershipForUpdate(tx, userId);
  if (!membership) throw noSuchMember();
  if (
    !org.ability.can(
      action,
      subject('Member', { userId: membership.userId, roles: [...membership.roles] }),
    )
  ) {
    throw new AppError('forbidden', 'You cannot change your own membership; ask another admin.');
  }
  return membership;
}

async function assertAdminRemains(tx: OrgTx): Promise<void> {
  if ((await countActiveAdmins(tx)) === 0) {
    throw new AppError('last-admin', 'The organization needs at least one active admin.');
  }
}

/** Replaces a member's roles and/or disables or enables them; one audit event per request that changes something. */
export async function updateMember(
  org: OrgContext,
  userId: string,
  input: z.output<typeof updateMemberRequestSchema>,
): Promise<Member> {
  return org.write(async (tx) => {
    const membership = await lockedTarget(org, tx, userId, 'update');
    const before = { roles: [...membership.roles], disabled: membership.disabled };
    const roles = input.roles ?? before.roles;
    const disabled = input.disabled ?? before.disabled;
    const rolesChanged = roles.join(',') !== before.roles.join(',');
    const disabledChanged = disabled !== before.disabled;
    if (rolesChanged || disabledChanged) {
      await saveMembership(tx, membership, { roles, disabled });
      await assertAdminRemains(tx);
      const action =
        rolesChanged && disabledChanged
          ? 'member.updated'
          : rolesChanged
            ? 'member.roles-changed'
            : disabled
              ? 'member.disabled'
              : 'member.enabled';
      await tx.audit({
        action,
        targetType: 'user',
        targetId: userId,
        details: {
          ...(rolesChanged ? { rolesBefore: before.roles, roles } : {}),
          ...(disabledChanged ? { disabled } : {}),
        },
      });
    }
    const member = await readMember(tx, userId);
    if (!member) throw noSuchMember();
    return member;
  });
}

export async function removeMember(org: OrgContext, userId: string): Promise<void> {
  await org.write(async (tx) => {
    const membership = await lockedTarget(org, tx, userId, 'delete');
    const member = await readMember(tx, userId);
    await deleteMembership(tx, membership);
    await assertAdminRemains(tx);
    await tx.audit({
      action: 'member.removed',
      targetType: 'user',
      targetId: userId,
      details: { email: member?.email, roles: [...membership.roles] },
    });
  });
}
