import { describe, expect, it } from 'vitest';
import { apiErrorBodySchema, healthResponseSchema, signInRequestSchema } from '../index.ts';

describe('shared API schemas', () => {
  it.each([
    [{ status: 'ok', db: 'ok', version: '0.1.0' }, true],
    [{ status: 'degraded', db: 'down', version: '0.1.0' }, true],
    [{ status: 'fine', db: 'ok', version: '0.1.0' }, false],
    [{ status: 'ok', db: 'ok' }, false],
  ])('health %j valid: %s', (body, valid) => {
    expect(healthResponseSchema.safeParse(body).success).toBe(valid);
  });

  it('error bodies carry a code, a message and optional field messages', () => {
    expect(
      apiErrorBodySchema.safeParse({ error: { code: 'not-found', message: 'x' } }).success,
    ).toBe(true);
    expect(
      apiErrorBodySchema.safeParse({
        error: { code: 'validation-failed', message: 'x', fields: { email: 'bad' } },
      }).success,
    ).toBe(true);
    expect(apiErrorBodySchema.safeParse({ message: 'x' }).success).toBe(false);
  });

  it('sign-in trims the e-mail and explains each bad field', () => {
    expect(
      signInRequestSchema.parse({ email: '  lena@quietbias.example ', password: 'p' }).email,
    ).toBe('lena@quietbias.example');
    const r = signInRequestSchema.safeParse({ email: 'lena', password: '' });
    expect(r.success).toBe(false);
    const messages = r.error?.issues.map((i) => `${i.path.join('.')}: ${i.message}`);
    expect(messages).toEqual([
      'email: Enter a valid e-mail address, like name@company.example.',
      'password: Enter your password.',
    ]);
  });
});
