import session from 'express-session';
import connectPgSimple from 'connect-pg-simple';
import { QueryTypes, type Sequelize } from 'sequelize';
import type { Request, RequestHandler } from 'express';
import type { Logger } from 'pino';
import type { AppConfig } from '../config.ts';

declare module 'express-session' {
  interface SessionData {
    /** The signed-in person; absent in an anonymous session (one that only holds a CSRF binding). */
    userId?: string;
    /** When the person signed in (ms since epoch), for the absolute timeout. */
    signedInAt?: number;
    /** When the anonymous session began; setting it makes express-session store the session. */
    startedAt?: number;
  }
}

export const SESSION_COOKIE = 'biasproof.sid';

/**
 * express-session over the `session` table through the app's own Sequelize pool (the store
 * only needs `any(sql, params)`). The idle timeout is the cookie's and the row's expiry, which
 * every answer pushes forward (rolling); the absolute timeout is checked by sessionTimeouts.
 */
export function sessionMiddleware(
  config: AppConfig,
  sequelize: Sequelize,
  logger: Logger,
): RequestHandler {
  const PgStore = connectPgSimple(session);
  const store = new PgStore({
    pgPromise: {
      any: (sql: string, params: unknown[]) =>
        sequelize.query(sql, { bind: params, type: QueryTypes.SELECT }),
    },
    tableName: 'session',
    createTableIfMissing: false,
    // Tests open and close many apps; pruning is for long-running servers.
    pruneSessionInterval: config.env === 'test' ? false : 15 * 60,
    errorLog: (...args: unknown[]) => logger.error({ args }, 'session store error'),
  });
  return session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    proxy: config.trustProxy,
    cookie: {
      httpOnly: true,
      sameSite: 'lax',
      secure: config.cookieSecure,
      maxAge: config.session.idleTimeoutMs,
      path: '/',
    },
  });
}

export function regenerateSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) =>
    req.session.regenerate((err) => (err ? reject(err as Error) : resolve())),
  );
}

export function saveSession(req: Request): Promise<void> {
  return new Promise((resolve, reject) =>
    req.session.save((err) => (err ? reject(err as Error) : resolve())),
  );
}

export function destroySession(req: Request): Promise<void> {
  return new Promise((resolve, reject) =>
    req.session.destroy((err) => (err ? reject(err as Error) : resolve())),
  );
}

/**
 * Ends a signed-in session that has outlived the absolute timeout, whatever its activity;
 * the request goes on as an anonymous one (and protected routes answer 401).
 */
export function sessionTimeouts(config: AppConfig): RequestHandler {
  return async (req, _res, next) => {
    const signedInAt = req.session.signedInAt;
    if (
      req.session.userId &&
      (!signedInAt || Date.now() - signedInAt > config.session.absoluteTimeoutMs)
    ) {
      await regenerateSession(req);
    }
    next();
  };
}

/** Starts a fresh session for the person who just proved who they are (the old id is destroyed). */
export async function startSignedInSession(req: Request, userId: string): Promise<void> {
  await regenerateSession(req);
  req.session.userId = userId;
  req.session.signedInAt = Date.now();
  await saveSession(req);
}
