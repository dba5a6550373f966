import { ErrorMessage, LoadingMessage } from '@/components/ui/message.tsx';
import { useMembers } from '@/features/members/api/list-members.ts';
import type { OnFeedback } from '@/features/members/components/feedback.ts';
import { MemberRow } from '@/features/members/components/member-row.tsx';
import { useAppAbility } from '@/lib/ability.tsx';
import { useCurrentOrg } from '@/lib/current-org.tsx';

const headerCell = 'pb-2 pr-4 text-left text-sm font-semibold text-ink-700';

export function MembersTable({ onFeedback }: { onFeedback: OnFeedback }) {
  const { membership, user } = useCurrentOrg();
  const ability = useAppAbility();
  const members = useMembers(membership.orgId);
  const showActions = ability.can('update', 'Member') || ability.can('delete', 'Member');

  if (members.isPending) return <LoadingMessage>Loading members…</LoadingMessage>;
  if (members.isError) return <ErrorMessage>{members.error.message}</ErrorMessage>;
  if (members.data.items.length === 0) {
    return <p className="text-ink-700">Nobody is a member of {membership.orgName} yet.</p>;
  }

  return (
    <table className="w-full border-collapse">
      <caption className="sr-only">
        Members of {membership.orgName} ({members.data.total})
      </caption>
      <thead>
        <tr>
          <th scope="col" className={headerCell}>
            Person
          </th>
          <th scope="col" className={headerCell}>
            Roles
          </th>
          <th scope="col" className={headerCell}>
            Status
          </th>
          <th scope="col" className={headerCell}>
            Joined
          </th>
          {showActions ? (
            <th scope="col" className={headerCell}>
              Actions
            </th>
          ) : null}
        </tr>
      </thead>
      <tbody>
        {members.data.items.map((member) => (
          <MemberRow
            key={member.userId}
            orgId={membership.orgId}
            orgName={membership.orgName}
            member={member}
            isYou={member.userId === user.id}
            showActions={showActions}
            onFeedback={onFeedback}
          />
        ))}
      </tbody>
    </table>
  );
}
