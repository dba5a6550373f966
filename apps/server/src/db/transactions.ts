import type { Sequelize, Transaction } from 'sequelize';
import { modelsFor, type Models } from './models/index.ts';

/** One database transaction and the models to query in it. Repositories take this, never a bare pool. */
export interface Tx {
  sequelize: Sequelize;
  transaction: Transaction;
  models: Models;
}

/**
 * Which tenant rows the transaction may see: one organization, or `system` for the few
 * paths that work across organizations by nature (sign-in, the caller's own memberships, an
 * invitation looked up by its token, provisioning). PostgreSQL's row-level security policies
 * read this setting, so a query that forgot its organization filter still sees only its own
 * organization's rows, and a query outside any scoped transaction sees none.
 */
export type TenantScope = { orgId: string } | 'system';

const SYSTEM_SCOPE = '*';

export async function inTransaction<T>(
  sequelize: Sequelize,
  scope: TenantScope,
  fn: (tx: Tx) => Promise<T>,
): Promise<T> {
  return sequelize.transaction(async (transaction) => {
    await sequelize.query("SELECT set_config('biasproof.org_id', $1, true)", {
      bind: [scope === 'system' ? SYSTEM_SCOPE : scope.orgId],
      transaction,
    });
    return fn({ sequelize, transaction, models: modelsFor(sequelize) });
  });
}
