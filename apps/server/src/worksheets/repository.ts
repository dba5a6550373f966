import { QueryTypes } from 'sequelize';
import {
  worksheetStates,
  type EncodedResults,
  type WorksheetListItem,
  type WorksheetState,
} from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';
import type { WorksheetRow } from '../db/models/worksheet.ts';
import type { RevisionRow } from '../db/models/revision.ts';
import { likePattern, SqlFilter } from '../db/sql-filter.ts';
import type { ComputedRevision } from '../calc/compute.ts';

interface WorksheetRecord {
  id: string;
  title: string;
  description: string;
  state: WorksheetState;
  project_id: string;
  project_name: string;
  project_code: string;
  current_revision: string;
  version: number;
  author_user_id: string;
  author_name: string;
  checker_user_id: string | null;
  checker_name: string | null;
  approver_user_id: string | null;
  approver_name: string | null;
  result_status: WorksheetListItem['resultStatus'];
  created_at: Date;
  updated_at: Date;
}

const person = (id: string | null, name: string | null) => (id ? { id, name: name ?? '' } : null);

const toListItem = (r: WorksheetRecord): WorksheetListItem => ({
  id: r.id,
  title: r.title,
  description: r.description,
  state: r.state,
  projectId: r.project_id,
  projectName: r.project_name,
  projectCode: r.project_code,
  revision: r.current_revision,
  version: r.version,
  author: { id: r.author_user_id, name: r.author_name },
  checker: person(r.checker_user_id, r.checker_name),
  approver: person(r.approver_user_id, r.approver_name),
  resultStatus: r.result_status,
  createdAt: new Date(r.created_at).toISOString(),
  updatedAt: new Date(r.updated_at).toISOString(),
});

const worksheetFrom = `
    FROM worksheets w
    JOIN projects p ON p.org_id = w.org_id AND p.id = w.project_id
    JOIN revisions r ON r.org_id = w.org_id AND r.worksheet_id = w.id AND r.letter = w.current_revision
    JOIN users a ON a.id = w.author_user_id
    LEFT JOIN users c ON c.id = w.checker_user_id
    LEFT JOIN users ap ON ap.id = w.approver_user_id`;

const worksheetSelect = `
  SELECT w.id, w.title, w.description, w.state, w.project_id, p.name AS project_name,
         p.code AS project_code, w.current_revision, w.version, w.author_user_id, a.name AS author_name,
         w.checker_user_id, c.name AS checker_name, w.approver_user_id, ap.name AS approver_name,
         r.result_status, w.created_at, w.updated_at
  ${worksheetFrom}`;

export interface WorksheetListFilter {
  projectId?: string | undefined;
  state?: WorksheetState[] | undefined;
  authorId?: string | undefined;
  /** The person whose assignments `assignedToMe` means. */
  assignedTo?: string | undefined;
  q?: string | undefined;
  sort: 'title' | 'updatedAt' | 'state';
  dir?: 'asc' | 'desc' | undefined;
  limit: number;
  offset: number;
}

const sortColumns = {
  title: 'lower(w.title)',
  updatedAt: 'w.updated_at',
  // Workflow order, not alphabetical.
  state: `array_position(ARRAY[${worksheetStates.map((s) => `'${s}'`).join(',')}]::text[], w.state)`,
} as const;

