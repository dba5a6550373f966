import { QueryTypes } from 'sequelize';
import type { Member, Role } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';
import type { MembershipRow } from '../db/models/membership.ts';

interface MemberRecord {
  user_id: string;
  email: string;
  name: string;
  roles: Role[];
  disabled: boolean;
  joined_at: Date;
}

const toMember = (r: MemberRecord): Member => ({
  userId: r.user_id,
  email: r.email,
  name: r.name,
  roles: r.roles,
  disabled: r.disabled,
  joinedAt: new Date(r.joined_at).toISOString(),
});

const memberSelect = `
  SELECT m.user_id, u.email, u.name, m.roles, (m.disabled OR u.disabled) AS disabled, m.created_at AS joined_at
    FROM memberships m JOIN users u ON u.id = m.user_id
   WHERE m.org_id = $1`;

export async function listMembers(tx: OrgTx): Promise<Member[]> {
  const rows = await tx.sequelize.query<MemberRecord>(`${memberSelect} ORDER BY u.name, u.email`, {
    bind: [tx.orgId],
    transaction: tx.transaction,
    type: QueryTypes.SELECT,
  });
  return rows.map(toMember);
}

export async function readMember(tx: OrgTx, userId: string): Promise<Member | null> {
  const [row] = await tx.sequelize.query<MemberRecord>(`${memberSelect} AND m.user_id = $2`, {
    bind: [tx.orgId, userId],
    transaction: tx.transaction,
    type: QueryTypes.SELECT,
  });
  return row ? toMember(row) : null;
}

export async function findMembershipForUpdate(
  tx: OrgTx,
  userId: string,
): Promise<MembershipRow | null> {
  return tx.models.Membership.findOne({
    where: { orgId: tx.orgId, userId },
    transaction: tx.transaction,
    lock: true,
  });
}

export async function saveMembership(
  tx: OrgTx,
  membership: MembershipRow,
  changes: Partial<Pick<MembershipRow, 'roles' | 'disabled'>>,
): Promise<void> {
  await membership.update(changes, { transaction: tx.transaction });
}

export async function deleteMembership(tx: OrgTx, membership: MembershipRow): Promise<void> {
  await tx.models.Membership.destroy({
    where: { id: membership.id, orgId: tx.orgId },
    transaction: tx.transaction,
  });
}

/** Admins who can still act: enabled membership with the admin role, enabled account. */
export async function countActiveAdmins(tx: OrgTx): Promise<number> {
  const [row] = await tx.sequelize.query<{ n: string }>(
    `SELECT count(*) AS n FROM memberships m JOIN users u ON u.id = m.user_id
      WHERE m.org_id = $1 AND 'admin' = ANY (m.roles) AND NOT m.disabled AND NOT u.disabled`,
    { bind: [tx.orgId], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return Number(row?.n ?? 0);
}

export async function isMemberByEmail(tx: OrgTx, email: string): Promise<boolean> {
  const [row] = await tx.sequelize.query<{ one: number }>(
    `SELECT 1 AS one FROM memberships m JOIN users u ON u.id = m.user_id
      WHERE m.org_id = $1 AND lower(u.email) = lower($2)`,
    { bind: [tx.orgId, email], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return Boolean(row);
}

export async function addMembership(
  tx: OrgTx,
  userId: string,
  roles: Role[],
): Promise<MembershipRow> {
  return tx.models.Membership.create(
    { orgId: tx.orgId, userId, roles },
    { transaction: tx.transaction },
  );
}
