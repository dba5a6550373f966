import { QueryTypes } from 'sequelize';
import type { MembershipSummary, Role } from '@biasproof/shared';
import type { Tx } from '../db/transactions.ts';
import type { OrganizationRow } from '../db/models/organization.ts';

export async function findOrganization(tx: Tx, orgId: string): Promise<OrganizationRow | null> {
  return tx.models.Organization.findByPk(orgId, { transaction: tx.transaction });
}

export async function findOrganizationBySlug(
  tx: Tx,
  slug: string,
): Promise<OrganizationRow | null> {
  return tx.models.Organization.findOne({ where: { slug }, transaction: tx.transaction });
}

export async function createOrganization(
  tx: Tx,
  org: { slug: string; name: string; timezone?: string },
): Promise<OrganizationRow> {
  return tx.models.Organization.create(org, { transaction: tx.transaction });
}

/**
 * The roles of a person in an organization, or null when they have no membership there, or
 * theirs or their account is disabled: for the rest of the API, the organization then does not exist.
 */
export async function activeRolesIn(tx: Tx, orgId: string, userId: string): Promise<Role[] | null> {
  const [row] = await tx.sequelize.query<{ roles: Role[] }>(
    `SELECT m.roles FROM memberships m JOIN users u ON u.id = m.user_id
      WHERE m.org_id = $1 AND m.user_id = $2 AND NOT m.disabled AND NOT u.disabled`,
    { bind: [orgId, userId], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return row ? row.roles : null;
}

/** The organizations a person may use, by name. */
export async function membershipSummariesOf(tx: Tx, userId: string): Promise<MembershipSummary[]> {
  const rows = await tx.sequelize.query<{
    org_id: string;
    slug: string;
    name: string;
    roles: Role[];
  }>(
    `SELECT o.id AS org_id, o.slug, o.name, m.roles
       FROM memberships m JOIN organizations o ON o.id = m.org_id
      WHERE m.user_id = $1 AND NOT m.disabled
      ORDER BY o.name, o.slug`,
    { bind: [userId], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return rows.map((r) => ({ orgId: r.org_id, orgSlug: r.slug, orgName: r.name, roles: r.roles }));
}
