import type { z } from 'zod';
import type { createInvitationRequestSchema, Invitation } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import { invitationMail } from '../mail/messages.ts';
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
 * Sends the invitation e-mail inside the transaction that stores the token: when the mail
 * server refuses it, nothing is stored and the admin is told to try again.
 */
async function sendInvitation(
  svc: Services,
  tx: OrgTx,
  row: InvitationRow,
  token: string,
): Promise<void> {
  // One connection per transaction: queries run one after another.
  const org = await findOrganization(tx, tx.orgId);
  const inviter = await findAccount(tx, row.invitedByUserId);
  try {
    await svc.mailer.send(
      invitationMail({
        to: row.email,
        orgName: org?.name ?? 'an organization',
        invitedByName: inviter?.name ?? 'An admin',
        roles: row.roles,
        link: `${svc.config.appUrl}/invitations/${token}`,
        expiresAt: row.expiresAt,
      }),
    );
  } catch (err) {
    throw new AppError(
      'unavailable',
      'The invitation e-mail could not be sent; nothing was saved. Try again shortly.',
      undefined,
      {
        cause: err,
      },
    );
  }
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
  return org.write(async (tx) => {
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
    await sendInvitation(svc, tx, row, token);
    return readBack(tx, row.id);
  });
}

/** A new token (the old link stops working), a new 7-day expiry and a new e-mail. */
export async function resendInvitation(
  svc: Services,
  org: OrgContext,
  id: string,
): Promise<Invitation> {
  return org.write(async (tx) => {
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
    await sendInvitation(svc, tx, row, token);
    return readBack(tx, row.id);
  });
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
