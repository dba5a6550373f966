import type { z } from 'zod';
import type { acceptInvitationNewAccountSchema, invitationPreviewSchema } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { inTransaction } from '../db/transactions.ts';
import { lockOrgChain } from '../audit/audit-log.ts';
import { hashToken } from '../auth/tokens.ts';
import { createAccount, findAccount, findAccountByEmail } from '../auth/accounts.ts';
import { findOrganization } from '../orgs/repository.ts';
import { toOrgTx } from '../orgs/org-scope.ts';
import { addMembership, isMemberByEmail } from '../members/repository.ts';
import type { Services } from '../services.ts';
import type { InvitationRow } from '../db/models/invitation.ts';
import { findByTokenHash, saveInvitation, statusOf } from './repository.ts';

const unknownInvitation = () => new AppError('not-found', 'This invitation link is not valid.');

function assertOpen(row: InvitationRow): void {
  const status = statusOf(row);
  if (status === 'accepted')
    throw new AppError('invitation-used', 'This invitation was already accepted.');
  if (status === 'revoked')
    throw new AppError('invitation-revoked', 'This invitation was withdrawn by an admin.');
  if (status === 'expired')
    throw new AppError(
      'invitation-expired',
      'This invitation has expired; ask an admin to send a new one.',
    );
}

/** `GET /api/invitations/:token`: what the invitee is joining, and whether they already have an account. */
export async function previewInvitation(
  svc: Services,
  token: string,
): Promise<z.infer<typeof invitationPreviewSchema>> {
  return inTransaction(svc.sequelize, 'system', async (tx) => {
    const row = await findByTokenHash(tx, hashToken(token));
    if (!row) throw unknownInvitation();
    assertOpen(row);
    const org = await findOrganization(tx, row.orgId);
    const inviter = await findAccount(tx, row.invitedByUserId);
    const account = await findAccountByEmail(tx, row.email);
    return {
      orgName: org?.name ?? '',
      email: row.email,
      roles: row.roles,
      invitedByName: inviter?.name ?? '',
      accountExists: Boolean(account),
      expiresAt: row.expiresAt.toISOString(),
    };
  });
}

export type Acceptance =
  | { kind: 'new-account'; account: z.output<typeof acceptInvitationNewAccountSchema> }
  | { kind: 'existing-account'; signedInUserId: string | null };

/**
 * Joins the invited organization: a new person with the account they create here, or the
 * signed-in person whose e-mail was invited. Returns the person's id and whether the account is new.
 */
export async function acceptInvitation(
  svc: Services,
  token: string,
  acceptance: Acceptance,
): Promise<{ userId: string; newAccount: boolean }> {
  const tokenHash = hashToken(token);
  const found = await inTransaction(svc.sequelize, 'system', (tx) =>
    findByTokenHash(tx, tokenHash),
  );
  if (!found) throw unknownInvitation();
  if (acceptance.kind === 'existing-account' && !acceptance.signedInUserId) {
    throw new AppError(
      'unauthenticated',
      'Sign in with the invited e-mail address to accept, or create an account.',
    );
  }
  const passwordHash =
    acceptance.kind === 'new-account'
      ? await svc.passwords.hash(acceptance.account.password)
      : null;
  const orgId = found.orgId;

  return inTransaction(svc.sequelize, { orgId }, async (tx) => {
    // Same lock order as the admin screens (organization first, then the invitation row).
    await lockOrgChain(tx, orgId);
    const row = await findByTokenHash(tx, tokenHash, { lock: true });
    if (!row) throw unknownInvitation();
    assertOpen(row);

    let userId = '';
    if (acceptance.kind === 'new-account') {
      if (await findAccountByEmail(tx, row.email)) {
        throw new AppError(
          'account-exists',
          'An account with this e-mail exists: sign in, then accept the invitation.',
        );
      }
      const user = await createAccount(tx, {
        email: row.email,
        name: acceptance.account.name,
        passwordHash: passwordHash ?? '',
      });
      userId = user.id;
    } else {
      const user = await findAccount(tx, acceptance.signedInUserId ?? '');
      if (!user || user.disabled) throw new AppError('unauthenticated', 'Please sign in.');
      if (user.email.toLowerCase() !== row.email) {
        throw new AppError(
          'wrong-account',
          `This invitation is for ${row.email}; sign in with that address to accept it.`,
        );
      }
      userId = user.id;
    }

    const orgTx = toOrgTx(tx, orgId, () => userId);
    if (await isMemberByEmail(orgTx, row.email)) {
      throw new AppError('already-member', 'You are already a member of this organization.');
    }
    await addMembership(orgTx, userId, row.roles);
    await saveInvitation(tx, row, { acceptedAt: new Date(), acceptedByUserId: userId });
    await orgTx.audit({
      action: 'invitation.accepted',
      targetType: 'invitation',
      targetId: row.id,
      details: {
        email: row.email,
        roles: row.roles,
        userId,
        newAccount: acceptance.kind === 'new-account',
      },
    });
    return { userId, newAccount: acceptance.kind === 'new-account' };
  });
}
