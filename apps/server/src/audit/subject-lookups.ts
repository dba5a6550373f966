import { QueryTypes } from 'sequelize';
import type { Tx } from '../db/transactions.ts';

/** What an event's summary names: a worksheet (with its project), a project, a person. */
export async function findWorksheetContext(
  tx: Tx,
  worksheetId: string,
): Promise<{ title: string; projectId: string } | null> {
  const [row] = await tx.sequelize.query<{ title: string; project_id: string }>(
    'SELECT title, project_id FROM worksheets WHERE id = $1',
    { bind: [worksheetId], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return row ? { title: row.title, projectId: row.project_id } : null;
}

export async function findProjectLabel(tx: Tx, projectId: string): Promise<string | null> {
  const [row] = await tx.sequelize.query<{ code: string; name: string }>(
    'SELECT code, name FROM projects WHERE id = $1',
    { bind: [projectId], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return row ? `${row.code} "${row.name}"` : null;
}

export async function findPersonName(tx: Tx, userId: string): Promise<string | null> {
  const [row] = await tx.sequelize.query<{ name: string }>('SELECT name FROM users WHERE id = $1', {
    bind: [userId],
    transaction: tx.transaction,
    type: QueryTypes.SELECT,
  });
  return row?.name ?? null;
}
