import { createContext, useContext, type ReactNode } from 'react';
import type { MeResponse } from '@biasproof/shared';

const SignedInContext = createContext<MeResponse | null>(null);

/** Set by the sign-in guard around pages that need a session. */
export function SignedInProvider({ me, children }: { me: MeResponse; children: ReactNode }) {
  return <SignedInContext value={me}>{children}</SignedInContext>;
}

/** The signed-in person, for pages behind the sign-in guard. */
export function useSignedInMe(): MeResponse {
  const me = useContext(SignedInContext);
  if (!me) throw new Error('useSignedInMe is used outside the sign-in guard');
  return me;
}
