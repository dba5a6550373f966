import { z } from 'zod';
import { apiErrorBodySchema, csrfResponseSchema } from '@biasproof/shared';
import { appConfig } from '@/config/app-config.ts';

/** Field messages the server attaches to a 400/422, keyed by field path. */
export type FieldErrors = Record<string, string>;

/**
 * A failed API call. `status` is the HTTP status, or 0 when no answer arrived at all
 * (server down, network cut); `code` is the server's machine-readable error code.
 */
export class ApiError extends Error {
  readonly status: number;
  readonly code: string;
  readonly fields: FieldErrors | undefined;

  constructor(options: {
    status: number;
    code: string;
    message: string;
    fields?: FieldErrors;
    cause?: unknown;
  }) {
    super(options.message, { cause: options.cause });
    this.name = 'ApiError';
    this.status = options.status;
    this.code = options.code;
    this.fields = options.fields;
  }
}

export interface RequestOptions {
  method?: 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
  body?: unknown;
  headers?: Record<string, string>;
  signal?: AbortSignal;
  /**
   * Non-2xx statuses whose body is a regular answer rather than an error, e.g. 503 from the
   * health check, which still reports what is down.
   */
  acceptStatuses?: readonly number[];
  /**
   * A 401 here is an ordinary answer (wrong password at sign-in, "who am I" while signed out),
   * not a sign that the session ended; the unauthorized listeners are not told.
   */
  unauthorizedIsAnswer?: boolean;
}

/** For answers without a body worth reading (204, 202). */
export const noContentSchema = z.unknown();

type UnauthorizedListener = () => void;
const unauthorizedListeners = new Set<UnauthorizedListener>();

/** Called whenever the server answers 401 to a request that needed a session. */
export function onUnauthorized(listener: UnauthorizedListener): () => void {
  unauthorizedListeners.add(listener);
  return () => unauthorizedListeners.delete(listener);
}

async function readJson(response: Response): Promise<unknown> {
  const text = await response.text();
  if (text === '') return undefined;
  try {
    return JSON.parse(text) as unknown;
  } catch {
    return undefined;
  }
}

function toApiError(status: number, body: unknown, statusText: string): ApiError {
  const parsed = apiErrorBodySchema.safeParse(body);
  if (parsed.success) {
    const { code, message, fields } = parsed.data.error;
    return new ApiError({ status, code, message, ...(fields ? { fields } : {}) });
  }
  return new ApiError({
    status,
    code: 'http_error',
    message: `Request failed: ${status} ${statusText}`.trim(),
  });
}

async function send<T>(path: string, schema: z.ZodType<T>, options: RequestOptions): Promise<T> {
  const { method = 'GET', body, headers = {}, signal, acceptStatuses = [] } = options;
  let response: Response;
  try {
    response = await fetch(`${appConfig.apiBasePath}${path}`, {
      method,
      credentials: 'same-origin',
      headers: {
        Accept: 'application/json',
        ...(body === undefined ? {} : { 'Content-Type': 'application/json' }),
        ...headers,
      },
      ...(body === undefined ? {} : { body: JSON.stringify(body) }),
      ...(signal ? { signal } : {}),
    });
  } catch (cause) {
    if (signal?.aborted) throw cause;
    throw new ApiError({
      status: 0,
      code: 'network_error',
      message: 'The server could not be reached.',
      cause,
    });
  }

  const payload = await readJson(response);
  if (!response.ok && !acceptStatuses.includes(response.status)) {
    if (response.status === 401 && !options.unauthorizedIsAnswer) {
      for (const listener of unauthorizedListeners) listener();
    }
    throw toApiError(response.status, payload, response.statusText);
  }

  const parsed = schema.safeParse(payload);
  if (!parsed.success) {
    throw new ApiError({
      status: response.status,
      code: 'unexpected_response',
      message: `Unexpected answer from ${path}.`,
      cause: parsed.error,
    });
  }
  return parsed.data;
}

// The CSRF token is bound to the session: fetched once, kept, and fetched again after the
// session changes (sign-in, sign-out) or when the server rejects it.
let csrfToken: Promise<string> | null = null;

function currentCsrfToken(): Promise<string> {
  csrfToken ??= send('/auth/csrf', csrfResponseSchema, {}).then(
    (answer) => answer.token,
    (error: unknown) => {
      csrfToken = null;
      throw error;
    },
  );
  return csrfToken;
}

/** Drops the kept CSRF token; the next mutating request fetches a fresh one. */
export function forgetCsrfToken(): void {
  csrfToken = null;
}

function isCsrfRejection(error: unknown): boolean {
  return error instanceof ApiError && error.status === 403 && error.code.startsWith('csrf');
}

/**
 * Calls `/api{path}` and returns its JSON body checked against `schema`. Mutating requests
 * carry the session's CSRF token (re-fetched and retried once when the server rejects it).
 * Throws ApiError for an error answer, an unreachable server or a body that does not match.
 */
export async function apiRequest<T>(
  path: string,
  schema: z.ZodType<T>,
  options: RequestOptions = {},
): Promise<T> {
  if ((options.method ?? 'GET') === 'GET') return send(path, schema, options);
  const withToken = async () => ({
    ...options,
    headers: { ...options.headers, 'x-csrf-token': await currentCsrfToken() },
  });
  try {
    return await send(path, schema, await withToken());
  } catch (error) {
    if (!isCsrfRejection(error)) throw error;
    forgetCsrfToken();
    return send(path, schema, await withToken());
  }
}
