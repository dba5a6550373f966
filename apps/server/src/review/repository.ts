import { QueryTypes } from 'sequelize';
import type { Finding } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';
import { findingValuesReader } from './finding-values.ts';

// Signatures live in their own file; other components still import them from here.
export { insertSignature, listSignatures, signatureMeanings } from './signature-repository.ts';

const select = <T extends object>(tx: OrgTx, sql: string, bind: unknown[]) =>
  tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT });

const iso = (d: Date | string) => new Date(d).toISOString();

type ReplyKind = Finding['replies'][number]['kind'];

interface FindingRecord {
  id: string;
  worksheet_id: string;
  /** The worksheet's current revision letter, against which carried findings are read. */
  current_revision: string;
  revision_letter: string;
  path: string;
  severity: Finding['severity'];
  text: string;
  status: Finding['status'];
  created_by_user_id: string;
  created_by_name: string;
  created_at: Date;
  updated_at: Date;
  replies: {
    id: string;
    kind: ReplyKind;
    text: string;
    by_id: string;
    by_name: string;
    at: string;
  }[];
}

const findingSelect = `
  SELECT f.id, f.worksheet_id, w.current_revision, f.revision_letter, f.path, f.severity, f.text,
         f.status, f.created_by_user_id, u.name AS created_by_name, f.created_at, f.updated_at,
         coalesce((SELECT json_agg(json_build_object('id', r.id, 'kind', r.kind, 'text', r.text,
                    'by_id', r.created_by_user_id, 'by_name', ru.name, 'at', r.created_at)
                    ORDER BY r.created_at, r.id)
                     FROM finding_replies r JOIN users ru ON ru.id = r.created_by_user_id
                    WHERE r.org_id = f.org_id AND r.finding_id = f.id), '[]') AS replies
    FROM findings f
    JOIN worksheets w ON w.org_id = f.org_id AND w.id = f.worksheet_id
    JOIN users u ON u.id = f.created_by_user_id`;

/** API findings of one worksheet's rows, with the numbers they pin (finding-values.ts). */
async function toFindings(tx: OrgTx, rows: FindingRecord[]): Promise<Finding[]> {
  const first = rows[0];
  if (!first) return [];
  const valuesOf = await findingValuesReader(
    tx,
    first.worksheet_id,
    first.current_revision,
    rows.map((r) => r.revision_letter),
  );
  return rows.map((r) => {
    const base = {
      id: r.id,
      worksheetId: r.worksheet_id,
      revision: r.revision_letter,
      path: r.path,
      severity: r.severity,
      text: r.text,
      status: r.status,
      createdBy: { id: r.created_by_user_id, name: r.created_by_name },
      createdAt: iso(r.created_at),
      updatedAt: iso(r.updated_at),
      replies: r.replies.map((x) => ({
        id: x.id,
        kind: x.kind,
        text: x.text,
        by: { id: x.by_id, name: x.by_name },
        at: iso(x.at),
      })),
    };
    return { ...base, ...valuesOf(base) };
  });
}

export async function listFindings(tx: OrgTx, worksheetId: string): Promise<Finding[]> {
  const rows = await select<FindingRecord>(
    tx,
    `${findingSelect} WHERE f.org_id = $1 AND f.worksheet_id = $2 ORDER BY f.created_at, f.id`,
    [tx.orgId, worksheetId],
  );
  return toFindings(tx, rows);
}

export async function readFinding(tx: OrgTx, id: string): Promise<Finding | null> {
  const rows = await select<FindingRecord>(
    tx,
    `${findingSelect} WHERE f.org_id = $1 AND f.id = $2`,
    [tx.orgId, id],
  );
  const [finding] = await toFindings(tx, rows);
  return finding ?? null;
}

/** A finding's own row, as the steps on it need it. */
export interface LockedFinding {
  id: string;
  worksheet_id: string;
  status: Finding['status'];
  severity: Finding['severity'];
  path: string;
  revision_letter: string;
  text: string;
  /** The checker who raised it. */
  created_by_user_id: string;
}

/** The finding's worksheet and status, locked for the rest of the transaction. */
export async function lockFinding(tx: OrgTx, id: string): Promise<LockedFinding | null> {
  const [row] = await select<LockedFinding>(
    tx,
    `SELECT id, worksheet_id, status, severity, path, revision_letter, text, created_by_user_id
       FROM findings WHERE org_id = $1 AND id = $2 FOR UPDATE`,
    [tx.orgId, id],
  );
  return row ?? null;
}

export async function insertFinding(
  tx: OrgTx,
  f: {
    worksheetId: string;
    revision: string;
    path: string;
    severity: string;
    text: string;
    userId: string;
  },
): Promise<string> {
  const [row] = await select<{ id: string }>(
    tx,
    `INSERT INTO findings (org_id, worksheet_id, revision_letter, path, severity, text, created_by_user_id)
     VALUES ($1, $2, $3, $4, $5, $6, $7) RETURNING id`,
    [tx.orgId, f.worksheetId, f.revision, f.path, f.severity, f.text, f.userId],
  );
  return row!.id;
}

export async function setFindingStatus(
  tx: OrgTx,
  id: string,
  status: Finding['status'],
  reply: { kind: Exclude<ReplyKind, 'reply'>; text: string; userId: string },
): Promise<void> {
  await select(
    tx,
    `UPDATE findings SET status = $3, updated_at = now() WHERE org_id = $1 AND id = $2 RETURNING id`,
    [tx.orgId, id, status],
  );
  await insertReply(tx, id, reply);
}

/** One entry of a finding's thread; returns its id. */
export async function insertReply(
  tx: OrgTx,
  findingId: string,
  reply: { kind: ReplyKind; text: string; userId: string },
): Promise<string> {
  const [row] = await select<{ id: string }>(
    tx,
    `INSERT INTO finding_replies (org_id, finding_id, kind, text, created_by_user_id)
     VALUES ($1, $2, $3, $4, $5) RETURNING id`,
    [tx.orgId, findingId, reply.kind, reply.text, reply.userId],
  );
  return row!.id;
}

export async function countOpenMajorFindings(tx: OrgTx, worksheetId: string): Promise<number> {
  const [row] = await select<{ n: string }>(
    tx,
    `SELECT count(*) AS n FROM findings
      WHERE org_id = $1 AND worksheet_id = $2 AND severity = 'major' AND status <> 'closed'`,
    [tx.orgId, worksheetId],
  );
  return Number(row?.n ?? 0);
}
