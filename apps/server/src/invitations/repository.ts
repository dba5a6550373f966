import { Op, QueryTypes } from 'sequelize';
import type { Invitation, Role } from '@biasproof/shared';
import type { Tx } from '../db/transactions.ts';
import type { OrgTx } from '../orgs/org-scope.ts';
import type { InvitationRow } from '../db/models/invitation.ts';

export type InvitationStatus = Invitation['status'];

export function statusOf(
  row: Pick<InvitationRow, 'acceptedAt' | 'revokedAt' | 'expiresAt'>,
  now = new Date(),
): InvitationStatus {
  if (row.acceptedAt) return 'accepted';
  if (row.revokedAt) return 'revoked';
  if (new Date(row.expiresAt) <= now) return 'expired';
  return 'pending';
}

interface InvitationRecord {
  id: string;
  email: string;
  roles: Role[];
  invited_by_user_id: string;
  invited_by_name: string;
  created_at: Date;
  expires_at: Date;
  accepted_at: Date | null;
  revoked_at: Date | null;
}

const invitationSelect = `
  SELECT i.id, i.email, i.roles, i.invited_by_user_id, u.name AS invited_by_name, i.created_at, i.expires_at,
         i.accepted_at, i.revoked_at
    FROM invitations i JOIN users u ON u.id = i.invited_by_user_id
   WHERE i.org_id = $1`;

function toInvitation(r: InvitationRecord): Invitation {
  return {
    id: r.id,
    email: r.email,
    roles: r.roles,
    invitedBy: { id: r.invited_by_user_id, name: r.invited_by_name },
    createdAt: new Date(r.created_at).toISOString(),
    expiresAt: new Date(r.expires_at).toISOString(),
    status: statusOf({
      acceptedAt: r.accepted_at,
      revokedAt: r.revoked_at,
      expiresAt: r.expires_at,
    }),
  };
}

/** Newest first; `pending` keeps only the ones that can still be accepted. */
export async function listInvitations(tx: OrgTx, status: 'pending' | 'all'): Promise<Invitation[]> {
  const pendingOnly =
    status === 'pending'
      ? ' AND i.accepted_at IS NULL AND i.revoked_at IS NULL AND i.expires_at > now()'
      : '';
  const rows = await tx.sequelize.query<InvitationRecord>(
    `${invitationSelect}${pendingOnly} ORDER BY i.created_at DESC`,
    {
      bind: [tx.orgId],
      transaction: tx.transaction,
      type: QueryTypes.SELECT,
    },
  );
  return rows.map(toInvitation);
}

export async function readInvitation(tx: OrgTx, id: string): Promise<Invitation | null> {
  const [row] = await tx.sequelize.query<InvitationRecord>(`${invitationSelect} AND i.id = $2`, {
    bind: [tx.orgId, id],
    transaction: tx.transaction,
    type: QueryTypes.SELECT,
  });
  return row ? toInvitation(row) : null;
}

export async function findInvitationForUpdate(
  tx: OrgTx,
  id: string,
): Promise<InvitationRow | null> {
  return tx.models.Invitation.findOne({
    where: { id, orgId: tx.orgId },
    transaction: tx.transaction,
    lock: true,
  });
}

/** An invitation to this address that can still be accepted. */
export async function findPendingFor(tx: OrgTx, email: string): Promise<InvitationRow | null> {
  return tx.models.Invitation.findOne({
    where: {
      orgId: tx.orgId,
      email,
      acceptedAt: null,
      revokedAt: null,
      expiresAt: { [Op.gt]: new Date() },
    },
    transaction: tx.transaction,
  });
}

export async function createInvitation(
  tx: OrgTx,
  invitation: {
    email: string;
    roles: Role[];
    tokenHash: string;
    invitedByUserId: string;
    expiresAt: Date;
  },
): Promise<InvitationRow> {
  return tx.models.Invitation.create(
    { ...invitation, orgId: tx.orgId },
    { transaction: tx.transaction },
  );
}

export async function saveInvitation(
  tx: Tx,
  row: InvitationRow,
  changes: Partial<
    Pick<InvitationRow, 'tokenHash' | 'expiresAt' | 'revokedAt' | 'acceptedAt' | 'acceptedByUserId'>
  >,
): Promise<void> {
  await row.update(changes, { transaction: tx.transaction });
}

/** The invitation a link token names, in any organization (the token is the only key the invitee has). */
export async function findByTokenHash(
  tx: Tx,
  tokenHash: string,
  options: { lock?: boolean } = {},
): Promise<InvitationRow | null> {
  return tx.models.Invitation.findOne({
    where: { tokenHash },
    transaction: tx.transaction,
    lock: options.lock ?? false,
  });
}
