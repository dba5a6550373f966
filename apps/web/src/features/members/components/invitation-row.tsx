import { useState } from 'react';
import type { Invitation } from '@biasproof/shared';
import { Button } from '@/components/ui/button.tsx';
import { ConfirmDialog } from '@/components/ui/confirm-dialog.tsx';
import { RoleChips } from '@/components/ui/role-list.tsx';
import { useResendInvitation } from '@/features/members/api/resend-invitation.ts';
import { useRevokeInvitation } from '@/features/members/api/revoke-invitation.ts';
import { errorFeedback, type OnFeedback } from '@/features/members/components/feedback.ts';

interface InvitationRowProps {
  orgId: string;
  invitation: Invitation;
  canResend: boolean;
  canRevoke: boolean;
  onFeedback: OnFeedback;
}

const dateFormat = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

export function InvitationRow({
  orgId,
  invitation,
  canResend,
  canRevoke,
  onFeedback,
}: InvitationRowProps) {
  const resend = useResendInvitation(orgId);
  const revoke = useRevokeInvitation(orgId);
  const [asking, setAsking] = useState(false);
  const { email } = invitation;

  function resendNow() {
    resend.mutate(invitation.id, {
      onSuccess: () => onFeedback({ tone: 'ok', text: `A new invitation link went to ${email}.` }),
      onError: (error) => onFeedback(errorFeedback(error)),
    });
  }

  function revokeNow() {
    revoke.mutate(invitation.id, {
      onSuccess: () => onFeedback({ tone: 'ok', text: `The invitation to ${email} is revoked.` }),
      onError: (error) => onFeedback(errorFeedback(error)),
      onSettled: () => setAsking(false),
    });
  }

  return (
    <tr className="border-t border-rule align-top">
      <th scope="row" className="py-3 pr-4 text-left font-semibold text-ink-900">
        {email}
      </th>
      <td className="py-3 pr-4">
        <RoleChips roles={invitation.roles} />
      </td>
      <td className="py-3 pr-4 text-sm text-ink-700">{invitation.invitedBy.name}</td>
      <td className="py-3 pr-4 text-sm text-ink-700">
        {dateFormat.format(new Date(invitation.expiresAt))}
      </td>
      <td className="py-3">
        <div className="flex flex-wrap gap-2">
          {canResend ? (
            <Button
              size="sm"
              variant="outline"
              aria-label={`Resend the invitation to ${email}`}
              disabled={resend.isPending}
              onClick={resendNow}
            >
              {resend.isPending ? 'Sending…' : 'Resend'}
            </Button>
          ) : null}
          {canRevoke ? (
            <Button
              size="sm"
              variant="dangerOutline"
              aria-label={`Revoke the invitation to ${email}`}
              disabled={revoke.isPending}
              onClick={() => setAsking(true)}
            >
              Revoke
            </Button>
          ) : null}
        </div>
        {asking ? (
          <ConfirmDialog
            title={`Revoke the invitation to ${email}?`}
            confirmLabel="Revoke invitation"
            busy={revoke.isPending}
            onConfirm={revokeNow}
            onCancel={() => setAsking(false)}
          >
            The link in the e-mail stops working at once. You can invite {email} again later.
          </ConfirmDialog>
        ) : null}
      </td>
    </tr>
  );
}
