import { useEffect, useRef, useState } from 'react';
import { subject, type Member } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { RoleChips } from '@/components/ui/role-list.tsx';
import type { OnFeedback } from '@/features/members/components/feedback.ts';
import { MemberActions } from '@/features/members/components/member-actions.tsx';
import { RoleEditor } from '@/features/members/components/role-editor.tsx';
import { useAppAbility } from '@/lib/ability.tsx';

interface MemberRowProps {
  orgId: string;
  orgName: string;
  member: Member;
  isYou: boolean;
  /** Whether the table has an actions column at all. */
  showActions: boolean;
  onFeedback: OnFeedback;
}

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium' });

export function MemberRow({
  orgId,
  orgName,
  member,
  isYou,
  showActions,
  onFeedback,
}: MemberRowProps) {
  const ability = useAppAbility();
  const target = subject('Member', { userId: member.userId, roles: [...member.roles] });
  const canUpdate = ability.can('update', target);
  const canDelete = ability.can('delete', target);
  const [editing, setEditing] = useState(false);
  const changeRoles = useRef<HTMLButtonElement>(null);
  const wasEditing = useRef(false);

  // Back on the "Change roles" button once the inline editor closes.
  useEffect(() => {
    if (wasEditing.current && !editing) changeRoles.current?.focus();
    wasEditing.current = editing;
  }, [editing]);

  return (
    <tr className="border-t border-rule align-top">
      <th scope="row" className="py-3 pr-4 text-left font-normal">
        <span className="font-semibold text-ink-900">{member.name}</span>
        {isYou ? <span className="text-ink-600"> (you)</span> : null}
        <span className="block text-sm text-ink-600">{member.email}</span>
      </th>
      <td className="py-3 pr-4">
        {editing ? (
          <RoleEditor
            orgId={orgId}
            member={member}
            onDone={() => setEditing(false)}
            onFeedback={onFeedback}
          />
        ) : (
          <div className="flex flex-wrap items-center gap-2">
            <RoleChips roles={member.roles} />
            {canUpdate ? (
              <Button
                ref={changeRoles}
                size="sm"
                variant="quiet"
                aria-label={`Change roles of ${member.name}`}
                onClick={() => setEditing(true)}
              >
                Change roles
              </Button>
            ) : null}
          </div>
        )}
      </td>
      <td className="py-3 pr-4 text-sm">
        {member.disabled ? (
          <span className="rounded-full bg-fault-tint px-2 py-0.5 font-semibold text-fault">
            Disabled
          </span>
        ) : (
          <span className="rounded-full bg-ok-tint px-2 py-0.5 font-semibold text-ok">Active</span>
        )}
      </td>
      <td className="py-3 pr-4 text-sm text-ink-700">
        {dateFormat.format(new Date(member.joinedAt))}
      </td>
      {showActions ? (
        <td className="py-3">
          <MemberActions
            orgId={orgId}
            orgName={orgName}
            member={member}
            canUpdate={canUpdate}
            canDelete={canDelete}
            onFeedback={onFeedback}
          />
        </td>
      ) : null}
    </tr>
  );
}
