import { screen } from '@testing-library/react';
import { describe, expect, it, vi } from 'vitest';
import { jsonResponse, renderApp } from '@/test/render-app.tsx';

function stubFetch(answer: () => Promise<Response>) {
  const fetchMock = vi.fn<typeof fetch>(answer);
  vi.stubGlobal('fetch', fetchMock);
  return fetchMock;
}

describe('header health status', () => {
  it('when the health check answers ok, then the header shows the database as ok', async () => {
    const fetchMock = stubFetch(() =>
      Promise.resolve(jsonResponse(200, { status: 'ok', db: 'ok', version: '0.1.0' })),
    );

    renderApp('/');

    expect(screen.getByRole('banner')).toHaveProperty(
      'textContent',
      expect.stringContaining('Biasproof'),
    );
    const status = await screen.findByRole('status', { name: /database ok/i });
    expect(status.textContent).toBe('Database ok');
    expect(fetchMock).toHaveBeenCalledWith(
      '/api/health',
      expect.objectContaining({ method: 'GET' }),
    );
  });

  it('when the health check answers 503 with the database down, then the header says so', async () => {
    stubFetch(() =>
      Promise.resolve(jsonResponse(503, { status: 'degraded', db: 'down', version: '0.1.0' })),
    );

    renderApp('/');

    const status = await screen.findByRole('status', { name: /database down/i });
    expect(status.textContent).toBe('Database down');
  });

  it('while the health check is under way, then the header says it is checking', () => {
    stubFetch(() => new Promise<Response>(() => {}));

    renderApp('/');

    expect(screen.getByRole('status', { name: /checking/i }).textContent).toBe('Checking…');
  });

  it('when the server cannot be reached, then the header says the server is unreachable', async () => {
    stubFetch(() => Promise.reject(new TypeError('Failed to fetch')));

    renderApp('/');

    expect((await screen.findByRole('status', { name: /server unreachable/i })).textContent).toBe(
      'Server unreachable',
    );
  });

  it('when the server answers an error body, then the header says the server is unreachable', async () => {
    stubFetch(() =>
      Promise.resolve(
        jsonResponse(500, { error: { code: 'internal', message: 'Internal error' } }),
      ),
    );

    renderApp('/');

    expect(await screen.findByRole('status', { name: /server unreachable/i })).toBeDefined();
  });
});
