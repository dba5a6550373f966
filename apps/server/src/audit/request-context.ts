import { AsyncLocalStorage } from 'node:async_hooks';
import type { RequestHandler } from 'express';

/** Who is on the other end of the request an audit event is written in. */
export interface RequestContext {
  /**
   * The client's address as Express reports it (`req.ip`): with `TRUST_PROXY=true` the address
   * the one trusted proxy names in X-Forwarded-For, otherwise the socket's peer. The same value
   * per-address sign-in throttling counts.
   */
  ip: string | null;
  userAgent: string | null;
}

const storage = new AsyncLocalStorage<RequestContext>();

/** A browser's user agent is a few hundred characters; anything longer is noise or abuse. */
const MAX_USER_AGENT = 512;

/**
 * Makes the request's address and user agent available to the audit writer for the rest of
 * the request, so use cases record them without routes passing the request down. Mount it
 * after middleware that resumes in callbacks of pooled connections (the session store), which
 * would run the rest of the chain outside this context.
 */
export function requestContext(): RequestHandler {
  return (req, _res, next) => {
    const userAgent = req.get('user-agent');
    storage.run(
      {
        ip: req.ip ?? null,
        userAgent: userAgent ? userAgent.slice(0, MAX_USER_AGENT) : null,
      },
      next,
    );
  };
}

/** The current request's context, or undefined outside a request (seeding, the dispatcher). */
export function currentRequestContext(): RequestContext | undefined {
  return storage.getStore();
}
