import type { ErrorRequestHandler, RequestHandler } from 'express';
import type { Logger } from 'pino';
import { ZodError } from 'zod';
import { AppError } from './app-error.ts';

interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

/** Answers 404 for any /api path no router handled. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(new AppError('not-found', `No API route ${req.method} ${req.originalUrl.split('?')[0]}`));
};

function fromBodyParser(err: { type?: string; status?: number }): AppError | undefined {
  if (err.type === 'entity.parse.failed')
    return new AppError('bad-request', 'The request body is not valid JSON');
  if (err.type === 'entity.too.large')
    return new AppError('payload-too-large', 'The request body is too large');
  return undefined;
}

function fromZod(err: ZodError): AppError {
  const fields: Record<string, string> = {};
  for (const issue of err.issues) {
    const key = issue.path.join('.') || '_';
    fields[key] ??= issue.message;
  }
  return new AppError('validation-failed', 'Some fields are not valid', fields);
}

/**
 * Turns every error into the API's error shape. Unknown errors are logged with their stack
 * and answered as a bare 500, so internals never reach the client.
 */
export function errorMiddleware(logger: Logger): ErrorRequestHandler {
  return (err: unknown, req, res, _next) => {
    let appError: AppError | undefined;
    if (err instanceof AppError) appError = err;
    else if (err instanceof ZodError) appError = fromZod(err);
    else if (err && typeof err === 'object') appError = fromBodyParser(err);

    if (!appError) {
      logger.error({ err, method: req.method, url: req.originalUrl }, 'unhandled error');
      appError = new AppError('internal', 'Something went wrong on the server');
    } else if (appError.status >= 500) {
      logger.error({ err: appError.cause ?? appError }, appError.message);
    }
    const body: ErrorBody = { error: { code: appError.code, message: appError.message } };
    if (appError.fields) body.error.fields = appError.fields;
    res.status(appError.status).json(body);
  };
}
