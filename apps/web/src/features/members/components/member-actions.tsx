import { useState } from 'react';
import type { Member } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ConfirmDialog } from '@/components/ui/confirm-dialog.tsx';
import { useRemoveMember } from '@/features/members/api/remove-member.ts';
import { useUpdateMember } from '@/features/members/api/update-member.ts';
import { errorFeedback, type OnFeedback } from '@/features/members/components/feedback.ts';

interface MemberActionsProps {
  orgId: string;
  orgName: string;
  member: Member;
  canUpdate: boolean;
  canDelete: boolean;
  onFeedback: OnFeedback;
}

/** Disable/enable and remove, each destructive step confirmed first. */
export function MemberActions({
  orgId,
  orgName,
  member,
  canUpdate,
  canDelete,
  onFeedback,
}: MemberActionsProps) {
  const update = useUpdateMember(orgId);
  const remove = useRemoveMember(orgId);
  const [asking, setAsking] = useState<'disable' | 'remove' | null>(null);
  const { name, userId } = member;

  function setDisabled(disabled: boolean) {
    update.mutate(
      { userId, disabled },
      {
        onSuccess: () =>
          onFeedback({ tone: 'ok', text: `${name} is ${disabled ? 'disabled' : 'enabled'}.` }),
        onError: (error) => onFeedback(errorFeedback(error)),
        onSettled: () => setAsking(null),
      },
    );
  }

  function removeMember() {
    remove.mutate(userId, {
      onSuccess: () => onFeedback({ tone: 'ok', text: `${name} was removed from ${orgName}.` }),
      onError: (error) => onFeedback(errorFeedback(error)),
      onSettled: () => setAsking(null),
    });
  }

  return (
    <div className="flex flex-wrap gap-2">
      {canUpdate ? (
        <Button
          size="sm"
          variant="outline"
          aria-label={`${member.disabled ? 'Enable' : 'Disable'} ${name}`}
          disabled={update.isPending}
          onClick={() => (member.disabled ? setDisabled(false) : setAsking('disable'))}
        >
          {member.disabled ? 'Enable' : 'Disable'}
        </Button>
      ) : null}
      {canDelete ? (
        <Button
          size="sm"
          variant="dangerOutline"
          aria-label={`Remove ${name}`}
          disabled={remove.isPending}
          onClick={() => setAsking('remove')}
        >
          Remove
        </Button>
      ) : null}
      {asking === 'disable' ? (
        <ConfirmDialog
          title={`Disable ${name}?`}
          confirmLabel="Disable"
          busy={update.isPending}
          onConfirm={() => setDisabled(true)}
          onCancel={() => setAsking(null)}
        >
          {name} will not be able to work in {orgName} until an admin enables them again. Their
          worksheets, findings and signatures stay as they are.
        </ConfirmDialog>
      ) : null}
      {asking === 'remove' ? (
        <ConfirmDialog
          title={`Remove ${name} from ${orgName}?`}
          confirmLabel="Remove member"
          busy={remove.isPending}
          onConfirm={removeMember}
          onCancel={() => setAsking(null)}
        >
          {name} loses access to {orgName} at once. What they did stays on record; to bring them
          back, invite them again.
        </ConfirmDialog>
      ) : null}
    </div>
  );
}
