import { QueryTypes } from 'sequelize';
import type { WorksheetState } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';

const select = <T extends object>(tx: OrgTx, sql: string, bind: unknown[]) =>
  tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT });

/**
 * Freezes a revision at submission and records when. One statement: once frozen, the database
 * refuses any further change of the row but its state.
 */
export async function freezeRevision(tx: OrgTx, revisionId: string): Promise<void> {
  await select(
    tx,
    `UPDATE revisions SET frozen = true, submitted_at = now(), updated_at = now()
      WHERE org_id = $1 AND id = $2 AND NOT frozen RETURNING id`,
    [tx.orgId, revisionId],
  );
}

/** Signing `letter` supersedes every earlier signed revision of the worksheet; returns their letters. */
export async function supersedeEarlierRevisions(
  tx: OrgTx,
  worksheetId: string,
  letter: string,
): Promise<string[]> {
  const rows = await select<{ letter: string }>(
    tx,
    `UPDATE revisions SET state = 'superseded'
      WHERE org_id = $1 AND worksheet_id = $2 AND letter <> $3 AND state = 'signed_off'
      RETURNING letter`,
    [tx.orgId, worksheetId, letter],
  );
  return rows.map((r) => r.letter).sort();
}

export interface RevisionSummaryRecord {
  letter: string;
  state: WorksheetState;
  content_hash: string;
  frozen: boolean;
  engine_version: string;
  created_at: Date;
  created_by_user_id: string;
  created_by_name: string;
  submitted_at: Date | null;
  finding_count: string;
}

/** Every revision of a worksheet in letter order (A…Z, AA…), without its content. */
export async function listRevisionSummaries(
  tx: OrgTx,
  worksheetId: string,
): Promise<RevisionSummaryRecord[]> {
  return select<RevisionSummaryRecord>(
    tx,
    `SELECT r.letter, r.state, r.content_hash, r.frozen, r.engine_version, r.created_at,
            r.created_by_user_id, u.name AS created_by_name, r.submitted_at,
            (SELECT count(*) FROM findings f
              WHERE f.org_id = r.org_id AND f.worksheet_id = r.worksheet_id
                AND f.revision_letter = r.letter) AS finding_count
       FROM revisions r JOIN users u ON u.id = r.created_by_user_id
      WHERE r.org_id = $1 AND r.worksheet_id = $2
      ORDER BY length(r.letter), r.letter`,
    [tx.orgId, worksheetId],
  );
}
