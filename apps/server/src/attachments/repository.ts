import { QueryTypes } from 'sequelize';
import type { Attachment, AttachmentType } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';

const select = <T extends object>(tx: OrgTx, sql: string, bind: unknown[]) =>
  tx.sequelize.query<T>(sql, { bind, transaction: tx.transaction, type: QueryTypes.SELECT });

interface AttachmentRecord {
  id: string;
  worksheet_id: string;
  finding_id: string | null;
  revision_letter: string;
  filename: string;
  type: AttachmentType;
  content_type: string;
  size: number;
  sha256: string;
  uploaded_by_user_id: string;
  uploaded_by_name: string;
  uploaded_at: Date;
}

// Never the content: lists and metadata stay small however large the files are.
const metadataColumns = `
  a.id, a.worksheet_id, a.finding_id, a.revision_letter, a.filename, a.type, a.content_type,
  a.size, a.sha256, a.uploaded_by_user_id, u.name AS uploaded_by_name, a.uploaded_at`;
const fromAttachments = 'FROM attachments a JOIN users u ON u.id = a.uploaded_by_user_id';
const metadataSelect = `SELECT ${metadataColumns} ${fromAttachments}`;

const toAttachment = (r: AttachmentRecord): Attachment => ({
  id: r.id,
  worksheetId: r.worksheet_id,
  findingId: r.finding_id,
  revision: r.revision_letter,
  filename: r.filename,
  type: r.type,
  contentType: r.content_type,
  size: r.size,
  sha256: r.sha256,
  uploadedBy: { id: r.uploaded_by_user_id, name: r.uploaded_by_name },
  uploadedAt: new Date(r.uploaded_at).toISOString(),
});

export interface NewAttachment {
  worksheetId: string;
  findingId: string | null;
  revision: string;
  filename: string;
  type: AttachmentType;
  contentType: string;
  sha256: string;
  content: Buffer;
  userId: string;
}

export async function insertAttachment(tx: OrgTx, a: NewAttachment): Promise<string> {
  const [row] = await select<{ id: string }>(
    tx,
    `INSERT INTO attachments (org_id, worksheet_id, finding_id, revision_letter, filename, type,
                              content_type, size, sha256, content, uploaded_by_user_id)
     VALUES ($1, $2, $3, $4, $5, $6, $7, $8, $9, $10, $11) RETURNING id`,
    [
      tx.orgId,
      a.worksheetId,
      a.findingId,
      a.revision,
      a.filename,
      a.type,
      a.contentType,
      a.content.length,
      a.sha256,
      a.content,
      a.userId,
    ],
  );
  return row!.id;
}

/** A worksheet's attachments (only one finding's when `findingId` is given), newest first. */
export async function listAttachments(
  tx: OrgTx,
  worksheetId: string,
  findingId?: string,
): Promise<Attachment[]> {
  const rows = await select<AttachmentRecord>(
    tx,
    `${metadataSelect}
      WHERE a.org_id = $1 AND a.worksheet_id = $2 AND ($3::uuid IS NULL OR a.finding_id = $3)
      ORDER BY a.uploaded_at DESC, a.id DESC`,
    [tx.orgId, worksheetId, findingId ?? null],
  );
  return rows.map(toAttachment);
}

export async function readAttachment(
  tx: OrgTx,
  id: string,
  options: { lock?: boolean } = {},
): Promise<Attachment | null> {
  const [row] = await select<AttachmentRecord>(
    tx,
    `${metadataSelect} WHERE a.org_id = $1 AND a.id = $2${options.lock ? ' FOR UPDATE OF a' : ''}`,
    [tx.orgId, id],
  );
  return row ? toAttachment(row) : null;
}

export async function readAttachmentContent(tx: OrgTx, id: string): Promise<Buffer | null> {
  const [row] = await select<{ content: Buffer }>(
    tx,
    'SELECT content FROM attachments WHERE org_id = $1 AND id = $2',
    [tx.orgId, id],
  );
  return row?.content ?? null;
}

export async function deleteAttachment(tx: OrgTx, id: string): Promise<void> {
  await select(tx, 'DELETE FROM attachments WHERE org_id = $1 AND id = $2 RETURNING id', [
    tx.orgId,
    id,
  ]);
}

/**
 * Every attachment of one revision of a worksheet with its bytes, oldest first (for the record
 * package). Holds the whole content in memory: each file is at most 20 MB.
 */
export async function listAttachmentsForRevision(
  tx: OrgTx,
  worksheetId: string,
  letter: string,
): Promise<(Attachment & { content: Buffer })[]> {
  const rows = await select<AttachmentRecord & { content: Buffer }>(
    tx,
    `SELECT ${metadataColumns}, a.content ${fromAttachments}
      WHERE a.org_id = $1 AND a.worksheet_id = $2 AND a.revision_letter = $3
      ORDER BY a.uploaded_at, a.id`,
    [tx.orgId, worksheetId, letter],
  );
  return rows.map((r) => ({ ...toAttachment(r), content: r.content }));
}

/** The worksheet a finding is on, or null when the organization has no such finding. */
export async function findingWorksheetId(tx: OrgTx, findingId: string): Promise<string | null> {
  const [row] = await select<{ worksheet_id: string }>(
    tx,
    'SELECT worksheet_id FROM findings WHERE org_id = $1 AND id = $2',
    [tx.orgId, findingId],
  );
  return row?.worksheet_id ?? null;
}
