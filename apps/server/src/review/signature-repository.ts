import { QueryTypes } from 'sequelize';
import { defaultSignatureMeanings, type Signature } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';

const select = <T extends object>(tx: OrgTx, sql: string, bind: unknown[]) =>
  tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT });

const iso = (d: Date | string) => new Date(d).toISOString();

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
