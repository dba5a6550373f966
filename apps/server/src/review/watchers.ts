import { QueryTypes } from 'sequelize';
import type { PersonRef, WatchersResponse } from '@biasproof/shared';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import { assertWorksheetExists } from './findings.ts';

/** Active members watching a worksheet, by name. */
export async function listWatchers(
  tx: OrgTx,
  worksheetId: string,
): Promise<(PersonRef & { email: string })[]> {
  return tx.sequelize.query<PersonRef & { email: string }>(
    `SELECT u.id, u.name, u.email FROM worksheet_watchers w JOIN users u ON u.id = w.user_id
      WHERE w.org_id = $1 AND w.worksheet_id = $2 AND NOT u.disabled
      ORDER BY u.name`,
    { bind: [tx.orgId, worksheetId], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
}

async function watchersOf(
  tx: OrgTx,
  worksheetId: string,
  userId: string,
): Promise<WatchersResponse> {
  const watchers = (await listWatchers(tx, worksheetId)).map(({ id, name }) => ({ id, name }));
  return { watching: watchers.some((w) => w.id === userId), watchers };
}

export async function getWatchers(org: OrgContext, worksheetId: string): Promise<WatchersResponse> {
  return org.read(async (tx) => {
    await assertWorksheetExists(tx, worksheetId);
    return watchersOf(tx, worksheetId, org.actor.userId);
  });
}

/** Starts or stops the signed-in member watching; audited only when something changed. */
export async function setWatching(
  org: OrgContext,
  worksheetId: string,
  watching: boolean,
): Promise<WatchersResponse> {
  return org.write(async (tx) => {
    await assertWorksheetExists(tx, worksheetId);
    const sql = watching
      ? `INSERT INTO worksheet_watchers (org_id, worksheet_id, user_id) VALUES ($1, $2, $3)
           ON CONFLICT DO NOTHING RETURNING user_id`
      : `DELETE FROM worksheet_watchers WHERE org_id = $1 AND worksheet_id = $2 AND user_id = $3
           RETURNING user_id`;
    const changed = await tx.sequelize.query(sql, {
      bind: [tx.orgId, worksheetId, org.actor.userId],
      transaction: tx.transaction,
      type: QueryTypes.SELECT,
    });
    if (changed.length > 0) {
      await tx.audit({
        action: watching ? 'worksheet.watch-started' : 'worksheet.watch-stopped',
        targetType: 'worksheet',
        targetId: worksheetId,
      });
    }
    return watchersOf(tx, worksheetId, org.actor.userId);
  });
}
