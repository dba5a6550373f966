import type { z } from 'zod';
import type { createInvitationRequestSchema, Invitation } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { invitationMail } from '../mail/messages.ts';
import { enqueueMail } from '../outbox/outbox.ts';
import { dispatchSoon } from '../outbox/dispatcher.ts';
import { newLinkToken } from '../auth/tokens.ts';
import { findAccount } from '../auth/accounts.ts';
import { findOrganization } from '../orgs/repository.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import { isMemberByEmail } from '../members/repository.ts';
import type { Services } from '../services.ts';
import type { InvitationRow } from '../db/models/invitation.ts';
import {
  createInvitation,
  findInvitationForUpdate,
  findPendingFor,
  listInvitations as listInvitationRows,
  readInvitation,
  saveInvitation,
  statusOf,
} from './repository.ts';

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

const noSuchInvitation = () => new AppError('not-found', 'No such invitation in this organization');

export async function listInvitations(
  org: OrgContext,
  status: 'pending' | 'all',
): Promise<{ items: Invitation[]; total: number }> {
  const items = await org.read((tx) => listInvitationRows(tx, status));
  return { items, total: items.length };
}

/**
 * Writes the invitation e-mail to the outbox in the transaction that stores the token, so the
 * message exists exactly when the invitation does; it is sent right after the commit
 * (`dispatchSoon`) and retried by the dispatcher while the mail server is away.
 */
async function queueInvitation(
  svc: Services,
  tx: OrgTx,
  row: InvitationRow,
  token: string,
  kind: 'invitation.created' | 'invitation.resent',
): Promise<string[]> {
  // One connection per transaction: queries run one after another.
  const org = await findOrganization(tx, tx.orgId);
  const inviter = await findAccount(tx, row.invitedByUserId);
  const mail = invitationMail({
    to: row.email,
    orgName: org?.name ?? 'an organization',
    invitedByName: inviter?.name ?? 'An admin',
    roles: row.roles,
    link: `${svc.config.appUrl}/invitations/${token}`,
    expiresAt: row.expiresAt,
  });
  return enqueueMail(tx, [{ kind, ...mail }]);
}

async function readBack(tx: OrgTx, id: string): Promise<Invitation> {
  const invitation = await readInvitation(tx, id);
  if (!invitation) throw noSuchInvitation();
  return invitation;
}

export async function inviteMember(
  svc: Services,
  org: OrgContext,
  input: z.output<typeof createInvitationRequestSchema>,
): Promise<Invitation> {
  const { invitation, outboxIds } = await org.write(async (tx) => {
    if (await isMemberByEmail(tx, input.email)) {
      throw new AppError(
        'already-member',
        `${input.email} is already a member of this organization.`,
      );
    }
    if (await findPendingFor(tx, input.email)) {
      throw new AppError(
        'invitation-pending',
        `${input.email} already has a pending invitation; resend or revoke it.`,
      );
    }
    const { token, tokenHash } = newLinkToken();
    const row = await createInvitation(tx, {
      email: input.email,
      roles: input.roles,
      tokenHash,
      invitedByUserId: org.actor.userId,
      expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
    });
    await tx.audit({
      action: 'invitation.created',
      targetType: 'invitation',
      targetId: row.id,
      details: { email: input.email, roles: input.roles },
    });
    const outboxIds = await queueInvitation(svc, tx, row, token, 'invitation.created');
    return { invitation: await readBack(tx, row.id), outboxIds };
  });
  dispatchSoon(svc, outboxIds);
  return invitation;
}

/** A new token (the old link stops working), a new 7-day expiry and a new e-mail. */
export async function resendInvitation(
  svc: Services,
  org: OrgContext,
  id: string,
): Promise<Invitation> {
  const { invitation, outboxIds } = await org.write(async (tx) => {
    const row = await findInvitationForUpdate(tx, id);
    if (!row) throw noSuchInvitation();
    const status = statusOf(row);
    if (status === 'accepted' || status === 'revoked') {
      throw new AppError('conflict', `This invitation was ${status}; it cannot be sent again.`);
    }
    const { token, tokenHash } = newLinkToken();
    await saveInvitation(tx, row, {
      tokenHash,
      expiresAt: new Date(Date.now() + INVITATION_TTL_MS),
    });
    await tx.audit({
      action: 'invitation.resent',
      targetType: 'invitation',
      targetId: row.id,
      details: { email: row.email },
    });
    const outboxIds = await queueInvitation(svc, tx, row, token, 'invitation.resent');
    return { invitation: await readBack(tx, row.id), outboxIds };
  });
  dispatchSoon(svc, outboxIds);
  return invitation;
}

export async function revokeInvitation(org: OrgContext, id: string): Promise<void> {
  await org.write(async (tx) => {
    const row = await findInvitationForUpdate(tx, id);
    if (!row) throw noSuchInvitation();
    const status = statusOf(row);
    if (status === 'accepted')
      throw new AppError(
        'conflict',
        'This invitation was already accepted; remove the member instead.',
      );
    if (status === 'revoked') return;
    await saveInvitation(tx, row, { revokedAt: new Date() });
    await tx.audit({
      action: 'invitation.revoked',
      targetType: 'invitation',
      targetId: row.id,
      details: { email: row.email },
    });
  });
}
