import type { RequestHandler, Response } from 'express';
import type { Sequelize } from 'sequelize';
import { AppError } from '../errors/app-error.ts';
import { inTransaction } from '../db/transactions.ts';
import { findUserById } from './repository.ts';
import { regenerateSession } from './session.ts';

export interface SignedInUser {
  id: string;
  email: string;
  name: string;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      user?: SignedInUser;
    }
  }
}

/**
 * 401 unless the session belongs to a person whose account still exists and is enabled; a
 * session of a disabled account is ended on the spot.
 */
export function requireUser(sequelize: Sequelize): RequestHandler {
  return async (req, res, next) => {
    const userId = req.session.userId;
    const user = userId
      ? await inTransaction(sequelize, 'system', (tx) => findUserById(tx, userId))
      : null;
    if (!user || user.disabled) {
      if (userId) await regenerateSession(req);
      throw new AppError('unauthenticated', 'Please sign in.');
    }
    res.locals.user = { id: user.id, email: user.email, name: user.name };
    next();
  };
}

export function signedInUser(res: Response): SignedInUser {
  const user = res.locals.user;
  if (!user) throw new Error('requireUser middleware did not run for this route');
  return user;
}
