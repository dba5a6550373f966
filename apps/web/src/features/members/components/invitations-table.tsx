import { ErrorMessage, LoadingMessage } from '@/components/ui/message.tsx';
import { useInvitations } from '@/features/members/api/list-invitations.ts';
import type { OnFeedback } from '@/features/members/components/feedback.ts';
import { InvitationRow } from '@/features/members/components/invitation-row.tsx';
import { useAppAbility } from '@/lib/ability.tsx';
import { useCurrentOrg } from '@/lib/current-org.tsx';

const headerCell = 'pb-2 pr-4 text-left text-sm font-semibold text-ink-700';

/** Invitations nobody has answered yet, with resend and revoke. */
export function InvitationsTable({ onFeedback }: { onFeedback: OnFeedback }) {
  const { membership } = useCurrentOrg();
  const ability = useAppAbility();
  const invitations = useInvitations(membership.orgId, 'pending');

  if (invitations.isPending) return <LoadingMessage>Loading invitations…</LoadingMessage>;
  if (invitations.isError) return <ErrorMessage>{invitations.error.message}</ErrorMessage>;
  if (invitations.data.items.length === 0) {
    return <p className="text-ink-700">No invitation is waiting for an answer.</p>;
  }

  return (
    <table className="w-full border-collapse">
      <caption className="sr-only">
        Pending invitations to {membership.orgName} ({invitations.data.total})
      </caption>
      <thead>
        <tr>
          <th scope="col" className={headerCell}>
            Invited address
          </th>
          <th scope="col" className={headerCell}>
            Roles
          </th>
          <th scope="col" className={headerCell}>
            Invited by
          </th>
          <th scope="col" className={headerCell}>
            Link valid until
          </th>
          <th scope="col" className={headerCell}>
            Actions
          </th>
        </tr>
      </thead>
      <tbody>
        {invitations.data.items.map((invitation) => (
          <InvitationRow
            key={invitation.id}
            orgId={membership.orgId}
            invitation={invitation}
            canResend={ability.can('update', 'Invitation')}
            canRevoke={ability.can('delete', 'Invitation')}
            onFeedback={onFeedback}
          />
        ))}
      </tbody>
    </table>
  );
}
