import { useSignOut } from '@/features/auth/api/sign-out.ts';

/** The header's "Sign out": ends the session on the server and in this browser. */
export function SignOutButton() {
  const signOut = useSignOut();
  return (
    <button
      type="button"
      onClick={() => signOut.mutate()}
      disabled={signOut.isPending}
      className="rounded-md border border-ink-500 px-3 py-1 text-sm font-semibold text-paper hover:bg-ink-700 focus-visible:outline-2 focus-visible:outline-offset-2 focus-visible:outline-paper disabled:opacity-60"
    >
      {signOut.isPending ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
