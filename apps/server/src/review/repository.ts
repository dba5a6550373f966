import { QueryTypes } from 'sequelize';
import { defaultSignatureMeanings, type Finding, type Signature } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';

const select = <T extends object>(tx: OrgTx, sql: string, bind: unknown[]) =>
  tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT });

const iso = (d: Date | string) => new Date(d).toISOString();

interface FindingRecord {
  id: string;
  worksheet_id: string;
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
    kind: 'answer' | 'close' | 'reopen';
    text: string;
    by_id: string;
    by_name: string;
    at: string;
  }[];
}

const findingSelect = `
  SELECT f.id, f.worksheet_id, f.revision_letter, f.path, f.severity, f.text, f.status,
         f.created_by_user_id, u.name AS created_by_name, f.created_at, f.updated_at,
         coalesce((SELECT json_agg(json_build_object('id', r.id, 'kind', r.kind, 'text', r.text,
                    'by_id', r.created_by_user_id, 'by_name', ru.name, 'at', r.created_at)
                    ORDER BY r.created_at, r.id)
                     FROM finding_replies r JOIN users ru ON ru.id = r.created_by_user_id
                    WHERE r.org_id = f.org_id AND r.finding_id = f.id), '[]') AS replies
    FROM findings f JOIN users u ON u.id = f.created_by_user_id`;

const toFinding = (r: FindingRecord): Finding => ({
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
});

export async function listFindings(tx: OrgTx, worksheetId: string): Promise<Finding[]> {
  const rows = await select<FindingRecord>(
    tx,
    `${findingSelect} WHERE f.org_id = $1 AND f.worksheet_id = $2 ORDER BY f.created_at, f.id`,
    [tx.orgId, worksheetId],
  );
  return rows.map(toFinding);
}

export async function readFinding(tx: OrgTx, id: string): Promise<Finding | null> {
  const [row] = await select<FindingRecord>(
    tx,
    `${findingSelect} WHERE f.org_id = $1 AND f.id = $2`,
    [tx.orgId, id],
  );
  return row ? toFinding(row) : null;
}

/** The finding's worksheet and status, locked for the rest of the transaction. */
export async function lockFinding(
  tx: OrgTx,
  id: string,
): Promise<{
  id: string;
  worksheet_id: string;
  status: Finding['status'];
  severity: Finding['severity'];
  path: string;
  revision_letter: string;
} | null> {
  const [row] = await select<{
    id: string;
    worksheet_id: string;
    status: Finding['status'];
    severity: Finding['severity'];
    path: string;
    revision_letter: string;
  }>(
    tx,
    `SELECT id, worksheet_id, status, severity, path, revision_letter FROM findings
      WHERE org_id = $1 AND id = $2 FOR UPDATE`,
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
  reply: { kind: 'answer' | 'close' | 'reopen'; text: string; userId: string },
): Promise<void> {
  await select(
    tx,
    `UPDATE findings SET status = $3, updated_at = now() WHERE org_id = $1 AND id = $2 RETURNING id`,
    [tx.orgId, id, status],
  );
  await select(
    tx,
    `INSERT INTO finding_replies (org_id, finding_id, kind, text, created_by_user_id)
     VALUES ($1, $2, $3, $4, $5) RETURNING id`,
    [tx.orgId, id, reply.kind, reply.text, reply.userId],
  );
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

/** The meanings this organization's signatures may carry (organization settings, else the defaults). */
export async function signatureMeanings(tx: OrgTx): Promise<string[]> {
  const org = await tx.models.Organization.findByPk(tx.orgId, { transaction: tx.transaction });
  const listed: unknown = org?.settings.signatureMeanings;
  const valid = (v: unknown): v is string[] =>
    Array.isArray(v) && v.length > 0 && v.every((m) => typeof m === 'string');
  return valid(listed) ? listed : [...defaultSignatureMeanings];
}

interface SignatureRecord {
  id: string;
  revision_letter: string;
  user_id: string;
  user_name: string;
  printed_name: string;
  meaning: string;
  content_hash: string;
  signed_at: Date;
  superseded_at: Date | null;
}

export async function listSignatures(tx: OrgTx, worksheetId: string): Promise<Signature[]> {
  const rows = await select<SignatureRecord>(
    tx,
    `SELECT s.id, s.revision_letter, s.user_id, u.name AS user_name, s.printed_name, s.meaning,
            s.content_hash, s.signed_at, s.superseded_at
       FROM signatures s JOIN users u ON u.id = s.user_id
      WHERE s.org_id = $1 AND s.worksheet_id = $2 ORDER BY s.signed_at, s.id`,
    [tx.orgId, worksheetId],
  );
  return rows.map((r) => ({
    id: r.id,
    revision: r.revision_letter,
    signer: { id: r.user_id, name: r.user_name },
    printedName: r.printed_name,
    meaning: r.meaning,
    contentHash: r.content_hash,
    signedAt: iso(r.signed_at),
    supersededAt: r.superseded_at ? iso(r.superseded_at) : null,
  }));
}

/** Stores a signature and marks the worksheet's earlier signatures superseded; returns the new id. */
export async function insertSignature(
  tx: OrgTx,
  s: {
    worksheetId: string;
    revision: string;
    userId: string;
    printedName: string;
    meaning: string;
    contentHash: string;
    signedAt: Date;
  },
): Promise<{ id: string; superseded: string[] }> {
  const superseded = await select<{ revision_letter: string }>(
    tx,
    `UPDATE signatures SET superseded_at = $3
      WHERE org_id = $1 AND worksheet_id = $2 AND superseded_at IS NULL RETURNING revision_letter`,
    [tx.orgId, s.worksheetId, s.signedAt],
  );
  const [row] = await select<{ id: string }>(
    tx,
    `INSERT INTO signatures (org_id, worksheet_id, revision_letter, user_id, printed_name, meaning, content_hash, signed_at)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8) RETURNING id`,
    [
      tx.orgId,
      s.worksheetId,
      s.revision,
      s.userId,
      s.printedName,
      s.meaning,
      s.contentHash,
      s.signedAt,
    ],
  );
  return { id: row!.id, superseded: superseded.map((r) => r.revision_letter) };
}
