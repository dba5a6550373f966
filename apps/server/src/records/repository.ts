import { QueryTypes } from 'sequelize';
import type { OrgTx } from '../orgs/org-scope.ts';

const select = <T extends object>(tx: OrgTx, sql: string, bind: unknown[]) =>
  tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT });

export interface RecordOrganization {
  id: string;
  name: string;
  timezone: string;
}

export async function readRecordOrganization(tx: OrgTx): Promise<RecordOrganization | null> {
  const org = await tx.models.Organization.findByPk(tx.orgId, { transaction: tx.transaction });
  return org ? { id: org.id, name: org.name, timezone: org.timezone } : null;
}

export interface RevisionListRow {
  letter: string;
  content_hash: string;
  frozen: boolean;
  engine_version: string;
  created_at: Date;
  created_by_user_id: string;
  created_by_name: string;
}

/** Every revision of a worksheet (without its content), in no particular order. */
export async function listRevisionRows(tx: OrgTx, worksheetId: string): Promise<RevisionListRow[]> {
  return select<RevisionListRow>(
    tx,
    `SELECT r.letter, r.content_hash, r.frozen, r.engine_version, r.created_at,
            r.created_by_user_id, u.name AS created_by_name
       FROM revisions r JOIN users u ON u.id = r.created_by_user_id
      WHERE r.org_id = $1 AND r.worksheet_id = $2`,
    [tx.orgId, worksheetId],
  );
}

export interface RecordAuditRow {
  seq: string;
  at: Date;
  actor_name: string | null;
  action: string;
  target_type: string;
  target_id: string | null;
  details: Record<string, unknown>;
}

/**
 * The audit events about one worksheet (the worksheet itself, or a finding, signature or
 * attachment of it, which name it in `details.worksheetId`), in chain order, up to `before`.
 * Downloads (of records, `record.*`, and of attachments, `*.downloaded`) are left out: they
 * read the record without changing it, and listing them would make each download's report
 * differ from the last.
 */
export async function listWorksheetAuditRows(
  tx: OrgTx,
  worksheetId: string,
  before: Date | null,
): Promise<RecordAuditRow[]> {
  return select<RecordAuditRow>(
    tx,
    `SELECT e.seq, e.at, u.name AS actor_name, e.action, e.target_type, e.target_id, e.details
       FROM audit_events e LEFT JOIN users u ON u.id = e.actor_user_id
      WHERE e.org_id = $1
        AND (e.target_id = $2 OR e.details ->> 'worksheetId' = $2)
        AND e.action NOT LIKE 'record.%' AND e.action NOT LIKE '%.downloaded'
        AND ($3::timestamptz IS NULL OR e.at < $3)
      ORDER BY e.seq`,
    [tx.orgId, worksheetId, before],
  );
}
