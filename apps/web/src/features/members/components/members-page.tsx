import { useState } from 'react';
import { roles } from '@biasproof/shared';
import { Card } from '@/components/ui/card.tsx';
import { ErrorMessage, SuccessMessage } from '@/components/ui/message.tsx';
import { RoleList } from '@/components/ui/role-list.tsx';
import type { Feedback } from '@/features/members/components/feedback.ts';
import { InvitationsTable } from '@/features/members/components/invitations-table.tsx';
import { InviteForm } from '@/features/members/components/invite-form.tsx';
import { MembersTable } from '@/features/members/components/members-table.tsx';
import { Can } from '@/lib/ability.tsx';
import { useCurrentOrg } from '@/lib/current-org.tsx';

/** `/o/:orgSlug/members`: everyone sees who is in the organization; admins also manage it. */
export function MembersPage() {
  const { membership } = useCurrentOrg();
  const [feedback, setFeedback] = useState<Feedback | null>(null);

  return (
    <div className="mx-auto flex w-full max-w-6xl flex-col gap-8">
      <title>{`Members · ${membership.orgName} · Biasproof`}</title>
      <div>
        <p className="text-sm font-semibold text-ink-600">{membership.orgName}</p>
        <h1 className="text-3xl font-bold text-ink-900">Members and invitations</h1>
      </div>

      <div>
        {feedback?.tone === 'ok' ? <SuccessMessage>{feedback.text}</SuccessMessage> : null}
        {feedback?.tone === 'error' ? <ErrorMessage>{feedback.text}</ErrorMessage> : null}
      </div>

      <Card aria-labelledby="members-heading">
        <h2 id="members-heading" className="mb-4 text-lg font-semibold text-ink-900">
          Members of {membership.orgName}
        </h2>
        <MembersTable onFeedback={setFeedback} />
      </Card>

      <Can I="create" a="Invitation">
        <Card aria-labelledby="invite-heading">
          <h2 id="invite-heading" className="mb-4 text-lg font-semibold text-ink-900">
            Invite someone
          </h2>
          <InviteForm onFeedback={setFeedback} />
        </Card>
      </Can>

      <Can I="read" a="Invitation">
        <Card aria-labelledby="invitations-heading">
          <h2 id="invitations-heading" className="mb-4 text-lg font-semibold text-ink-900">
            Pending invitations
          </h2>
          <InvitationsTable onFeedback={setFeedback} />
        </Card>
      </Can>

      <Card aria-labelledby="roles-heading">
        <h2 id="roles-heading" className="mb-4 text-lg font-semibold text-ink-900">
          What each role may do
        </h2>
        <RoleList roles={roles} />
      </Card>
    </div>
  );
}
