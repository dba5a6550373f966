import type { MeResponse } from '@biasproof/shared';
import type { InvitationPreview } from '@/features/invitations/api/get-invitation-preview.ts';
import { orgPath } from '@/lib/current-org.tsx';

/**
 * The home of the organization just joined. The preview names the organization but carries no
 * id or slug, so it is the membership that was not there before (or, failing that, the name).
 */
export function joinedOrgPath(
  me: MeResponse,
  invitation: InvitationPreview,
  previousOrgIds: readonly string[] = [],
): string {
  const joined =
    me.memberships.find(
      (m) => !previousOrgIds.includes(m.orgId) && m.orgName === invitation.orgName,
    ) ??
    me.memberships.find((m) => !previousOrgIds.includes(m.orgId)) ??
    me.memberships.find((m) => m.orgName === invitation.orgName) ??
    me.memberships[0];
  return joined ? orgPath(joined.orgSlug) : '/';
}