/** One page of worksheets matching the filter, and how many match in all. */
export async function listWorksheets(
  tx: OrgTx,
  filter: WorksheetListFilter,
): Promise<{ items: WorksheetListItem[]; total: number }> {
  const where = new SqlFilter(tx.orgId, 'w.org_id');
  if (filter.projectId) where.add((p) => `w.project_id = ${p(filter.projectId)}`);
  if (filter.state?.length) {
    where.add((p) => `w.state = ANY (string_to_array(${p(filter.state?.join(','))}, ','))`);
  }
  if (filter.authorId) where.add((p) => `w.author_user_id = ${p(filter.authorId)}`);
  if (filter.assignedTo) {
    where.add((p) => {
      const me = p(filter.assignedTo);
      return `(w.checker_user_id = ${me} OR w.approver_user_id = ${me})`;
    });
  }
  if (filter.q) {
    const pattern = likePattern(filter.q);
    where.add((p) => {
      const q = p(pattern);
      return `(w.title ILIKE ${q} OR w.description ILIKE ${q})`;
    });
  }
  const [count] = await tx.sequelize.query<{ n: string }>(
    `SELECT count(*) AS n FROM worksheets w ${where.sql()}`,
    { bind: [...where.bind], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  const dir = filter.dir ?? (filter.sort === 'updatedAt' ? 'desc' : 'asc');
  // Ties (same state, same title) show the most recently changed first.
  const order = `${sortColumns[filter.sort]} ${dir === 'asc' ? 'ASC' : 'DESC'}, w.updated_at DESC, w.id`;
  const page = `LIMIT ${where.param(filter.limit)} OFFSET ${where.param(filter.offset)}`;
  const rows = await tx.sequelize.query<WorksheetRecord>(
    `${worksheetSelect} ${where.sql()} ORDER BY ${order} ${page}`,
    { bind: where.bind, transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return { items: rows.map(toListItem), total: Number(count?.n ?? 0) };
}

/**
 * List items under a fixed condition of the caller's (with bind parameters from `$2`; `$1` is
 * the organization), for views such as the review queue.
 */
export async function queryWorksheetItems(
  tx: OrgTx,
  q: { where: string; bind: unknown[]; orderBy: string; limit: number },
): Promise<WorksheetListItem[]> {
  const rows = await tx.sequelize.query<WorksheetRecord>(
    `${worksheetSelect} WHERE w.org_id = $1 AND (${q.where}) ORDER BY ${q.orderBy}, w.id
      LIMIT ${Math.trunc(q.limit)}`,
    { bind: [tx.orgId, ...q.bind], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return rows.map(toListItem);
}

export async function readWorksheetItem(tx: OrgTx, id: string): Promise<WorksheetListItem | null> {
  const [row] = await tx.sequelize.query<WorksheetRecord>(
    `${worksheetSelect} WHERE w.org_id = $1 AND w.id = $2`,
    { bind: [tx.orgId, id], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return row ? toListItem(row) : null;
}

export interface RevisionRecord {
  letter: string;
  circuit: unknown;
  settings: unknown;
  results: EncodedResults;
  engine_version: string;
  content_hash: string;
  frozen: boolean;
  /** The revision's own workflow state (migration 20261202-01). */
  state: WorksheetState;
  submitted_at: Date | null;
  created_at: Date;
  created_by_user_id: string;
  created_by_name: string;
}

export async function readRevision(
  tx: OrgTx,
  worksheetId: string,
  letter: string,
): Promise<RevisionRecord | null> {
  const [row] = await tx.sequelize.query<RevisionRecord>(
    `SELECT r.letter, r.circuit, r.settings, r.results, r.engine_version, r.content_hash, r.frozen,
            r.state, r.submitted_at, r.created_at, r.created_by_user_id, u.name AS created_by_name
       FROM revisions r JOIN users u ON u.id = r.created_by_user_id
      WHERE r.org_id = $1 AND r.worksheet_id = $2 AND r.letter = $3`,
    { bind: [tx.orgId, worksheetId, letter], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return row ?? null;
}

export async function findWorksheet(
  tx: OrgTx,
  id: string,
  options: { lock?: boolean } = {},
): Promise<WorksheetRow | null> {
  return tx.models.Worksheet.findOne({
    where: { id, orgId: tx.orgId },
    transaction: tx.transaction,
    lock: options.lock ?? false,
  });
}

/** The worksheet's current revision, locked for the rest of the transaction. */
export async function findCurrentRevisionForUpdate(
  tx: OrgTx,
  worksheet: WorksheetRow,
): Promise<RevisionRow | null> {
  return tx.models.Revision.findOne({
    where: { orgId: tx.orgId, worksheetId: worksheet.id, letter: worksheet.currentRevision },
    transaction: tx.transaction,
    lock: true,
  });
}

export async function insertWorksheet(
  tx: OrgTx,
  worksheet: { projectId: string; title: string; description: string; authorUserId: string },
): Promise<WorksheetRow> {
  return tx.models.Worksheet.create(
    { ...worksheet, orgId: tx.orgId },
    { transaction: tx.transaction },
  );
}

export async function insertRevision(
  tx: OrgTx,
  revision: { worksheetId: string; letter: string; createdByUserId: string } & ComputedRevision,
): Promise<RevisionRow> {
  return tx.models.Revision.create(
    { ...revision, orgId: tx.orgId },
    { transaction: tx.transaction },
  );
}

export async function saveWorksheet(
  tx: OrgTx,
  row: WorksheetRow,
  changes: Partial<
    Pick<WorksheetRow, 'title' | 'description' | 'checkerUserId' | 'approverUserId' | 'version'>
  >,
): Promise<void> {
  await row.update(changes, { transaction: tx.transaction });
}

/** Replaces a draft revision's content (the database refuses this for a frozen one). */
export async function saveRevisionContent(
  tx: OrgTx,
  row: RevisionRow,
  content: ComputedRevision,
): Promise<void> {
  await row.update(content, { transaction: tx.transaction });
}
