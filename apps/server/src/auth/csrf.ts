import { createHmac } from 'node:crypto';
import cookieParser from 'cookie-parser';
import { doubleCsrf } from 'csrf-csrf';
import type { Request, RequestHandler, Response } from 'express';
import type { AppConfig } from '../config.ts';
import { AppError } from '../errors/app-error.ts';

const MUTATING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

export interface Csrf {
  /** cookie-parser and the check of header `x-csrf-token` on every mutating request. */
  middleware: RequestHandler[];
  /** Issues a token bound to the request's session (and sets its cookie). */
  issueToken(req: Request, res: Response, options?: { fresh?: boolean }): string;
}

/**
 * Double-submit CSRF tokens (csrf-csrf) bound to the session id: a token obtained in one
 * session fails in any other, including the new session that sign-in starts, so clients
 * fetch a fresh token after signing in (the sign-in answer also carries one in `x-csrf-token`).
 */
export function createCsrf(config: AppConfig): Csrf {
  const secret = createHmac('sha256', config.sessionSecret).update('biasproof csrf').digest('hex');
  const { generateCsrfToken, validateRequest } = doubleCsrf({
    getSecret: () => secret,
    getSessionIdentifier: (req) => req.sessionID,
    // The __Host- prefix needs Secure, which plain-HTTP local use cannot set.
    cookieName: config.cookieSecure ? '__Host-biasproof.csrf' : 'biasproof.csrf',
    cookieOptions: { sameSite: 'lax', secure: config.cookieSecure, httpOnly: true, path: '/' },
  });
  const check: RequestHandler = (req, _res, next) => {
    if (!MUTATING.has(req.method) || validateRequest(req)) return next();
    next(
      new AppError(
        'csrf',
        'The security token is missing or out of date; reload the page and try again.',
      ),
    );
  };
  return {
    middleware: [cookieParser(), check],
    issueToken: (req, res, options) =>
      generateCsrfToken(req, res, { overwrite: options?.fresh ?? false }),
  };
}
