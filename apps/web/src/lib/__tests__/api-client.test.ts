import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { apiRequest, forgetCsrfToken } from '@/lib/api-client.ts';
import { apiError, stubApi } from '@/test/fake-api.ts';

const okSchema = z.object({ ok: z.boolean() });

describe('api client CSRF handling', () => {
  it('when several mutating requests are sent, then the token is fetched once and sent with each', async () => {
    let issued = 0;
    const api = stubApi({
      'GET /api/auth/csrf': () => ({ status: 200, body: { token: `token-${++issued}` } }),
      'POST /api/things': () => ({ status: 200, body: { ok: true } }),
    });

    await apiRequest('/things', okSchema, { method: 'POST', body: {} });
    await apiRequest('/things', okSchema, { method: 'POST', body: {} });

    expect(api.requestsTo('GET /api/auth/csrf')).toHaveLength(1);
    expect(api.requestsTo('POST /api/things').map((r) => r.headers['x-csrf-token'])).toEqual([
      'token-1',
      'token-1',
    ]);
  });

  it('when the server rejects the token (403 csrf), then a fresh token is fetched and the request retried once', async () => {
    let issued = 0;
    const api = stubApi({
      'GET /api/auth/csrf': () => ({ status: 200, body: { token: `token-${++issued}` } }),
      'POST /api/things': ({ headers }) =>
        headers['x-csrf-token'] === 'token-2'
          ? { status: 200, body: { ok: true } }
          : apiError(403, 'csrf', 'The form expired; reload the page.'),
    });

    await expect(apiRequest('/things', okSchema, { method: 'POST', body: {} })).resolves.toEqual({
      ok: true,
    });
    expect(api.requestsTo('POST /api/things')).toHaveLength(2);
  });

  it('when the fresh token is rejected as well, then the error reaches the caller after one retry', async () => {
    const api = stubApi({ 'DELETE /api/things/1': () => apiError(403, 'csrf', 'Bad CSRF token.') });

    await expect(apiRequest('/things/1', okSchema, { method: 'DELETE' })).rejects.toMatchObject({
      status: 403,
      code: 'csrf',
      message: 'Bad CSRF token.',
    });
    expect(api.requestsTo('DELETE /api/things/1')).toHaveLength(2);
  });

  it('when the request is a GET, then no token is fetched or sent', async () => {
    const api = stubApi({ 'GET /api/things': () => ({ status: 200, body: { ok: true } }) });

    await apiRequest('/things', okSchema);

    expect(api.requestsTo('GET /api/auth/csrf')).toHaveLength(0);
    expect(api.requestsTo('GET /api/things')[0]?.headers['x-csrf-token']).toBeUndefined();
  });

  it('when the kept token is forgotten (new session), then the next mutating request fetches another', async () => {
    let issued = 0;
    const api = stubApi({
      'GET /api/auth/csrf': () => ({ status: 200, body: { token: `token-${++issued}` } }),
      'POST /api/things': () => ({ status: 200, body: { ok: true } }),
    });

    await apiRequest('/things', okSchema, { method: 'POST' });
    forgetCsrfToken();
    await apiRequest('/things', okSchema, { method: 'POST' });

    expect(api.requestsTo('POST /api/things').map((r) => r.headers['x-csrf-token'])).toEqual([
      'token-1',
      'token-2',
    ]);
  });
});
