import { QueryTypes } from 'sequelize';
import type { Project } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';
import type { ProjectRow } from '../db/models/project.ts';
import { likePattern, SqlFilter } from '../db/sql-filter.ts';

interface ProjectRecord {
  id: string;
  name: string;
  code: string;
  description: string;
  archived: boolean;
  worksheet_count: string;
  created_at: Date;
  updated_at: Date;
}

const toProject = (r: ProjectRecord): Project => ({
  id: r.id,
  name: r.name,
  code: r.code,
  description: r.description,
  archived: r.archived,
  worksheetCount: Number(r.worksheet_count),
  createdAt: new Date(r.created_at).toISOString(),
  updatedAt: new Date(r.updated_at).toISOString(),
});

const projectSelect = `
  SELECT p.id, p.name, p.code, p.description, p.archived, p.created_at, p.updated_at,
         (SELECT count(*) FROM worksheets w WHERE w.org_id = p.org_id AND w.project_id = p.id) AS worksheet_count
    FROM projects p`;

export interface ProjectListFilter {
  archived: 'true' | 'false' | 'all';
  q?: string | undefined;
  limit: number;
  offset: number;
}

/** One page of the organization's projects by name, and how many match in all. */
export async function listProjects(
  tx: OrgTx,
  filter: ProjectListFilter,
): Promise<{ items: Project[]; total: number }> {
  const where = new SqlFilter(tx.orgId, 'p.org_id');
  if (filter.archived !== 'all') where.add((p) => `p.archived = ${p(filter.archived === 'true')}`);
  if (filter.q) {
    const pattern = likePattern(filter.q);
    where.add((p) => {
      const q = p(pattern);
      return `(p.name ILIKE ${q} OR p.code ILIKE ${q} OR p.description ILIKE ${q})`;
    });
  }
  const [count] = await tx.sequelize.query<{ n: string }>(
    `SELECT count(*) AS n FROM projects p ${where.sql()}`,
    { bind: [...where.bind], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  const page = `LIMIT ${where.param(filter.limit)} OFFSET ${where.param(filter.offset)}`;
  const rows = await tx.sequelize.query<ProjectRecord>(
    `${projectSelect} ${where.sql()} ORDER BY lower(p.name), p.code ${page}`,
    { bind: where.bind, transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return { items: rows.map(toProject), total: Number(count?.n ?? 0) };
}

export async function readProject(tx: OrgTx, id: string): Promise<Project | null> {
  const [row] = await tx.sequelize.query<ProjectRecord>(
    `${projectSelect} WHERE p.org_id = $1 AND p.id = $2`,
    { bind: [tx.orgId, id], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return row ? toProject(row) : null;
}

export async function findProject(
  tx: OrgTx,
  id: string,
  options: { lock?: boolean } = {},
): Promise<ProjectRow | null> {
  return tx.models.Project.findOne({
    where: { id, orgId: tx.orgId },
    transaction: tx.transaction,
    lock: options.lock ?? false,
  });
}

export async function findProjectByCode(tx: OrgTx, code: string): Promise<ProjectRow | null> {
  return tx.models.Project.findOne({
    where: { code, orgId: tx.orgId },
    transaction: tx.transaction,
  });
}

export async function insertProject(
  tx: OrgTx,
  project: { name: string; code: string; description: string; createdByUserId: string },
): Promise<ProjectRow> {
  return tx.models.Project.create({ ...project, orgId: tx.orgId }, { transaction: tx.transaction });
}

export async function saveProject(
  tx: OrgTx,
  row: ProjectRow,
  changes: Partial<Pick<ProjectRow, 'name' | 'code' | 'description' | 'archived'>>,
): Promise<void> {
  await row.update(changes, { transaction: tx.transaction });
}
