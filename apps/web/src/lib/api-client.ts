import type { z } from 'zod';
import { apiErrorBodySchema } from '@biasproof/shared';
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

/**
 * Calls `/api{path}` and returns its JSON body checked against `schema`. Throws ApiError for
 * an error answer, an unreachable server or a body that does not match the schema.
 */
export async function apiRequest<T>(
  path: string,
  schema: z.ZodType<T>,
  options: RequestOptions = {},
): Promise<T> {
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
