import { vi } from 'vitest';
import type { Invitation, Member, MeResponse } from '@biasproof/shared';
import { jsonResponse } from '@/test/render-app.tsx';

/** One request as the fake server saw it. */
export interface FakeRequest {
  method: string;
  path: string;
  query: URLSearchParams;
  params: Record<string, string>;
  headers: Record<string, string>;
  body: unknown;
}

export interface FakeAnswer {
  status: number;
  body?: unknown;
}

export type FakeRoute = (request: FakeRequest) => FakeAnswer | Promise<FakeAnswer>;

/** Keys look like `'GET /api/orgs/:orgId/members'`. */
export type FakeRoutes = Record<string, FakeRoute>;

export const CSRF_TOKEN = 'csrf-token-of-this-session';

export function apiError(
  status: number,
  code: string,
  message: string,
  fields?: Record<string, string>,
): FakeAnswer {
  return { status, body: { error: { code, message, ...(fields ? { fields } : {}) } } };
}

const defaultRoutes: FakeRoutes = {
  'GET /api/health': () => ({ status: 200, body: { status: 'ok', db: 'ok', version: '0.1.0' } }),
  'GET /api/auth/csrf': () => ({ status: 200, body: { token: CSRF_TOKEN } }),
  'GET /api/auth/me': () => apiError(401, 'unauthenticated', 'Sign in first.'),
};

function match(pattern: string, method: string, path: string): Record<string, string> | null {
  const [patternMethod, patternPath = ''] = pattern.split(' ');
  if (patternMethod !== method) return null;
  const want = patternPath.split('/');
  const got = path.split('/');
  if (want.length !== got.length) return null;
  const params: Record<string, string> = {};
  for (const [i, part] of want.entries()) {
    const actual = got[i] ?? '';
    if (part.startsWith(':')) params[part.slice(1)] = decodeURIComponent(actual);
    else if (part !== actual) return null;
  }
  return params;
}

/**
 * Replaces `fetch` with a tiny in-test server: each route answers from the test's own state.
 * Unlisted routes answer 404; health, csrf and a signed-out `me` are there by default.
 */
export function stubApi(routes: FakeRoutes) {
  const all = { ...defaultRoutes, ...routes };
  const requests: FakeRequest[] = [];
  const fetchMock = vi.fn<typeof fetch>(async (input, init) => {
    const href = input instanceof Request ? input.url : input instanceof URL ? input.href : input;
    const url = new URL(href, 'http://app.example');
    const method = init?.method ?? 'GET';
    const headers = { ...(init?.headers as Record<string, string> | undefined) };
    const body = typeof init?.body === 'string' ? (JSON.parse(init.body) as unknown) : undefined;
    for (const [pattern, route] of Object.entries(all)) {
      const params = match(pattern, method, url.pathname);
      if (!params) continue;
      const request = {
        method,
        path: url.pathname,
        query: url.searchParams,
        params,
        headers,
        body,
      };
      requests.push(request);
      const answer = await route(request);
      return answer.body === undefined
        ? new Response(null, { status: answer.status })
        : jsonResponse(answer.status, answer.body);
    }
    return jsonResponse(404, {
      error: { code: 'not-found', message: `No route ${method} ${url.pathname}` },
    });
  });
  vi.stubGlobal('fetch', fetchMock);
  return {
    fetchMock,
    /** Requests that reached `'METHOD /path'` (exact path, not a pattern). */
    requestsTo(methodAndPath: string): FakeRequest[] {
      return requests.filter((r) => `${r.method} ${r.path}` === methodAndPath);
    },
  };
}

/** People and organizations of the tests (reserved `.example` domains). */
export const orgs = {
  resonant: { orgId: 'org-resonant', orgSlug: 'resonant-labs', orgName: 'Resonant Labs' },
  quartz: { orgId: 'org-quartz', orgSlug: 'quartz-works', orgName: 'Quartz Works' },
};

export function meOf(
  overrides: Partial<MeResponse['user']>,
  memberships: MeResponse['memberships'],
): MeResponse {
  return {
    user: { id: 'user-ines', email: 'ines@resonant.example', name: 'Ines Okafor', ...overrides },
    memberships,
  };
}

export function aMember(overrides: Partial<Member> & Pick<Member, 'userId' | 'name'>): Member {
  return {
    email: `${overrides.name.split(' ')[0]?.toLowerCase() ?? 'someone'}@resonant.example`,
    roles: ['author'],
    disabled: false,
    joinedAt: '2026-03-02T09:00:00.000Z',
    ...overrides,
  };
}

export function anInvitation(
  overrides: Partial<Invitation> & Pick<Invitation, 'id' | 'email'>,
): Invitation {
  return {
    roles: ['checker'],
    invitedBy: { id: 'user-ines', name: 'Ines Okafor' },
    createdAt: '2026-05-01T09:00:00.000Z',
    expiresAt: '2026-05-08T09:00:00.000Z',
    status: 'pending',
    ...overrides,
  };
}

export function list<T>(items: T[]) {
  return { items, total: items.length };
}
