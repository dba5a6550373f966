import type { RequestHandler, Response } from 'express';
import {
  defineAbilityFor,
  idSchema,
  type Action,
  type AppAbility,
  type Role,
  type SubjectName,
} from '@biasproof/shared';
import type { Sequelize } from 'sequelize';
import { AppError } from '../errors/app-error.ts';
import { inTransaction, type Tx } from '../db/transactions.ts';
import { appendAuditEvent, lockOrgChain, type AuditEntry } from '../audit/audit-log.ts';
import { signedInUser } from '../auth/require-user.ts';
import { activeRolesIn } from './repository.ts';

/** A transaction that can only see one organization's rows (row-level security). */
export interface OrgTx extends Tx {
  orgId: string;
  /** Appends this change's audit event to the organization's chain, as the acting person. */
  audit(entry: Omit<AuditEntry, 'actorUserId'>): Promise<void>;
}

/**
 * The org-scoped data access helper the tenant middleware hands to routes: who acts, what
 * the rules let them do, and transactions confined to this organization. Use cases reach the
 * database only through it, so none builds its own tenant filter from request input.
 */
export interface OrgContext {
  orgId: string;
  actor: { userId: string; roles: Role[] };
  ability: AppAbility;
  read<T>(fn: (tx: OrgTx) => Promise<T>): Promise<T>;
  /** Runs alone among this organization's writes (its audit chain is locked first). */
  write<T>(fn: (tx: OrgTx) => Promise<T>): Promise<T>;
}

declare global {
  // eslint-disable-next-line @typescript-eslint/no-namespace
  namespace Express {
    interface Locals {
      org?: OrgContext;
    }
  }
}

/**
 * Wraps a transaction already scoped to `orgId`. The actor is read when an event is written,
 * so flows that learn who acts midway (accepting an invitation creates the account) can pass
 * a getter; null records a change made by the system (provisioning).
 */
export function toOrgTx(tx: Tx, orgId: string, actorUserId: () => string | null): OrgTx {
  return {
    ...tx,
    orgId,
    audit: async (entry) => {
      await appendAuditEvent(tx, orgId, { ...entry, actorUserId: actorUserId() });
    },
  };
}

export function createOrgContext(
  sequelize: Sequelize,
  orgId: string,
  actor: { userId: string; roles: Role[] },
): OrgContext {
  const run = <T>(lock: boolean, fn: (tx: OrgTx) => Promise<T>) =>
    inTransaction(sequelize, { orgId }, async (tx) => {
      if (lock) await lockOrgChain(tx, orgId);
      return fn(toOrgTx(tx, orgId, () => actor.userId));
    });
  return {
    orgId,
    actor,
    ability: defineAbilityFor(actor),
    read: (fn) => run(false, fn),
    write: (fn) => run(true, fn),
  };
}

/**
 * The one tenant gate for `/api/orgs/:orgId/…`: loads the caller's membership and answers
 * 404 when there is none (or the id is malformed), so another organization's existence never
 * shows. Must follow requireUser.
 */
export function orgScope(sequelize: Sequelize): RequestHandler {
  return async (req, res, next) => {
    const user = signedInUser(res);
    const orgId = idSchema.safeParse(req.params.orgId);
    const roles = orgId.success
      ? await inTransaction(sequelize, 'system', (tx) => activeRolesIn(tx, orgId.data, user.id))
      : null;
    if (!orgId.success || !roles) throw new AppError('not-found', 'No such organization');
    res.locals.org = createOrgContext(sequelize, orgId.data, { userId: user.id, roles });
    next();
  };
}

export function orgContextOf(res: Response): OrgContext {
  const org = res.locals.org;
  if (!org) throw new Error('orgScope middleware did not run for this route');
  return org;
}

/** Route guard: 403 unless the rules let the caller do `action` on `subject` in this organization. */
export function authorize(action: Action, subject: SubjectName): RequestHandler {
  return (_req, res, next) => {
    if (!orgContextOf(res).ability.can(action, subject)) {
      throw new AppError('forbidden', 'Your roles in this organization do not allow this.');
    }
    next();
  };
}
