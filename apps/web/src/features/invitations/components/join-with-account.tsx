import { useState } from 'react';
import { useNavigate } from 'react-router-dom';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage, LoadingMessage } from '@/components/ui/message.tsx';
import { TextLink } from '@/components/ui/text-link.tsx';
import { useAcceptInvitation } from '@/features/invitations/api/accept-invitation.ts';
import type { InvitationPreview } from '@/features/invitations/api/get-invitation-preview.ts';
import { joinedOrgPath } from '@/features/invitations/components/landing-path.ts';
import { signInPath, useMe } from '@/lib/session.ts';

interface JoinWithAccountProps {
  token: string;
  invitation: InvitationPreview;
}

/** The invited address already has an account: sign in as that person, then join. */
export function JoinWithAccount({ token, invitation }: JoinWithAccountProps) {
  const me = useMe();
  const accept = useAcceptInvitation(token);
  const navigate = useNavigate();
  const [error, setError] = useState<string | null>(null);

  if (me.isPending) return <LoadingMessage>Checking who is signed in…</LoadingMessage>;

  const signedIn = me.data ?? null;
  if (!signedIn) {
    return (
      <p className="text-ink-700">
        {invitation.email} already has a Biasproof account.{' '}
        <TextLink to={signInPath(`/invitations/${token}`)}>Sign in to accept</TextLink>
      </p>
    );
  }
  if (signedIn.user.email.toLowerCase() !== invitation.email.toLowerCase()) {
    return (
      <ErrorMessage>
        You are signed in as {signedIn.user.email}, but this invitation is for {invitation.email}.
        Sign out, then sign in as {invitation.email} to accept it.
      </ErrorMessage>
    );
  }

  const previousOrgIds = signedIn.memberships.map((m) => m.orgId);
  function join() {
    setError(null);
    accept.mutate(
      {},
      {
        onSuccess: (joined) =>
          void navigate(joinedOrgPath(joined, invitation, previousOrgIds), { replace: true }),
        onError: (failure) => setError(failure.message),
      },
    );
  }

  return (
    <>
      {error ? <ErrorMessage>{error}</ErrorMessage> : null}
      <Button onClick={join} disabled={accept.isPending}>
        {accept.isPending ? 'Joining…' : `Join ${invitation.orgName}`}
      </Button>
    </>
  );
}
