import { hashKey, queryOptions, useQuery, type QueryClient } from '@tanstack/react-query';
import { meResponseSchema, type MeResponse } from '@biasproof/shared';
import { ApiError, apiRequest, forgetCsrfToken } from '@/lib/api-client.ts';
import { orgPath } from '@/lib/current-org.tsx';

/** GET /api/auth/me: the signed-in person and their memberships, or null when signed out. */
/**
 * Queries whose answer does not depend on who is signed in set `meta: { keepAcrossSessions:
 * true }`; every other cached answer is dropped when the session changes.
 */
export async function getMe(signal?: AbortSignal): Promise<MeResponse | null> {
  try {
    return await apiRequest('/auth/me', meResponseSchema, {
      unauthorizedIsAnswer: true,
      ...(signal ? { signal } : {}),
    });
  } catch (error) {
    if (error instanceof ApiError && error.status === 401) return null;
    throw error;
  }
}

export function meQueryOptions() {
  return queryOptions({
    queryKey: ['auth', 'me'] as const,
    queryFn: ({ signal }) => getMe(signal),
    staleTime: 60_000,
  });
}

/** The signed-in person (`data` is null when signed out, undefined while loading). */
export function useMe() {
  return useQuery(meQueryOptions());
}

/**
 * A new session began (sign-in, accepted invitation): nothing cached for the previous person
 * may show, and the CSRF token of the old session is void.
 */
export function startSession(queryClient: QueryClient, me: MeResponse): void {
  replaceSession(queryClient, me);
}

/** The session ended (signed out, or the server answered 401): forget everything it showed. */
export function endSession(queryClient: QueryClient): void {
  replaceSession(queryClient, null);
}

function replaceSession(queryClient: QueryClient, me: MeResponse | null): void {
  forgetCsrfToken();
  const meKey = meQueryOptions().queryKey;
  // `me` itself is updated in place: the header and the sign-in guard keep observing it.
  queryClient.setQueryData(meKey, me);
  queryClient.removeQueries({
    predicate: (q) => q.meta?.keepAcrossSessions !== true && q.queryHash !== hashKey(meKey),
  });
}

/** The sign-in page, asked to come back to `next` afterwards. */
export function signInPath(next?: string): string {
  return next ? `/sign-in?next=${encodeURIComponent(next)}` : '/sign-in';
}

/** Only paths inside this app may follow a sign-in (never another site). */
export function safeNextPath(next: string | null): string | null {
  if (!next?.startsWith('/') || next.startsWith('//') || next.startsWith('/\\')) return null;
  return next;
}

/** Where a person lands after signing in without a `next`: their first organization's home. */
export function homePathFor(me: MeResponse): string {
  const first = me.memberships[0];
  return first ? orgPath(first.orgSlug) : '/';
}
