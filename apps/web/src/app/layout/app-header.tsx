import { Link, NavLink, useMatch } from 'react-router-dom';
import { defineAbilityFor } from '@biasproof/shared';
import { appConfig } from '@/config/app-config.ts';
import { SignOutButton } from '@/features/auth/components/sign-out-button.tsx';
import { HealthStatus } from '@/features/health/components/health-status.tsx';
import { OrgSwitcher } from '@/features/orgs/components/org-switcher.tsx';
import { orgPath } from '@/lib/current-org.tsx';
import { useMe } from '@/lib/session.ts';

const headerLink =
  'rounded-sm text-sm font-semibold text-paper underline-offset-4 hover:underline focus-visible:outline-2 focus-visible:outline-offset-4 focus-visible:outline-paper';
const sectionLink = `${headerLink} aria-[current=page]:underline`;

export function AppHeader() {
  const me = useMe().data ?? null;
  const orgSlug = useMatch('/o/:orgSlug/*')?.params.orgSlug;
  const membership = me?.memberships.find((m) => m.orgSlug === orgSlug);
  const inKnownOrg = membership !== undefined;
  // The header sits above the organization's pages, so it asks the shared rules itself.
  const mayReadAudit =
    me && membership
      ? defineAbilityFor({ userId: me.user.id, roles: membership.roles }).can('read', 'AuditLog')
      : false;

  return (
    <header className="bg-ink-900 text-paper">
      <div className="mx-auto flex max-w-6xl flex-wrap items-center justify-between gap-4 px-6 py-3">
        <div className="flex flex-wrap items-center gap-4">
          <Link
            to="/"
            className="text-xl font-bold tracking-tight text-paper focus-visible:outline-2 focus-visible:outline-offset-4 focus-visible:outline-paper"
          >
            {appConfig.productName}
          </Link>
          {me ? <OrgSwitcher memberships={me.memberships} currentSlug={orgSlug} /> : null}
          {me && orgSlug && inKnownOrg ? (
            <nav aria-label="Organization" className="flex items-center gap-4">
              <NavLink end to={orgPath(orgSlug)} className={sectionLink}>
                My queue
              </NavLink>
              <NavLink to={orgPath(orgSlug, 'projects')} className={sectionLink}>
                Projects
              </NavLink>
              <NavLink to={orgPath(orgSlug, 'worksheets')} className={sectionLink}>
                Worksheets
              </NavLink>
              <NavLink to={orgPath(orgSlug, 'members')} className={sectionLink}>
                Members
              </NavLink>
              {mayReadAudit ? (
                <NavLink to={orgPath(orgSlug, 'audit')} className={sectionLink}>
                  Audit
                </NavLink>
              ) : null}
            </nav>
          ) : null}
        </div>
        <nav aria-label="Account" className="flex flex-wrap items-center gap-4">
          <HealthStatus />
          {me ? (
            <>
              <NavLink to="/profile" className={sectionLink}>
                <span className="sr-only">Your profile: </span>
                {me.user.name}
              </NavLink>
              <SignOutButton />
            </>
          ) : (
            <Link to="/sign-in" className={headerLink}>
              Sign in
            </Link>
          )}
        </nav>
      </div>
    </header>
  );
}
