import { col, fn, Op, QueryTypes } from 'sequelize';
import type { ModelLibraryEntry } from '@biasproof/shared';
import type { OrgTx } from '../orgs/org-scope.ts';
import type {
  ModelLibraryEntryAttributes,
  ModelLibraryEntryRow,
} from '../db/models/model-library-entry.ts';
import { likePattern } from '../db/sql-filter.ts';

export const toEntry = (r: ModelLibraryEntryRow): ModelLibraryEntry => ({
  id: r.id,
  name: r.name,
  kind: r.kind,
  params: r.params,
  ratings: r.ratings,
  notes: r.notes,
  createdAt: new Date(r.createdAt).toISOString(),
  updatedAt: new Date(r.updatedAt).toISOString(),
});

export interface ModelListFilter {
  kind?: ModelLibraryEntry['kind'] | undefined;
  q?: string | undefined;
  limit: number;
  offset: number;
}

/** One page of the library by name (case-insensitive), and how many match in all. */
export async function listEntries(
  tx: OrgTx,
  filter: ModelListFilter,
): Promise<{ items: ModelLibraryEntry[]; total: number }> {
  const pattern = filter.q ? likePattern(filter.q) : undefined;
  const { rows, count } = await tx.models.ModelLibraryEntry.findAndCountAll({
    where: {
      orgId: tx.orgId,
      ...(filter.kind ? { kind: filter.kind } : {}),
      ...(pattern
        ? { [Op.or]: [{ name: { [Op.iLike]: pattern } }, { notes: { [Op.iLike]: pattern } }] }
        : {}),
    },
    order: [
      [fn('lower', col('name')), 'ASC'],
      ['id', 'ASC'],
    ],
    limit: filter.limit,
    offset: filter.offset,
    transaction: tx.transaction,
  });
  return { items: rows.map(toEntry), total: count };
}

export async function findEntry(
  tx: OrgTx,
  id: string,
  options: { lock?: boolean } = {},
): Promise<ModelLibraryEntryRow | null> {
  return tx.models.ModelLibraryEntry.findOne({
    where: { id, orgId: tx.orgId },
    transaction: tx.transaction,
    lock: options.lock ?? false,
  });
}

/** The entry whose name equals `name` regardless of case. */
export async function findEntryByName(tx: OrgTx, name: string): Promise<{ id: string } | null> {
  const [row] = await tx.sequelize.query<{ id: string }>(
    'SELECT id FROM model_library_entries WHERE org_id = $1 AND lower(name) = lower($2)',
    { bind: [tx.orgId, name], transaction: tx.transaction, type: QueryTypes.SELECT },
  );
  return row ?? null;
}

type EntryContent = Pick<
  ModelLibraryEntryAttributes,
  'name' | 'kind' | 'params' | 'ratings' | 'notes'
>;

export async function insertEntry(
  tx: OrgTx,
  entry: EntryContent & { createdByUserId: string },
): Promise<ModelLibraryEntryRow> {
  return tx.models.ModelLibraryEntry.create(
    { ...entry, orgId: tx.orgId },
    { transaction: tx.transaction },
  );
}

export async function saveEntry(
  tx: OrgTx,
  row: ModelLibraryEntryRow,
  changes: Partial<EntryContent>,
): Promise<void> {
  await row.update(changes, { transaction: tx.transaction });
}

export async function deleteEntry(tx: OrgTx, row: ModelLibraryEntryRow): Promise<void> {
  await tx.models.ModelLibraryEntry.destroy({
    where: { id: row.id, orgId: tx.orgId },
    transaction: tx.transaction,
  });
}
