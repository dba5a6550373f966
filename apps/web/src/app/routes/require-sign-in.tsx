import { Navigate, Outlet, useLocation } from 'react-router-dom';
import { Button } from '@/components/ui/button.tsx';
import { ErrorMessage, LoadingMessage } from '@/components/ui/message.tsx';
import { signInPath, useMe } from '@/lib/session.ts';
import { SignedInProvider } from '@/lib/signed-in.tsx';

/**
 * Guards the pages that need a session. Signed out (including a 401 anywhere, which clears the
 * session) → the sign-in page, which comes back here afterwards.
 */
export function RequireSignIn() {
  const me = useMe();
  const location = useLocation();

  if (me.isPending) {
    return (
      <div className="mx-auto max-w-md">
        <LoadingMessage>Checking your session…</LoadingMessage>
      </div>
    );
  }
  if (me.isError) {
    return (
      <div className="mx-auto flex max-w-md flex-col items-start gap-3">
        <ErrorMessage>Your session could not be checked: {me.error.message}</ErrorMessage>
        <Button variant="outline" onClick={() => void me.refetch()}>
          Try again
        </Button>
      </div>
    );
  }
  if (!me.data) {
    return <Navigate to={signInPath(`${location.pathname}${location.search}`)} replace />;
  }
  return (
    <SignedInProvider me={me.data}>
      <Outlet />
    </SignedInProvider>
  );
}
