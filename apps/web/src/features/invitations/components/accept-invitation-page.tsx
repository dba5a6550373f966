import { useParams } from 'react-router-dom';
import { FormPage } from '@/components/ui/form-page.tsx';
import { ErrorMessage, LoadingMessage } from '@/components/ui/message.tsx';
import { RoleList } from '@/components/ui/role-list.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useInvitationPreview } from '@/features/invitations/api/get-invitation-preview.ts';
import { JoinWithAccount } from '@/features/invitations/components/join-with-account.tsx';
import { NewAccountForm } from '@/features/invitations/components/new-account-form.tsx';
import { ApiError } from '@/lib/api-client.ts';

function problemText(error: Error): string {
  if (error instanceof ApiError && error.status === 404) {
    return 'This invitation link is not valid. Check that you opened the whole link from the e-mail.';
  }
  return error.message;
}

/** `/invitations/:token`: the page the invitation e-mail links to. */
export function AcceptInvitationPage() {
  const { token = '' } = useParams();
  const preview = useInvitationPreview(token);

  if (preview.isPending) {
    return (
      <FormPage title="Invitation">
        <LoadingMessage>Opening the invitation…</LoadingMessage>
      </FormPage>
    );
  }
  if (preview.isError) {
    return (
      <FormPage title="Invitation">
        <ErrorMessage>{problemText(preview.error)}</ErrorMessage>
        <p className="text-sm text-ink-700">
          Ask the person who invited you for a new invitation, or{' '}
          <TextLink to="/sign-in">sign in</TextLink> if you already joined.
        </p>
      </FormPage>
    );
  }

  const invitation = preview.data;
  return (
    <FormPage
      title={`Join ${invitation.orgName}`}
      intro={
        <>
          {invitation.invitedByName} invited <strong>{invitation.email}</strong> to work in{' '}
          {invitation.orgName} on Biasproof.
        </>
      }
    >
      <section aria-labelledby="invited-roles-heading" className="rounded-md bg-paper p-4">
        <h2 id="invited-roles-heading" className="mb-2 text-sm font-semibold text-ink-700">
          Your roles there
        </h2>
        <RoleList roles={invitation.roles} />
      </section>
      <p className="text-sm text-ink-600">
        The invitation is valid until{' '}
        {new Date(invitation.expiresAt).toLocaleString(undefined, {
          dateStyle: 'medium',
          timeStyle: 'short',
        })}
        .
      </p>
      {invitation.accountExists ? (
        <JoinWithAccount token={token} invitation={invitation} />
      ) : (
        <NewAccountForm token={token} invitation={invitation} />
      )}
    </FormPage>
  );
}
