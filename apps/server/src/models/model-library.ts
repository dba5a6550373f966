import type { z } from 'zod';
import type {
  createModelRequestSchema,
  ModelLibraryEntry,
  modelListQuerySchema,
  updateModelRequestSchema,
} from '@biasproof/shared';
import { canonicalJson } from '@biasproof/shared';
import { AppError } from '../errors/app-error.ts';
import type { OrgContext, OrgTx } from '../orgs/org-scope.ts';
import type { ModelLibraryEntryRow } from '../db/models/model-library-entry.ts';
import {
  deleteEntry,
  findEntry,
  findEntryByName,
  insertEntry,
  listEntries,
  saveEntry,
  toEntry,
} from './repository.ts';

export const noSuchModel = () =>
  new AppError('not-found', 'No such model in this organization’s library');

export async function listModels(
  org: OrgContext,
  query: z.output<typeof modelListQuerySchema>,
): Promise<{ items: ModelLibraryEntry[]; total: number }> {
  return org.read((tx) => listEntries(tx, query));
}

async function lockedEntry(tx: OrgTx, id: string): Promise<ModelLibraryEntryRow> {
  const row = await findEntry(tx, id, { lock: true });
  if (!row) throw noSuchModel();
  return row;
}

export async function getModel(org: OrgContext, id: string): Promise<ModelLibraryEntry> {
  return org.read(async (tx) => {
    const row = await findEntry(tx, id);
    if (!row) throw noSuchModel();
    return toEntry(row);
  });
}

async function assertNameFree(tx: OrgTx, name: string, exceptId?: string): Promise<void> {
  const holder = await findEntryByName(tx, name);
  if (holder && holder.id !== exceptId) {
    throw new AppError('conflict', `The library already has a model named ${name}.`, {
      name: `The library already has a model named ${name} (names ignore case); choose another.`,
    });
  }
}

export async function createModel(
  org: OrgContext,
  input: z.output<typeof createModelRequestSchema>,
): Promise<ModelLibraryEntry> {
  return org.write(async (tx) => {
    await assertNameFree(tx, input.name);
    const row = await insertEntry(tx, { ...input, createdByUserId: org.actor.userId });
    await tx.audit({
      action: 'model.created',
      targetType: 'model',
      targetId: row.id,
      details: { name: row.name, kind: row.kind, params: row.params },
    });
    return toEntry(row);
  });
}

const fields = ['name', 'kind', 'params', 'ratings', 'notes'] as const;

/** Changes a library model; `params` and `ratings` replace the stored ones as a whole. */
export async function updateModel(
  org: OrgContext,
  id: string,
  input: z.output<typeof updateModelRequestSchema>,
): Promise<ModelLibraryEntry> {
  return org.write(async (tx) => {
    const row = await lockedEntry(tx, id);
    const changes: Record<string, unknown> = {};
    const before: Record<string, unknown> = {};
    for (const field of fields) {
      const value = input[field];
      if (value !== undefined && canonicalJson(value) !== canonicalJson(row[field])) {
        changes[field] = value;
        before[field] = row[field];
      }
    }
    if (Object.keys(changes).length === 0) return toEntry(row);
    if (input.name !== undefined && 'name' in changes) await assertNameFree(tx, input.name, id);
    await saveEntry(tx, row, changes);
    await tx.audit({
      action: 'model.updated',
      targetType: 'model',
      targetId: id,
      details: { name: row.name, before, after: changes },
    });
    return toEntry(row);
  });
}

/**
 * Removes a model from the library. Circuits carry their own copy of the models they use,
 * so saved worksheets and frozen revisions are unaffected.
 */
export async function deleteModel(org: OrgContext, id: string): Promise<void> {
  await org.write(async (tx) => {
    const row = await lockedEntry(tx, id);
    await deleteEntry(tx, row);
    await tx.audit({
      action: 'model.deleted',
      targetType: 'model',
      targetId: id,
      details: { name: row.name, kind: row.kind, params: row.params },
    });
  });
}
