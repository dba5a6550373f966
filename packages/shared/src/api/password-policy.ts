import { z } from 'zod';

/**
 * A short list of passwords that appear at the top of every published leak list; long enough
 * to stop the obvious ones while the length rule does the rest (common practice).
 */
const commonPasswords = new Set([
  '123456789012',
  '1234567890123',
  'password1234',
  'password12345',
  'passwordpassword',
  'qwertyuiopas',
  'qwerty123456',
  '111111111111',
  '000000000000',
  'iloveyou1234',
  'letmein12345',
  'welcome12345',
  'administrator',
  'adminadmin12',
  'changeme1234',
  'abc123456789',
  'aaaaaaaaaaaa',
  'trustno1trustno1',
  'football1234',
  'baseball1234',
  'superman1234',
  'sunshine1234',
  'princess1234',
  'dragon123456',
  'monkey123456',
  'master123456',
  'qwertyqwerty',
  '1q2w3e4r5t6y',
  'zaq12wsxcde3',
  'passw0rd1234',
  'p@ssw0rd1234',
  'correcthorsebatterystaple',
  'biasproof123',
  'biasproof1234',
]);

export const PASSWORD_MIN_LENGTH = 12;

/** A new password: at least 12 characters, at most 200, and not on the common list. */
export const newPasswordSchema = z
  .string()
  .min(PASSWORD_MIN_LENGTH, `Use at least ${PASSWORD_MIN_LENGTH} characters.`)
  .max(200, 'Use at most 200 characters.')
  .refine(
    (p) => !commonPasswords.has(p.toLowerCase()),
    'This password is too common; choose another.',
  );
