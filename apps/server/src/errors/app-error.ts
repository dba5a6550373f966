/** Field-level messages for a 400 answer, keyed by the field's path (`email`, `elements.2.value`). */
export type FieldErrors = Record<string, string>;

const statusByCode = {
  'bad-request': 400,
  'validation-failed': 400,
  unauthenticated: 401,
  forbidden: 403,
  'not-found': 404,
  conflict: 409,
  unprocessable: 422,
  'too-many-requests': 429,
  'payload-too-large': 413,
  'unsupported-media-type': 415,
  unavailable: 503,
  internal: 500,
  // Specific codes the web app and scripts act on (docs/api.md).
  'invalid-credentials': 401,
  locked: 429,
  csrf: 403,
  'last-admin': 409,
  'stale-version': 409,
  'already-member': 409,
  'invitation-pending': 409,
  'account-exists': 409,
  'wrong-account': 403,
  'invitation-expired': 400,
  'invitation-used': 400,
  'invitation-revoked': 400,
  'reset-token-invalid': 400,
  'reset-token-expired': 400,
  'reset-token-used': 400,
  // Review and sign-off (workflow.ts BlockCode, and a wrong password when signing).
  'invalid-transition': 409,
  'open-findings': 409,
  'assignment-missing': 409,
  'bad-password': 403,
} as const;

export type AppErrorCode = keyof typeof statusByCode;

/**
 * The one error type of the server. Use cases throw it; the error middleware turns it into
 * `{"error":{"code","message","fields"?}}` with the status its code implies.
 */
export class AppError extends Error {
  override readonly name = 'AppError';
  readonly status: number;
  constructor(
    readonly code: AppErrorCode,
    message: string,
    readonly fields?: FieldErrors,
    options?: { cause?: unknown },
  ) {
    super(message, options);
    this.status = statusByCode[code];
  }
}
