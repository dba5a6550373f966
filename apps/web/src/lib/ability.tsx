import { AbilityProvider, Can as CaslCan, useAbility, type CanProps } from '@casl/react';
import { useMemo, type ReactNode } from 'react';
import { defineAbilityFor, type AppAbility, type Role } from '@biasproof/shared';

interface OrgAbilityProviderProps {
  userId: string;
  roles: readonly Role[];
  children: ReactNode;
}

/**
 * Gives the pages below the rules of one person in one organization, the same rules the server
 * enforces; the app uses them only to show the actions that would be allowed.
 */
export function OrgAbilityProvider({ userId, roles, children }: OrgAbilityProviderProps) {
  const ability = useMemo(() => defineAbilityFor({ userId, roles }), [userId, roles]);
  return <AbilityProvider value={ability}>{children}</AbilityProvider>;
}

export function useAppAbility(): AppAbility {
  return useAbility<AppAbility>();
}

/** @casl/react's `Can`, typed with this app's actions and subjects. */
export function Can(props: CanProps<AppAbility>) {
  return <CaslCan<AppAbility> {...props} />;
}
