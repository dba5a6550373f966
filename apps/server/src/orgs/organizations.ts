import type { MembershipSummary, Organization } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { Tx } from '../db/transactions.ts';
import type { OrgContext } from './org-scope.ts';
import { findOrganization, membershipSummariesOf } from './repository.ts';

export async function getOrganization(org: OrgContext): Promise<Organization> {
  const row = await org.read((tx) => findOrganization(tx, tx.orgId));
  if (!row) throw new AppError('not-found', 'No such organization');
  return { id: row.id, slug: row.slug, name: row.name, timezone: row.timezone };
}

/** The organizations a person may switch between (for `GET /api/auth/me`); runs in the caller's system-scope transaction. */
export async function listMembershipsOf(tx: Tx, userId: string): Promise<MembershipSummary[]> {
  return membershipSummariesOf(tx, userId);
}
