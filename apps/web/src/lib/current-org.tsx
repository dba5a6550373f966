import { createContext, useContext, type ReactNode } from 'react';
import type { MembershipSummary, MeResponse } from '@biasproof/shared';
import { OrgAbilityProvider } from '@/lib/ability.tsx';

export interface CurrentOrg {
  /** The organization in the address (`/o/:orgSlug/…`) and the person's roles in it. */
  membership: MembershipSummary;
  user: MeResponse['user'];
}

const CurrentOrgContext = createContext<CurrentOrg | null>(null);

/** Wraps the pages of one organization: who is acting, where, and what they may do there. */
export function CurrentOrgProvider({
  value,
  children,
}: {
  value: CurrentOrg;
  children: ReactNode;
}) {
  return (
    <CurrentOrgContext value={value}>
      <OrgAbilityProvider userId={value.user.id} roles={value.membership.roles}>
        {children}
      </OrgAbilityProvider>
    </CurrentOrgContext>
  );
}

export function useCurrentOrg(): CurrentOrg {
  const current = useContext(CurrentOrgContext);
  if (!current) throw new Error('useCurrentOrg is used outside an organization page');
  return current;
}

/** Where an organization's pages live. */
export function orgPath(orgSlug: string, section = ''): string {
  return `/o/${encodeURIComponent(orgSlug)}${section ? `/${section}` : ''}`;
}
