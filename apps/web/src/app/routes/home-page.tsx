import { Link, Navigate } from 'react-router-dom';
import { Card } from '@/components/ui/card.tsx';
import { homePathFor, useMe } from '@/lib/session.ts';

/** `/`: a signed-in member goes straight to their first organization; everyone else reads this. */
export function HomePage() {
  const me = useMe().data ?? null;
  if (me && me.memberships.length > 0) return <Navigate to={homePathFor(me)} replace />;

  return (
    <div className="mx-auto flex w-full max-w-3xl flex-col gap-8">
      <title>Biasproof</title>
      <div>
        <h1 className="text-3xl font-bold text-ink-900">
          Operating points your whole team can check
        </h1>
        <p className="mt-3 text-lg text-ink-700">
          Capture a block, solve its bias point and small-signal behaviour, hand it to a checker and
          sign off the frozen revision, with every step on record.
        </p>
      </div>

      {me ? (
        <Card aria-labelledby="queue-heading" className="flex flex-col items-start gap-3">
          <h2 id="queue-heading" className="text-lg font-semibold text-ink-900">
            You are not in an organization yet
          </h2>
          <p className="text-ink-700">
            Signed in as {me.user.email}. An admin of your team&apos;s organization can invite this
            address; the invitation e-mail brings you in.
          </p>
        </Card>
      ) : (
        <Card aria-labelledby="queue-heading" className="flex flex-col items-start gap-3">
          <h2 id="queue-heading" className="text-lg font-semibold text-ink-900">
            Nothing in your queue yet
          </h2>
          <p className="text-ink-700">
            Worksheets waiting for you as author, checker or approver will be listed here once you
            are signed in.
          </p>
          <Link
            to="/sign-in"
            className="rounded-md bg-accent px-4 py-2 text-sm font-semibold text-white hover:bg-accent-strong focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-accent"
          >
            Go to sign-in
          </Link>
        </Card>
      )}
    </div>
  );
}
