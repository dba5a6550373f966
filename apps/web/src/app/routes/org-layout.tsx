import { Outlet, useParams } from 'react-router-dom';
import { NotFoundPage } from '@/app/routes/not-found-page.tsx';
import { CurrentOrgProvider } from '@/lib/current-org.tsx';
import { useSignedInMe } from '@/lib/signed-in.tsx';

/**
 * `/o/:orgSlug/…`: the organization in the address must be one of the person's; any other
 * slug reads as an unknown page, so an organization's existence does not leak.
 */
export function OrgLayout() {
  const { orgSlug } = useParams();
  const me = useSignedInMe();
  const membership = me.memberships.find((m) => m.orgSlug === orgSlug);
  if (!membership) return <NotFoundPage />;
  return (
    // Keyed by organization: switching starts every page of the new one afresh.
    <CurrentOrgProvider key={membership.orgId} value={{ membership, user: me.user }}>
      <Outlet />
    </CurrentOrgProvider>
  );
}
