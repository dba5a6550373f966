import { afterAll, describe, expect, it } from 'vitest';
import express from 'express';
import request from 'supertest';
import { z } from 'zod';
import { AppError } from '../app-error.ts';
import { errorMiddleware } from '../error-middleware.ts';
import { createLogger } from '../../logger.ts';
import { createTestApp } from '../../test-support/test-app.ts';

function appThrowing(error: unknown) {
  const app = express();
  app.get('/boom', () => {
    throw error;
  });
  app.use(errorMiddleware(createLogger('silent')));
  return app;
}

describe('error middleware', () => {
  const real = createTestApp();
  afterAll(() => real.close());

  it('when an /api path has no route, then it answers 404 in the error shape', async () => {
    const res = await request(real.app).get('/api/no-such-thing?x=1');
    expect(res.status).toBe(404);
    expect(res.body).toEqual({
      error: { code: 'not-found', message: 'No API route GET /api/no-such-thing' },
    });
  });

  it('when the JSON body is malformed, then it answers 400 bad-request', async () => {
    const res = await request(real.app)
      .post('/api/health')
      .set('content-type', 'application/json')
      .send('{"a":');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('bad-request');
  });

  it('when the JSON body exceeds 1 MB, then it answers 413', async () => {
    const res = await request(real.app)
      .post('/api/health')
      .set('content-type', 'application/json')
      .send(JSON.stringify({ pad: 'x'.repeat(1_100_000) }));
    expect(res.status).toBe(413);
    expect(res.body.error.code).toBe('payload-too-large');
  });

  it.each([
    ['conflict', 409],
    ['forbidden', 403],
    ['unprocessable', 422],
  ] as const)('when a use case throws AppError %s, then the status is %i', async (code, status) => {
    const res = await request(appThrowing(new AppError(code, 'explained'))).get('/boom');
    expect(res.status).toBe(status);
    expect(res.body).toEqual({ error: { code, message: 'explained' } });
  });

  it('when zod rejects input, then it answers 400 with a message per field', async () => {
    const parsed = z
      .object({ email: z.email('not an e-mail'), age: z.number() })
      .safeParse({ email: 'x', age: 'y' });
    const res = await request(appThrowing(parsed.error)).get('/boom');
    expect(res.status).toBe(400);
    expect(res.body.error.code).toBe('validation-failed');
    expect(res.body.error.fields.email).toBe('not an e-mail');
    expect(Object.keys(res.body.error.fields)).toEqual(['email', 'age']);
  });

  it('when an unknown error escapes, then it answers 500 without internals', async () => {
    const res = await request(appThrowing(new Error('password=hunter2 at /srv/secret.ts:12'))).get(
      '/boom',
    );
    expect(res.status).toBe(500);
    expect(res.body).toEqual({
      error: { code: 'internal', message: 'Something went wrong on the server' },
    });
    expect(JSON.stringify(res.body)).not.toContain('hunter2');
  });
});
